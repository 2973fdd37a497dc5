/** The strike note of a long tube or rod: the pitch heard at the blow, from bending modes 4–6. */
export interface StrikeNote {
  /** Virtual pitch (Hz): the harmonic series fitted to modes 4, 5, 6 taken as harmonics 2, 3, 4. */
  readonly hz: number;
  /** Half of mode 4's frequency (Hz): "an octave below mode 4", the usual rule of thumb. */
  readonly octaveBelowMode4Hz: number;
  /** How far each of modes 4, 5, 6 lies from harmonic 2, 3, 4 of the fitted pitch, cents. */
  readonly harmonicDeviationCents: readonly [number, number, number];
}

/** Harmonic numbers that modes 4, 5, 6 of a free–free tube approximate (ratios near 2 : 3 : 4). */
const harmonicNumbers = [2, 3, 4] as const;

/**
 * The strike note of a chime from its bending modes 4, 5 and 6 (Hz, ascending). For a uniform
 * free–free beam these lie near 81 : 121 : 169 ((2n+1)², the asymptotic Euler–Bernoulli roots,
 * Blevins 1979, table 8-1: ratios 8.933 : 13.344 : 18.638), close to 2 : 3 : 4, so the ear hears
 * a virtual pitch near an octave below mode 4. The fitted pitch is the least-squares harmonic
 * series in log frequency, f₀ = (f₄/2 · f₅/3 · f₆/4)^(1/3); the deviations say how near 2 : 3 : 4
 * the three modes really are (a plain model of virtual pitch, not a listening test).
 */
export function strikeNote(mode4Hz: number, mode5Hz: number, mode6Hz: number): StrikeNote {
  const modes = [mode4Hz, mode5Hz, mode6Hz] as const;
  const logPitch = modes.reduce((sum, hz, i) => sum + Math.log(hz / harmonicNumbers[i]!), 0) / 3;
  const hz = Math.exp(logPitch);
  const deviation = modes.map((f, i) => 1200 * Math.log2(f / (harmonicNumbers[i]! * hz))) as [number, number, number];
  return { hz, octaveBelowMode4Hz: mode4Hz / 2, harmonicDeviationCents: deviation };
}
