/**
 * Lagrange interpolation basis on the given reference points (on [0, 1]): writes the values
 * ℓ_k(ξ) and slopes ℓ_k′(ξ) (d/dξ) of every basis function at ξ.
 */
export function lagrangeBasis(points: readonly number[], xi: number, values: Float64Array, slopes: Float64Array): void {
  const n = points.length;
  for (let k = 0; k < n; k++) {
    let value = 1;
    let slope = 0;
    let denominator = 1;
    for (let m = 0; m < n; m++) {
      if (m === k) continue;
      denominator *= points[k]! - points[m]!;
    }
    // ℓ_k = Π_{m≠k}(ξ − ξ_m)/denominator; ℓ_k′ = Σ_j Π_{m≠k,j}(ξ − ξ_m)/denominator.
    for (let m = 0; m < n; m++) {
      if (m === k) continue;
      let product = 1;
      for (let j = 0; j < n; j++) if (j !== k && j !== m) product *= xi - points[j]!;
      slope += product;
      value *= xi - points[m]!;
    }
    values[k] = value / denominator;
    slopes[k] = slope / denominator;
  }
}
