/** Result of lengthForFrequency: the length found (m), the frequency there (Hz) and the work done. */
export interface LengthSolution {
  readonly length: number;
  readonly hz: number;
  readonly iterations: number;
}

/** Options of lengthForFrequency. */
export interface LengthSearchOptions {
  /** Stop when the frequency is within this many cents of the target (default 1e-4 cent). */
  readonly toleranceCents?: number;
  /** Most frequency evaluations (default 40). */
  readonly maxIterations?: number;
  /** Shortest and longest length allowed (m); the search stays inside (default 1 mm … 20 m). */
  readonly bounds?: readonly [number, number];
}

/**
 * The length L (m) at which a free–free piece sounds `targetHz` in the chosen quantity
 * (`frequencyAt(L)`, decreasing in L: a bending partial, a strike note). Secant iteration on
 * ln f against ln L, started from `initialLength` with the Euler–Bernoulli slope −2 (f ∝ 1/L²,
 * Blevins 1979, table 8-1), each step clamped to a factor of 2 so a poor guess cannot run away.
 * Shear and rotary inertia make the slope slightly shallower; the secant learns it in one step.
 * Throws when the quantity does not fall with length or the search leaves its bounds.
 */
export function lengthForFrequency(frequencyAt: (length: number) => number, targetHz: number, initialLength: number, options: LengthSearchOptions = {}): LengthSolution {
  const tolerance = (options.toleranceCents ?? 1e-4) / 1200 * Math.LN2;
  const maxIterations = options.maxIterations ?? 40;
  const [lowest, highest] = options.bounds ?? [1e-3, 20];
  const logTarget = Math.log(targetHz);
  let logLength = Math.log(Math.min(highest, Math.max(lowest, initialLength)));
  let logHz = Math.log(frequencyAt(Math.exp(logLength)));
  let slope = -2;
  for (let iteration = 1; iteration <= maxIterations; iteration++) {
    const error = logHz - logTarget;
    if (!Number.isFinite(error)) throw new Error(`internal: frequency not finite at length ${Math.exp(logLength)} m`);
    if (Math.abs(error) <= tolerance) return { length: Math.exp(logLength), hz: Math.exp(logHz), iterations: iteration };
    const step = Math.max(-Math.LN2, Math.min(Math.LN2, -error / slope));
    const nextLogLength = Math.min(Math.log(highest), Math.max(Math.log(lowest), logLength + step));
    if (nextLogLength === logLength) throw new Error(`internal: length search for ${targetHz} Hz left its bounds ${lowest}–${highest} m`);
    const nextLogHz = Math.log(frequencyAt(Math.exp(nextLogLength)));
    const measuredSlope = (nextLogHz - logHz) / (nextLogLength - logLength);
    // Keep the secant slope physical (frequency falls with length, between 0 and 4 decades per decade).
    slope = measuredSlope < -0.05 && measuredSlope > -4 ? measuredSlope : slope;
    logLength = nextLogLength;
    logHz = nextLogHz;
  }
  throw new Error(`internal: length search for ${targetHz} Hz did not converge in ${maxIterations} steps`);
}
