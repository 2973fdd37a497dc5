import { millimetre } from '../units/units.ts';
import type { BeamTheory } from '../fe/beamElementType.ts';
import { solveTorsion } from '../modes/solveTorsion.ts';
import { chimeEndLoads, chimeModel, type ChimeStock } from './chimeStock.ts';
import { nearestInterval } from './musicalInterval.ts';
import { pieceModes } from './pieceModes.ts';
import { strikeNote } from './strikeNote.ts';

/** One bending partial of a chime (mm, Hz). */
export interface ChimePartial {
  mode: number;
  hz: number;
  /** hz / mode 1's hz. */
  ratio: number;
  /** The nearest equal-tempered interval above the fundamental and the cents from it. */
  interval: { name: string; cents: number };
  /** Nodes from the top end, mm. */
  nodes_mm: number[];
}

/** What analyzeChime reports (mm, Hz, cents). */
export interface ChimeAnalysis {
  theory: BeamTheory;
  length_mm: number;
  partials: ChimePartial[];
  /** The strike note from modes 4–6 (see strikeNote). */
  strike: { hz: number; octave_below_mode4_hz: number; harmonic_deviation_cents: number[] };
  /** Where to hang it: mode 1's node nearest the top, mm from the top end. */
  hanging_point_mm: number;
  /** The same as a fraction of the length (0.2242 for a slender uniform piece). */
  hanging_point_fraction: number;
  /** The other node of mode 1 (a second support for a chime laid flat), mm from the top. */
  lower_node_mm: number;
  /** With plugs or caps: how far they moved the hanging point, mm (+ towards the bottom). */
  hanging_point_shift_mm?: number;
  /** Torsion modes within 50 cents of a listed partial. */
  warnings: string[];
}

/** Options of analyzeChime. */
export interface ChimeAnalysisOptions {
  /** Bending partials to list (at least 6, for the strike note; default 6). */
  partials?: number;
  theory?: BeamTheory;
}

/** Window (cents) for torsion–bending collisions, the solver's own (collisionWarnings). */
const collisionCents = 50;

/**
 * Everything a chime fabricator needs about one tube or rod of the given length (mm): its bending
 * partials (Timoshenko by default, with Cowper's κ of the section) and how near each lies to a
 * musical interval, the strike note from modes 4–6, the hanging point at mode 1's node nearest
 * the top (≈ 0.2242 L for a slender uniform piece, Blevins 1979, table 8-1) and, with end plugs
 * or caps modelled as rigid masses, how far they move it; torsion collisions. Pure.
 */
export function analyzeChime(stock: ChimeStock, lengthMm: number, options: ChimeAnalysisOptions = {}): ChimeAnalysis {
  const count = Math.max(6, Math.floor(options.partials ?? 6));
  const theory = options.theory ?? 'timoshenko';
  const model = chimeModel(stock, lengthMm * millimetre);
  const loads = chimeEndLoads(stock);
  const modes = pieceModes(model, { modes: count, theory, endLoads: loads });
  const partials: ChimePartial[] = modes.map((m) => {
    const interval = nearestInterval(m.ratio);
    return { mode: m.mode, hz: m.hz, ratio: m.ratio, interval: { name: interval.name, cents: interval.cents }, nodes_mm: m.nodes.map((x) => x * 1000) };
  });
  const strike = strikeNote(modes[3]!.hz, modes[4]!.hz, modes[5]!.hz);
  const nodes = partials[0]!.nodes_mm;
  const hanging = nodes[0]!;
  const result: ChimeAnalysis = {
    theory,
    length_mm: lengthMm,
    partials,
    strike: { hz: strike.hz, octave_below_mode4_hz: strike.octaveBelowMode4Hz, harmonic_deviation_cents: [...strike.harmonicDeviationCents] },
    hanging_point_mm: hanging,
    hanging_point_fraction: hanging / lengthMm,
    lower_node_mm: nodes[nodes.length - 1]!,
    warnings: [],
  };
  if (loads.length > 0) {
    const plain = pieceModes(model, { modes: count, theory });
    result.hanging_point_shift_mm = hanging - plain[0]!.nodes[0]! * 1000;
  }
  const highest = modes[modes.length - 1]!.hz * 2 ** (collisionCents / 1200);
  let torsionCount = 4;
  let torsion = solveTorsion(model, { modes: torsionCount });
  while (torsion.frequencies[torsion.frequencies.length - 1]! < highest && torsionCount < 64) {
    torsionCount *= 2;
    torsion = solveTorsion(model, { modes: torsionCount });
  }
  for (const partial of partials) {
    torsion.frequencies.forEach((hz, i) => {
      const cents = Math.abs(1200 * Math.log2(hz / partial.hz));
      if (cents <= collisionCents) result.warnings.push(`torsion mode ${i + 1} is ${Math.round(cents)} cents from bending partial ${partial.mode}`);
    });
  }
  if (loads.length > 0 && result.warnings.length > 0) result.warnings.push('torsion modes computed without the end plugs');
  return result;
}
