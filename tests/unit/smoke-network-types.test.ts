import { senseOf } from '../../shared/engine/problem/types';
test('max-cut maximises, partitioning minimises (definition of the problems)', () => {
  expect(senseOf('maxcut')).toBe('max');
  expect(senseOf('bisection')).toBe('min');
});
