import { fireEvent, render, screen } from '@testing-library/react';
import { DepotsTable } from '../../components/networks/DepotsTable';
import { LanesTable } from '../../components/networks/LanesTable';
import { SummaryBar } from '../../components/networks/SummaryBar';
import { summariseNetwork } from '../../shared/networks/summary';

/** A 4-cycle A–B–C–D–A with a chord A–C (degrees 3, 2, 3, 2: textbook, common practice). */
const depots = [{ id: 'A', name: 'Alder Yard', lat: 47.1, lon: -31 }, { id: 'B', weight: 4 }, { id: 'C' }, { id: 'D' }];
const lanes = [
  { from: 'A', to: 'B', weight: 10 },
  { from: 'B', to: 'C', weight: 12.5 },
  { from: 'C', to: 'D', weight: 7 },
  { from: 'D', to: 'A', weight: 3 },
  { from: 'A', to: 'C', weight: 1 },
];

describe('LanesTable', () => {
  test('renders one row per lane with its ends and volume', () => {
    render(<LanesTable lanes={lanes} selected={new Set()} onSelect={() => {}} onWeightChange={() => {}} />);
    // Each row is named by exactly what it shows (WCAG 2.5.3 Label in Name): from, then to.
    const rows = lanes.map((_, i) => screen.getByTestId(`lane-row-${i}`).querySelector('[role="button"]')!);
    expect(rows.map((b) => b.getAttribute('aria-label'))).toEqual(['A B', 'B C', 'C D', 'D A', 'A C']);
    rows.forEach((b) => expect(b.getAttribute('aria-label')!.replace(/\s/g, '')).toBe(b.textContent));
    expect((screen.getByLabelText('Volume of lane B–C') as HTMLInputElement).value).toBe('12.5');
  });

  test.each([
    ['-3', /volume must be ≥ 0: freight volumes cannot be negative/],
    ['ten', /"ten" is not a number; write a volume such as 12.5/],
    ['3,5', /decimal comma; write 3\.5/],
    ['', /is not a number/],
  ])('inline edit "%s" is refused with a message beside the cell', (typed, message) => {
    const onWeightChange = jest.fn();
    render(<LanesTable lanes={lanes} selected={new Set()} onSelect={() => {}} onWeightChange={onWeightChange} />);
    const input = screen.getByLabelText('Volume of lane C–D');
    fireEvent.change(input, { target: { value: typed } });
    fireEvent.blur(input);
    expect(screen.getByTestId('lane-volume-error-2').textContent).toMatch(message);
    expect(input.getAttribute('aria-invalid')).toBe('true');
    expect(onWeightChange).not.toHaveBeenCalled();
  });

  test('a valid edit reports the lane index and the number; typing again clears the error', () => {
    const onWeightChange = jest.fn();
    render(<LanesTable lanes={lanes} selected={new Set()} onSelect={() => {}} onWeightChange={onWeightChange} />);
    const input = screen.getByLabelText('Volume of lane D–A');
    fireEvent.change(input, { target: { value: '-1' } });
    fireEvent.blur(input);
    expect(screen.queryByTestId('lane-volume-error-3')).not.toBeNull();
    fireEvent.change(input, { target: { value: '8.25' } });
    expect(screen.queryByTestId('lane-volume-error-3')).toBeNull();
    fireEvent.blur(input);
    expect(onWeightChange).toHaveBeenCalledWith(3, 8.25);
  });

  test('read-only tables show volumes as text, with no inputs', () => {
    render(<LanesTable lanes={lanes} selected={new Set()} onSelect={() => {}} onWeightChange={() => {}} readOnly />);
    expect(screen.queryByLabelText('Volume of lane A–B')).toBeNull();
    expect(screen.getByTestId('lane-row-1').textContent).toContain('12.5');
  });

  test('selection: a press selects, selected rows are marked pressed (drawing selections show here)', () => {
    const onSelect = jest.fn();
    render(<LanesTable lanes={lanes} selected={new Set([4])} onSelect={onSelect} onWeightChange={() => {}} />);
    expect(screen.getByRole('button', { name: 'A C' }).getAttribute('aria-pressed')).toBe('true');
    expect(screen.getByRole('button', { name: 'A B' }).getAttribute('aria-pressed')).toBe('false');
    fireEvent.click(screen.getByRole('button', { name: 'C D' }));
    expect(onSelect).toHaveBeenCalledWith(2);
  });

  test('long tables show 100 rows and grow to include a row selected elsewhere', () => {
    const many = Array.from({ length: 130 }, (_, i) => ({ from: `d${i}`, to: `d${i + 1}`, weight: i }));
    const { rerender } = render(<LanesTable lanes={many} selected={new Set()} onSelect={() => {}} onWeightChange={() => {}} />);
    expect(screen.getAllByRole('button', { name: /^d\d+ d\d+$/ })).toHaveLength(100);
    rerender(<LanesTable lanes={many} selected={new Set([120])} onSelect={() => {}} onWeightChange={() => {}} />);
    expect(screen.getByRole('button', { name: 'd120 d121' }).getAttribute('aria-pressed')).toBe('true');
  });
});

