import type { BarFile, BarFileMaterial } from '../fileFormats/barFile.ts';
import { roundDecimals as round } from '../fileFormats/roundDecimals.ts';
import type { AnalyzeOptions, BarAnalysis } from '../modes/BarAnalysis.ts';
import { analyzeLineBar } from '../modes/analyzeLineBar.ts';
import type { BeamTheory } from '../fe/beamElementType.ts';
import { barModelFromFile } from '../modes/BarModel.ts';
import { collisionWarnings, type OtherMode } from '../modes/collisionWarnings.ts';
import { designBar, type DesignRequest, type DesignResult, type DesignRunOptions } from '../design/designBar.ts';
import { cents } from '../pitch/cents.ts';
import { archDepth } from './archDepth.ts';
import type { SessionCalibration } from './calibrateSession.ts';
import type { SessionLog } from '../fileFormats/sessionFile.ts';
import { mergeStations } from '../design/cutLimits.ts';
import { thicknessAt } from '../section/ThicknessProfile.ts';
import { millimetre as mm } from '../units/units.ts';

/**
 * What a session's calibration says about its bar, in plain units, for every other view and
 * command that predicts the bar's partials (the shape view, `modes --session`, `design --session`):
 * the fitted moduli with the density they go with, the 1D model's correction per partial per unit
 * arch depth, and the temperatures involved. JSON-serialisable.
 */
export interface CalibrationSummary {
  /** Measured steps the calibration used. */
  steps: number;
  E_GPa: number;
  G_GPa: number;
  density_kg_m3: number;
  /** Per partial: fraction of frequency per unit arch depth (partial n is multiplied by exp(c_n·depth)). */
  correction_per_depth: number[];
  /** The temperature the predictions are for, °C, and the bar's coefficient (cents per °C). */
  playing_temperature_c: number;
  pitch_cents_per_c: number;
  /** The lot the calibration started from, if any. */
  lot: string | null;
  /**
   * How the bar now really differs from its bar file as recorded (the last step's): `[x_mm, Δ_mm]`
   * pairs, Δ = estimated − recorded thickness (caliper readings and the fitted depth of cuts
   * recorded as planned), positions on the last step's bar; empty for a bar known outright.
   */
  shape_correction_mm: [number, number][];
  /** The last step's bar length, mm (the frame of shape_correction_mm). */
  length_mm: number;
}

/** The correction of a summary as a profile (mm) on a bar `lengthMm` long cut from the last step's by equal trims. */
function correctionProfile(summary: CalibrationSummary, lengthMm: number): { positions: Float64Array; thicknesses: Float64Array } {
  const trim = (summary.length_mm - lengthMm) / 2;
  return { positions: Float64Array.from(summary.shape_correction_mm, ([x]) => x - trim), thicknesses: Float64Array.from(summary.shape_correction_mm, ([, d]) => d) };
}

/** A bar file moved by the shape correction (sign +1: as the session believes it is; −1: back to the ledger's record). */
function movedBar(bar: BarFile, summary: CalibrationSummary, sign: 1 | -1): BarFile {
  if (bar.section.shape !== 'rect' || summary.shape_correction_mm.length === 0 || bar.length_mm > summary.length_mm + 1e-6) return bar;
  const correction = correctionProfile(summary, bar.length_mm);
  const own = barModelFromFile(bar).profile;
  const positions = mergeStations([Array.from(own.positions, (x) => x / mm), Array.from(correction.positions).filter((x) => x > 0 && x < bar.length_mm), [0, bar.length_mm]], 1e-6);
  const blank = bar.section.thickness_mm;
  const profile = Array.from(positions, (x) => [round(x, 3), round(Math.min(blank, Math.max(0.02 * blank, thicknessAt(own, x * mm) / mm + sign * thicknessAt(correction, x))), 4)] as [number, number]);
  profile[0]![0] = 0;
  profile[profile.length - 1]![0] = bar.length_mm;
  return { ...structuredClone(bar), profile_mm: profile };
}

