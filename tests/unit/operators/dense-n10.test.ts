/**
 * Dense diagonalisation at the size limit, n = 10 (1024×1024 real symmetric, ml-matrix), against
 * Pfeuty's closed form for the periodic transverse-field Ising chain (Pfeuty, "The one-dimensional
 * Ising model with a transverse field", Ann. Phys. 57, 79 (1970)).
 */
import { groundEnergyDense } from '../../../shared/engine/linalg/dense';
import { pfeutyGroundEnergy, tfimChain } from './tfim';

test('n = 10 chain, J = 1, h = 0.7: dense equals the closed form to 1e-8', () => {
  expect(Math.abs(groundEnergyDense(tfimChain(10, 1, 0.7)) - pfeutyGroundEnergy(10, 1, 0.7))).toBeLessThan(1e-8);
}, 60000);
