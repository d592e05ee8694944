import { parameterNames } from '../../components/runs/format';

// QAOA convention used everywhere (shared/engine/ansatz/qaoa.ts): parameters are
// [γ₁ … γ_p, β₁ … β_p], layer ℓ applying e^{−iγℓ C} then e^{−iβℓ B} (Farhi, Goldstone, Gutmann 2014).
describe('parameterNames', () => {
  test('QAOA with p = 2 names cost angles γ and mixer angles β per layer', () => {
    expect(parameterNames('qaoa', 4)).toEqual(['γ1', 'γ2', 'β1', 'β2']);
  });
  test('other circuits name rotation angles θ from 0', () => {
    expect(parameterNames('vqe', 3)).toEqual(['θ0', 'θ1', 'θ2']);
  });
});
