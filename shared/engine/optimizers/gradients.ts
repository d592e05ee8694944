import { asEstimate, type Objective } from './types';

/**
 * Parameter-shift gradient: for a parameter that enters ONE gate e^{−iθP/2} (P a Pauli string,
 * e.g. RX/RY/RZ), ∂⟨H⟩/∂θ = [⟨H⟩(θ + π/2) − ⟨H⟩(θ − π/2)]/2 exactly (common practice; Mitarai
 * et al., Phys. Rev. A 98, 032309 (2018); Schuld et al., Phys. Rev. A 99, 032331 (2019)).
 * Not valid for QAOA's γ on a weighted cost operator (many eigenvalue gaps): use finite
 * differences there.
 */
export function parameterShiftGradient(f: Objective): (x: Float64Array) => Float64Array {
  return (x) => {
    const g = new Float64Array(x.length);
    const y = x.slice();
    for (let j = 0; j < x.length; j++) {
      y[j] = x[j] + Math.PI / 2;
      const up = asEstimate(f(y)).value;
      y[j] = x[j] - Math.PI / 2;
      const down = asEstimate(f(y)).value;
      y[j] = x[j];
      g[j] = (up - down) / 2;
    }
    return g;
  };
}

/** Central finite differences with step h (2 evaluations per parameter). */
export function centralDifferenceGradient(f: Objective, h = 1e-5): (x: Float64Array) => Float64Array {
  return (x) => {
    const g = new Float64Array(x.length);
    const y = x.slice();
    for (let j = 0; j < x.length; j++) {
      y[j] = x[j] + h;
      const up = asEstimate(f(y)).value;
      y[j] = x[j] - h;
      const down = asEstimate(f(y)).value;
      y[j] = x[j];
      g[j] = (up - down) / (2 * h);
    }
    return g;
  };
}
