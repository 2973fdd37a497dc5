import type { BeamTheory } from '../fe/beamElementType.ts';
import { sectionProperties } from '../section/sectionProperties.ts';
import { analyzeChime, type ChimeAnalysis } from './analyzeChime.ts';
import { chimeEndLoads, chimeModel, type ChimeStock } from './chimeStock.ts';
import { lengthForFrequency } from './lengthForFrequency.ts';
import { meshDensity } from '../modes/meshDensity.ts';
import { pieceModes } from './pieceModes.ts';
import { strikeNote } from './strikeNote.ts';

/** Which pitch of a chime is tuned to the note: mode 1 (wind chimes) or the strike note (tubular bells). */
export type ChimeTuning = 'fundamental' | 'strike';

/** Options of chimeForNote. */
export interface ChimeForNoteOptions {
  tune?: ChimeTuning;
  theory?: BeamTheory;
  /** Partials to list (default 6). */
  partials?: number;
}

/** chimeForNote's answer: the length and the analysis of the chime cut to it. */
export interface ChimeForNote extends ChimeAnalysis {
  target_hz: number;
  tune: ChimeTuning;
  /** The tuned pitch's distance from the target at the computed length, cents. */
  cents_error: number;
}

/** βL of mode 1 of a free–free Euler–Bernoulli beam (Blevins 1979, table 8-1). */
const firstRoot = 4.73004074486;

/**
 * The length (mm) at which a chime of this stock sounds `targetHz` on its fundamental or strike
 * note: a secant search on the solver's modes (Timoshenko by default, so thick walls and
 * shear are accounted for), started from the thin-tube Euler–Bernoulli closed form
 * L = βL₁ · (√(EI/ρA) / 2πf)^½ (Blevins 1979, table 8-1) — for the strike note, from the same
 * form with mode 4's root and f = 2·target. Converges to 1e-4 cent.
 */
export function chimeForNote(stock: ChimeStock, targetHz: number, options: ChimeForNoteOptions = {}): ChimeForNote {
  const tune = options.tune ?? 'fundamental';
  const theory = options.theory ?? 'timoshenko';
  const probe = chimeModel(stock, 1);
  const properties = sectionProperties(probe.section);
  const wave = Math.sqrt((probe.material.youngModulus * properties.secondMomentVertical) / (probe.material.density * properties.area));
  const [root, tunedHz] = tune === 'fundamental' ? [firstRoot, targetHz] : [14.1371654913, 2 * targetHz];
  const initial = root * Math.sqrt(wave / (2 * Math.PI * tunedHz));
  const loads = chimeEndLoads(stock);
  const partials = Math.max(6, Math.floor(options.partials ?? 6));
  // The search runs on the mesh the final analysis uses, so the reported error is the search's own.
  const elements = meshDensity(partials, theory);
  const pitchAt = (length: number): number => {
    const modes = pieceModes(chimeModel(stock, length), { modes: tune === 'fundamental' ? 1 : 6, theory, endLoads: loads, elements });
    return tune === 'fundamental' ? modes[0]!.hz : strikeNote(modes[3]!.hz, modes[4]!.hz, modes[5]!.hz).hz;
  };
  const solution = lengthForFrequency(pitchAt, targetHz, initial);
  const analysis = analyzeChime(stock, solution.length * 1000, { theory, partials });
  const tuned = tune === 'fundamental' ? analysis.partials[0]!.hz : analysis.strike.hz;
  return { ...analysis, target_hz: targetHz, tune, cents_error: 1200 * Math.log2(tuned / targetHz) };
}