describe('DepotsTable', () => {
  test('rows with name, weight (default 1) and lane count; wide screens add coordinates', () => {
    render(<DepotsTable depots={depots} lanes={lanes} selected={new Set([1])} onSelect={() => {}} wide />);
    expect(screen.getByTestId('depot-row-A').textContent).toBe('AAlder Yard47.1-3113');
    expect(screen.getByTestId('depot-row-B').textContent).toBe('B———42');
    // The row's name is its visible text (axe label-content-name-mismatch), starting with the id.
    expect(screen.getByRole('button', { name: /^B\b/ }).getAttribute('aria-pressed')).toBe('true');
  });

  test('phone layout keeps name, weight and lanes; a press selects the depot', () => {
    const onSelect = jest.fn();
    render(<DepotsTable depots={depots} lanes={lanes} selected={new Set()} onSelect={onSelect} wide={false} />);
    expect(screen.getByTestId('depot-row-C').textContent).toBe('C13');
    fireEvent.click(screen.getByRole('button', { name: /Alder Yard/ }));
    expect(onSelect).toHaveBeenCalledWith(0);
  });
});

describe('SummaryBar', () => {
  test('depots, lanes, total volume, components and degree range of the network', () => {
    render(<SummaryBar summary={summariseNetwork({ depots, lanes })} />);
    expect(screen.getByTestId('summary-depots').textContent).toBe('4');
    expect(screen.getByTestId('summary-lanes').textContent).toBe('5');
    expect(screen.getByTestId('summary-total-volume').textContent).toBe('33.5');
    expect(screen.getByTestId('summary-components').textContent).toBe('1');
    expect(screen.getByTestId('summary-degree').textContent).toBe('2–3');
  });

  test('one line on phones wraps only between items, with the separator ending the line', () => {
    render(<SummaryBar summary={summariseNetwork({ depots, lanes })} compact />);
    const text = screen.getByTestId('network-summary').textContent ?? '';
    // Browsers break lines at ordinary spaces only (UAX #14: no break at U+00A0).
    const pieces = text.split(' ');
    expect(pieces).toEqual(['Depots\u00a04\u00a0·', 'Lanes\u00a05\u00a0·', 'Total\u00a0volume\u00a033.5\u00a0·', 'Components\u00a01\u00a0·', 'Degree\u00a02–3']);
  });

  test('a network in separate parts says so (two components: textbook union of disjoint graphs)', () => {
    render(<SummaryBar summary={summariseNetwork({ depots: [{ id: 'a' }, { id: 'b' }, { id: 'c' }, { id: 'd' }], lanes: [{ from: 'a', to: 'b', weight: 1 }, { from: 'c', to: 'd', weight: 1 }] })} />);
    expect(screen.getByTestId('summary-components').textContent).toBe('2');
    expect(screen.getByLabelText(/2 separate parts: depots in different parts share no lanes/)).toBeTruthy();
  });
});
