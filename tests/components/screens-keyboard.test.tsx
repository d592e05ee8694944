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