/** The summary of a calibration (see CalibrationSummary). */
export function calibrationSummary(calibration: SessionCalibration, log: SessionLog): CalibrationSummary {
  const last = log.steps[log.steps.length - 1]!.bar;
  const recorded = barModelFromFile(last).profile;
  const estimated = calibration.steps[calibration.steps.length - 1]!.model.profile;
  const correction: [number, number][] = [];
  if (last.section.shape === 'rect') {
    const positions = mergeStations([recorded.positions, estimated.positions], 1e-6);
    const deltas = Array.from(positions, (x) => (thicknessAt(estimated, x) - thicknessAt(recorded, x)) / mm);
    if (deltas.some((d) => Math.abs(d) > 5e-4)) positions.forEach((x, i) => correction.push([round(x / mm, 3), round(deltas[i]!, 4)]));
  }
  return {
    steps: calibration.steps.length,
    E_GPa: calibration.youngModulus / 1e9,
    G_GPa: calibration.shearModulus / 1e9,
    density_kg_m3: calibration.density,
    correction_per_depth: [...calibration.corrections],
    playing_temperature_c: calibration.temperature.playingC,
    pitch_cents_per_c: calibration.temperature.centsPerC,
    lot: calibration.lot?.lot ?? null,
    shape_correction_mm: correction,
    length_mm: last.length_mm,
  };
}

/**
 * A bar file as the calibration believes it really is: for a rect bar cut from the session's last
 * step (the same, or shorter by equal trims and thinner), its thickness plus the last step's
 * shape correction at the same place, kept within (2 % of the blank, blank]. Other bars are
 * returned as they are.
 */
export function correctedBar(bar: BarFile, summary: CalibrationSummary): BarFile {
  return movedBar(bar, summary, 1);
}

/** A bar-file material with the calibrated E, G and density (Poisson's ratio, κ and the temperature coefficient kept). */
export function calibratedMaterial(material: BarFileMaterial, summary: CalibrationSummary): BarFileMaterial {
  const calibrated: BarFileMaterial = { E_GPa: summary.E_GPa, G_GPa: summary.G_GPa, density_kg_m3: summary.density_kg_m3 };
  if ('poisson' in material && material.poisson !== undefined) calibrated.poisson = material.poisson;
  if (material.shear_coefficient !== undefined) calibrated.shear_coefficient = material.shear_coefficient;
  calibrated.pitch_cents_per_c = round(summary.pitch_cents_per_c, 3);
  return calibrated;
}

/** One line saying where a prediction comes from, for outputs. */
export function calibrationNote(summary: CalibrationSummary, source: string): string {
  const corrections = summary.correction_per_depth.slice(0, 3).map((c) => `${c >= 0 ? '+' : ''}${(100 * c).toFixed(1)} %`);
  return `partials from the calibrated model of ${source} (${summary.steps} measured step${summary.steps === 1 ? '' : 's'}${summary.lot ? `, lot ${summary.lot}` : ''}): E ${summary.E_GPa.toFixed(2)} GPa, G ${summary.G_GPa.toFixed(3)} GPa, density ${summary.density_kg_m3.toFixed(0)} kg/m³, correction per unit arch depth ${corrections.join(' / ')}, at ${summary.playing_temperature_c} °C`;
}

/**
 * `analyzeBar` with a session's calibration: the bar as the session believes it really is
 * (correctedBar) analysed with the calibrated moduli, each
 * vertical bending partial n then multiplied by exp(c_n·depth) for this shape's arch depth (the
 * calibration's own prediction law, predictShape), ratios and collision warnings recomputed.
 * Torsion and lateral modes use the calibrated moduli only. Adds `calibration` (the summary).
 */
