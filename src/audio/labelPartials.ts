import { cents } from '../pitch/cents.ts';

/** Predicted frequencies to label measured partials against (e.g. from analyzeBar). */
export interface ExpectedModes {
  /** Vertical bending modes 1, 2, 3, … in order, Hz. */
  bending: readonly number[];
  /** Other predicted modes (torsion, lateral bending, …). */
  other?: readonly { family: string; mode: number; hz: number }[];
}

/** How far from a prediction a measured partial may be and still take its label. */
export interface LabelTolerances {
  /** Measured fundamental vs predicted mode 1, cents (default 400: wood varies ±20 % in E). */
  fundamentalCents?: number;
  /** Overtones vs their prediction rescaled by the measured fundamental, cents (default 150). */
  overtoneCents?: number;
  /** Other modes vs their prediction rescaled likewise, cents (default 150). */
  otherCents?: number;
}

/** What a measured partial was taken to be. */
export interface PartialLabel {
  /** Bending mode number (1 = fundamental), or null when no bending prediction fits. */
  mode: number | null;
  /** "torsion 1", "lateral 2", … when it fits another predicted mode instead; else null. */
  otherMode: string | null;
  /** The prediction it was matched to, Hz (unscaled), or null. */
  predictedHz: number | null;
}

/**
 * Labels measured partials (Hz) against predicted modes. Mode 1 goes to the measured partial
 * nearest (in cents) to the predicted fundamental within `fundamentalCents`. The ratio of the two
 * then rescales every other prediction (a blank stiffer or lighter than modelled moves all its
 * modes together), and the remaining bending modes are matched one-to-one, closest pair first,
 * within `overtoneCents`; partials left over are matched to other predicted modes within
 * `otherCents`. Returns one label per partial, in the order given.
 */
export function labelPartials(partialHz: readonly number[], expected: ExpectedModes, tolerances: LabelTolerances = {}): PartialLabel[] {
  const fundamentalCents = tolerances.fundamentalCents ?? 400;
  const overtoneCents = tolerances.overtoneCents ?? 150;
  const otherCents = tolerances.otherCents ?? 150;
  const labels: PartialLabel[] = partialHz.map(() => ({ mode: null, otherMode: null, predictedHz: null }));
  const bending = expected.bending;
  if (bending.length === 0 || partialHz.length === 0) return labels;

  let scale = 1;
  let fundamentalIndex = -1;
  partialHz.forEach((hz, index) => {
    const distance = Math.abs(cents(hz, bending[0]!));
    if (distance <= fundamentalCents && (fundamentalIndex < 0 || distance < Math.abs(cents(partialHz[fundamentalIndex]!, bending[0]!)))) fundamentalIndex = index;
  });
  if (fundamentalIndex >= 0) {
    labels[fundamentalIndex] = { mode: 1, otherMode: null, predictedHz: bending[0]! };
    scale = partialHz[fundamentalIndex]! / bending[0]!;
  }
  // Without a fundamental nothing rescales, so overtones get the fundamental's wider tolerance.
  const overtoneTolerance = fundamentalIndex >= 0 ? overtoneCents : fundamentalCents;

  const pairs: { partial: number; mode: number; distance: number }[] = [];
  partialHz.forEach((hz, partial) => {
    if (partial === fundamentalIndex) return;
    for (let mode = 2; mode <= bending.length; mode++) {
      const distance = Math.abs(cents(hz, bending[mode - 1]! * scale));
      if (distance <= overtoneTolerance) pairs.push({ partial, mode, distance });
    }
  });
  pairs.sort((a, b) => a.distance - b.distance);
  const modeTaken = new Set<number>();
  for (const { partial, mode } of pairs) {
    if (labels[partial]!.mode !== null || modeTaken.has(mode)) continue;
    labels[partial] = { mode, otherMode: null, predictedHz: bending[mode - 1]! };
    modeTaken.add(mode);
  }

  for (const [partial, hz] of partialHz.entries()) {
    if (labels[partial]!.mode !== null) continue;
    let best: { name: string; hz: number; distance: number } | null = null;
    for (const other of expected.other ?? []) {
      const distance = Math.abs(cents(hz, other.hz * scale));
      if (distance <= otherCents && (!best || distance < best.distance)) best = { name: `${other.family} ${other.mode}`, hz: other.hz, distance };
    }
    if (best) labels[partial] = { mode: null, otherMode: best.name, predictedHz: best.hz };
  }
  return labels;
}

/**
 * The predictions of a bar analysis (analyzeBar's `bending`, `torsion`, `lateral` lists) as
 * ExpectedModes for labelPartials.
 */
export function expectedModesOf(analysis: {
  readonly bending: readonly { readonly hz: number }[];
  readonly torsion?: readonly { readonly mode: number; readonly hz: number }[];
  readonly lateral?: readonly { readonly mode: number; readonly hz: number }[];
}): ExpectedModes {
  return {
    bending: analysis.bending.map((m) => m.hz),
    other: [
      ...(analysis.torsion ?? []).map((m) => ({ family: 'torsion', mode: m.mode, hz: m.hz })),
      ...(analysis.lateral ?? []).map((m) => ({ family: 'lateral', mode: m.mode, hz: m.hz })),
    ],
  };
}
