/**
 * St-Venant torsion coefficient β of a solid rectangle, J = β·b·t³ with b ≥ t the long and
 * short sides and `aspect` = b/t ≥ 1:
 * β = (1/3)·[1 − (192/π⁵)·(t/b)·Σ_{n odd} tanh(nπb/2t)/n⁵]
 * (Timoshenko & Goodier, Theory of Elasticity, torsion of rectangular bars). The series is summed
 * until its terms fall below 1e-16 of the sum (n⁻⁵ decay: a few dozen terms at most).
 */
export function rectangleTorsionCoefficient(aspect: number): number {
  const r = 1 / aspect;
  return (1 / 3) * (1 - (192 / Math.PI ** 5) * r * torsionSeries(aspect));
}

/** Σ_{n odd} 1/n⁵ = (1 − 2⁻⁵)·ζ(5), ζ(5) = 1.0369277551433699… (Abramowitz & Stegun, table 23.3). */
const oddReciprocalFifthPowers = (31 / 32) * 1.03692775514337;

/**
 * Σ_{n odd} tanh(nπa/2)/n⁵, written as Σ 1/n⁵ − Σ (1 − tanh(nπa/2))/n⁵: the second sum decays
 * like e^{−nπa}, so a handful of terms reach full precision for a ≥ 1.
 */
function torsionSeries(aspect: number): number {
  let deficit = 0;
  for (let n = 1; n < 400; n += 2) {
    const z = (n * Math.PI * aspect) / 2;
    const term = (2 / (Math.exp(2 * z) + 1)) / n ** 5; // 1 − tanh z, without cancellation
    deficit += term;
    if (term < 1e-17) break;
  }
  return oddReciprocalFifthPowers - deficit;
}

/** d/d(aspect) of the series Σ tanh(nπa/2)/n⁵, for the derivative of β. */
function torsionSeriesDerivative(aspect: number): number {
  let sum = 0;
  for (let n = 1; n < 400; n += 2) {
    const c = Math.cosh((n * Math.PI * aspect) / 2);
    const term = (n * Math.PI) / 2 / (c * c) / n ** 5;
    sum += term;
    if (term < 1e-17 * Math.abs(sum) || !Number.isFinite(c)) break;
  }
  return sum;
}

/**
 * St-Venant torsion constant J (m⁴) of a solid width × thickness rectangle (m), either way up:
 * J = β·b·t³ with b = max, t = min of the two sides. See rectangleTorsionCoefficient.
 */
export function rectangleTorsionConstant(width: number, thickness: number): number {
  const long = Math.max(width, thickness);
  const short = Math.min(width, thickness);
  return rectangleTorsionCoefficient(long / short) * long * short ** 3;
}

/**
 * dJ/d(thickness) (m³) of rectangleTorsionConstant at fixed width, by differentiating the series
 * analytically (used for eigenvalue sensitivities of torsion modes).
 */
export function rectangleTorsionConstantDerivative(width: number, thickness: number): number {
  // Write J = (1/3)·L·S³ − (64/π⁵)·S⁴·F(L/S), with L, S the long and short sides, F the series.
  const k = 64 / Math.PI ** 5;
  if (thickness <= width) {
    const a = width / thickness;
    const f = torsionSeries(a);
    const fPrime = torsionSeriesDerivative(a);
    // d/dS with L fixed, da/dS = −L/S².
    return width * thickness * thickness - k * (4 * thickness ** 3 * f + thickness ** 4 * fPrime * (-width / thickness ** 2));
  }
  const a = thickness / width;
  const fPrime = torsionSeriesDerivative(a);
  // Thickness is the long side: d/dL with S = width fixed, da/dL = 1/S.
  return (1 / 3) * width ** 3 - k * width ** 4 * fPrime * (1 / width);
}