export function calibratedAnalysis(bar: BarFile, summary: CalibrationSummary, options: AnalyzeOptions & { theory?: BeamTheory } = {}): BarAnalysis & { calibration: CalibrationSummary } {
  const real = correctedBar(bar, summary);
  const analysis = analyzeLineBar({ ...real, material: calibratedMaterial(bar.material, summary) }, options);
  const depth = archDepth(barModelFromFile(real));
  const factors = analysis.bending.map((_, n) => Math.exp((summary.correction_per_depth[n] ?? 0) * depth));
  const fundamental = analysis.bending[0]!.hz * factors[0]!;
  const bending = analysis.bending.map((mode, n) => ({ ...mode, hz: mode.hz * factors[n]!, ratio: (mode.hz * factors[n]!) / fundamental }));
  const others: OtherMode[] = analysis.torsion.map((m) => ({ family: 'torsion' as const, mode: m.mode, hz: m.hz }));
  if (bar.section.shape === 'rect') others.push(...analysis.lateral.map((m) => ({ family: 'lateral' as const, mode: m.mode, hz: m.hz })));
  const rescaled = (family: typeof analysis.torsion) => family.map((mode) => ({ ...mode, ratio: mode.hz / fundamental }));
  return {
    ...analysis,
    bending,
    torsion: rescaled(analysis.torsion),
    lateral: rescaled(analysis.lateral),
    warnings: collisionWarnings(bending.slice(0, 3).map((m) => m.hz), others),
    calibration: summary,
  };
}

/** How many times the design is repeated with the targets moved by the corrections at the depth it reached. */
const correctionPasses = 3;

/**
 * `designBar` with a session's calibration: the bar as the session believes it really is
 * (correctedBar) designed with the calibrated moduli, toward
 * targets moved by the calibration's corrections at the arch depth the design reaches (target_n ·
 * exp(−c_n·depth); repeated up to three times as the depth settles), so the calibrated model of
 * the designed shape meets the real targets. The bar returned is in the session's ledger (the bar
 * file as recorded minus the depth to remove, with the bar's own material), so `modes --session`
 * on it gives the same prediction. The result reports the real targets, the calibrated predictions
 * and their errors, feasible when every error is within tolerance, and `calibration`.
 */
export function calibratedDesign(bar: BarFile, request: DesignRequest, summary: CalibrationSummary, run: DesignRunOptions = {}, source = 'design'): DesignResult & { calibration: CalibrationSummary } {
  const calibratedBar: BarFile = { ...correctedBar(bar, summary), material: calibratedMaterial(bar.material, summary) };
  let result = designBar(calibratedBar, request, run, source);
  const first = result;
  const targets = result.target_hz;
  const factorsAt = (depth: number): number[] => targets.map((_, n) => Math.exp((summary.correction_per_depth[n] ?? 0) * depth));
  let depth = archDepth(barModelFromFile(result.bar));
  for (let pass = 0; pass < correctionPasses && !result.cancelled; pass++) {
    const factors = factorsAt(depth);
    const moved = targets.map((hz, n) => hz / factors[n]!);
    const next = designBar(calibratedBar, { ...request, target: { hz: moved[0]!, ratios: moved.map((hz) => hz / moved[0]!), tolerance_cents: result.tolerance_cents } }, run, source);
    const nextDepth = archDepth(barModelFromFile(next.bar));
    result = next;
    const settled = Math.abs(nextDepth - depth) < 0.002;
    depth = nextDepth;
    if (settled) break;
  }
  const factors = factorsAt(depth);
  const predicted = analyzeLineBar(result.bar, { modes: targets.length }).bending.map((mode, n) => mode.hz * factors[n]!);
  const error = predicted.map((hz, n) => cents(hz, targets[n]!));
  const feasible = error.every((c, n) => Math.abs(c) <= result.tolerance_cents[n]!);
  const designed: DesignResult & { calibration: CalibrationSummary } = {
    ...result,
    // Written in the session's ledger, like next-cut's bar_after: the record minus the depth to remove.
    bar: { ...movedBar(result.bar, summary, -1), material: structuredClone(bar.material) },
    feasible,
    a4_hz: first.a4_hz,
    target_hz: targets,
    ratios: first.ratios,
    predicted_hz: predicted,
    cents_error: error,
    calibration: summary,
  };
  if (first.note !== undefined) designed.note = first.note;
  if (!feasible && designed.reason === undefined) designed.reason = 'with the session’s calibrated corrections the closest shape misses a target';
  return designed;
}
