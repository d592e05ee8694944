import { useState } from 'react';
import { fireEvent, render, screen } from '@testing-library/react';
import { CheckRow, ChoiceCard, ChoiceGroup, Segmented } from '../../components/runs/controls';

/**
 * Keyboard per the WAI-ARIA Authoring Practices Guide (W3C, APG: Checkbox pattern — Space
 * toggles; Radio Group pattern — arrow keys move focus and choice, wrapping, and only the chosen
 * radio is in the Tab order).
 */
test('checkbox: Space toggles it', () => {
  const toggle = jest.fn();
  render(<CheckRow title="Tabu search" checked={false} onPress={toggle} />);
  fireEvent.keyDown(screen.getByRole('checkbox', { name: 'Tabu search' }), { key: ' ' });
  expect(toggle).toHaveBeenCalledTimes(1);
});

test('a disabled checkbox ignores Space', () => {
  const toggle = jest.fn();
  render(<CheckRow title="Exact" checked={false} disabled onPress={toggle} />);
  fireEvent.keyDown(screen.getByRole('checkbox', { name: 'Exact' }), { key: ' ' });
  expect(toggle).not.toHaveBeenCalled();
});

function Question() {
  const [kind, setKind] = useState('maxcut');
  return (
    <ChoiceGroup label="Question">
      {['maxcut', 'bisection', 'kway'].map((k) => (
        <ChoiceCard key={k} title={k} selected={kind === k} onPress={() => setKind(k)} />
      ))}
    </ChoiceGroup>
  );
}

test('radio group: arrows move the choice and the focus, wrapping; only the chosen radio is tabbable', () => {
  render(<Question />);
  const radio = (name: string) => screen.getByRole('radio', { name });
  expect(radio('maxcut').getAttribute('tabindex')).toBe('0');
  expect(radio('bisection').getAttribute('tabindex')).toBe('-1');
  fireEvent.keyDown(radio('maxcut'), { key: 'ArrowDown' });
  expect(radio('bisection').getAttribute('aria-checked')).toBe('true');
  expect(document.activeElement).toBe(radio('bisection'));
  expect(radio('bisection').getAttribute('tabindex')).toBe('0');
  fireEvent.keyDown(radio('bisection'), { key: 'ArrowRight' });
  fireEvent.keyDown(radio('kway'), { key: 'ArrowDown' });
  expect(radio('maxcut').getAttribute('aria-checked')).toBe('true'); // wrapped
  fireEvent.keyDown(radio('maxcut'), { key: 'ArrowUp' });
  expect(radio('kway').getAttribute('aria-checked')).toBe('true');
});

function K() {
  const [k, setK] = useState(3);
  return <Segmented label="Regions" options={[3, 4, 5] as const} value={k as 3} onChange={(v) => setK(v)} />;
}

test('segmented choice: arrow keys too', () => {
  render(<K />);
  fireEvent.keyDown(screen.getByRole('radio', { name: 'Regions: 3' }), { key: 'ArrowLeft' });
  expect(screen.getByRole('radio', { name: 'Regions: 5' }).getAttribute('aria-checked')).toBe('true');
  expect(document.activeElement).toBe(screen.getByRole('radio', { name: 'Regions: 5' }));
});

test('pins from the keyboard: find a depot in the list beside the drawing, arrow keys choose its side', () => {
  // eslint-disable-next-line @typescript-eslint/no-require-imports
  const { PinPicker } = require('../../components/runs/PinPicker') as typeof import('../../components/runs/PinPicker');
  const document = { depots: [{ id: 'H1', name: 'Harrowfen Yard' }, { id: 'O2', name: 'Ossel Bridge' }, { id: 'T3', name: 'Tarnwyth Hub' }], lanes: [{ from: 'H1', to: 'O2', weight: 3 }] };
  function Pins() {
    const [pins, setPins] = useState<Record<string, number>>({});
    return <PinPicker document={document} kind="maxcut" parts={2} pins={pins} onChange={setPins} />;
  }
  render(<Pins />);
  fireEvent.change(screen.getByLabelText('Find a depot to pin'), { target: { value: 'ossel' } });
  expect(screen.queryByRole('radio', { name: 'Harrowfen Yard (H1): Free' })).toBeNull();
  const free = screen.getByRole('radio', { name: 'Ossel Bridge (O2): Free' });
  expect(free.getAttribute('aria-checked')).toBe('true');
  fireEvent.keyDown(free, { key: 'ArrowRight' });
  expect(screen.getByRole('radio', { name: 'Ossel Bridge (O2): Side 0' }).getAttribute('aria-checked')).toBe('true');
  expect(screen.getByTestId('pin-O2').textContent).toContain('Ossel Bridge → Side 0');
  fireEvent.keyDown(screen.getByRole('radio', { name: 'Ossel Bridge (O2): Side 0' }), { key: 'ArrowRight' });
  expect(screen.getByTestId('pin-O2').textContent).toContain('Side 1');
});
