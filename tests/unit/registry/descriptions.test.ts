/** Solver descriptions are read by dispatchers in run setup: words and numbers, no settings names as placeholders. */
import { listSolvers } from '../../../shared/engine/solvers/registry';

test('no solver description shows a settings name as a placeholder', () => {
  const offenders = listSolvers().filter((s) => /\b(blockSize|maxQubits|timeLimitSeconds|readoutShots)\b|\bat most [a-z]+[A-Z]\w* /.test(s.guarantee));
  expect(offenders.map((s) => `${s.name}: ${s.guarantee}`)).toEqual([]);
});
