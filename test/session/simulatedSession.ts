// Drives a simulated tune-and-trim session: the simulated bar (simulatedBar.ts) is struck, the
// session gets the measurement, nextCut recommends a cut, the simulated maker makes it (with an
// execution error) and records the planned shape, and round again, until done, stuck or out of cuts.
import { barModelFromFile } from '../../src/modes/BarModel.ts';
import { parseBarFile, type BarFile } from '../../src/fileFormats/barFile.ts';
import { thicknessAt, type ThicknessProfile } from '../../src/section/ThicknessProfile.ts';
import { nextCut, type NextCutOptions, type NextCutResult } from '../../src/session/nextCut.ts';
import type { LotPrior } from '../../src/session/lotPrior.ts';
import type { BarModel } from '../../src/modes/BarModel.ts';
import { defaultRealPhysics, realPartials, seededRandom, type RealPhysics } from './simulatedBar.ts';

/** One simulated session's set-up. */
export interface SimulatedSessionSetup {
  /** The blank as the maker records it, with the maker's guessed material. */
  readonly blank: BarFile;
  /** The true moduli as factors on the guess (e.g. 1.15, 0.7). */
  readonly youngFactor: number;
  readonly shearFactor: number;
  readonly target: { hz: number; ratios: number[]; tolerance_cents: number[] };
  readonly limits: Record<string, unknown>;
  /** Measurement noise: uniform in ±noiseCents on every partial. */
  readonly noiseCents: number;
  /** Cut execution error: the maker removes (1 + e) × the planned depth, e uniform in ±executionError. */
  readonly executionError: number;
  /** A systematic depth factor on every cut (default 1: as planned on average). */
  readonly cutScale?: number;
  readonly seed: number;
  readonly maxCuts?: number;
  readonly physics?: RealPhysics;
  /**
   * The workshop's temperature: each reading is taken at an air temperature drawn uniformly from
   * `rangeC` (recorded in the step), and the real bar's partials move `centsPerC` per °C from
   * their values at the playing temperature (recorded as target.playing_temperature_c).
   */
  readonly temperature?: { readonly centsPerC: number; readonly rangeC: readonly [number, number]; readonly playingC: number };
  /** The maker's hand beyond the depth factor: the cut lands `offsetMm` to the right and sanding smears it over `smearMm` (a moving average). */
  readonly hand?: { readonly offsetMm: number; readonly smearMm: number };
  /** Caliper readings at the advised checkpoints after every cut, read to ±noiseMm (uniform) and recorded to 0.01 mm. */
  readonly caliper?: { readonly noiseMm: number };
  /** What finished bars of the same lot taught (passed to nextCut). */
  readonly lot?: LotPrior | null;
  /** How the real bar sounds (default: realPartials with `physics`); e.g. the solid model with constants the tool does not know. */
  readonly strikeModel?: (real: BarModel, modes: number) => number[];
  /** The advice asked for each round (default nextCut); e.g. nextCutSolid. */
  readonly advise?: (session: unknown, options: NextCutOptions) => NextCutResult;
}

/** What happened. */
export interface SimulatedSessionOutcome {
  readonly status: NextCutResult['status'];
  readonly cuts: number;
  /** True partials after the last cut, cents from target. */
  readonly finalCents: number[];
  /** Thinnest the real bar ever was (mm). */
  readonly thinnestMm: number;
  /** Largest thickness increase of any recorded step over the one before (mm): must be ≤ 0. */
  readonly largestAddedMm: number;
  readonly results: NextCutResult[];
  readonly session: Record<string, unknown>;
  /** The real bar after the first cut, at the playing temperature, minus what the first advice predicted, cents (null without a cut). */
  readonly firstCutErrorCents: number[] | null;
  /** The real bar at each reading (the partials before noise and temperature), cents from target at the playing temperature. */
  readonly trueCentsByStep: number[][];
  /** The real bar's shape at each reading (SI). */
  readonly realByStep: BarModel[];
}

const mm = 1e-3;

function profileOf(bar: BarFile): ThicknessProfile {
  return barModelFromFile(parseBarFile(bar)).profile;
}

function largestIncrease(before: BarFile, after: BarFile): number {
  const a = profileOf(before);
  const b = profileOf(after);
  const trim = ((before.length_mm - after.length_mm) / 2) * mm;
  let largest = (after.length_mm - before.length_mm) * mm;
  for (const x of [...b.positions, ...Array.from(a.positions, (p) => p - trim)]) {
    if (x < 0 || x > after.length_mm * mm) continue;
    largest = Math.max(largest, thicknessAt(b, x) - thicknessAt(a, x + trim));
  }
  return largest / mm;
}

/** The real bar after a cut made by a hand that shifts it `offsetMm` and smears it over `smearMm`, on a 2 mm grid. */
function handCut(real: BarModel, before: ThicknessProfile, after: ThicknessProfile, lengthAfterMm: number, trim: number, factor: number, hand: { offsetMm: number; smearMm: number }): BarModel {
  const step = 2;
  const count = Math.max(2, Math.round(lengthAfterMm / step));
  const grid = Array.from({ length: count + 1 }, (_, i) => (lengthAfterMm * i) / count);
  const planned = (x: number): number => (x < 0 || x > lengthAfterMm ? 0 : Math.max(0, thicknessAt(before, (x + trim / mm) * mm) - thicknessAt(after, x * mm)));
  const half = hand.smearMm / 2;
  const samples = 9;
  const removal = grid.map((x) => {
    if (half <= 0) return planned(x - hand.offsetMm);
    let sum = 0;
    for (let i = 0; i < samples; i++) sum += planned(x - hand.offsetMm - half + (2 * half * i) / (samples - 1));
    return sum / samples;
  });
  const positions = Float64Array.from(grid, (x) => x * mm);
  const thicknesses = Float64Array.from(grid, (x, i) => thicknessAt(real.profile, x * mm + trim) - factor * removal[i]!);
  return { ...real, length: lengthAfterMm * mm, profile: { positions, thicknesses } };
}

/** Runs one simulated session from the blank (its first measurement is the uncut blank). */
export function runSimulatedSession(setup: SimulatedSessionSetup): SimulatedSessionOutcome {
  const random = seededRandom(setup.seed);
  const physics = setup.physics ?? defaultRealPhysics;
  const guess = barModelFromFile(parseBarFile(setup.blank));
  const trueMaterial = { ...guess.material, youngModulus: guess.material.youngModulus * setup.youngFactor, shearModulus: guess.material.shearModulus * setup.shearFactor };
  let real: BarModel = { ...guess, material: trueMaterial };
  const modes = setup.target.ratios.length;
  const climate = setup.temperature;
  const centsOf = (hz: readonly number[]): number[] => hz.map((f, n) => 1200 * Math.log2(f / (setup.target.hz * setup.target.ratios[n]!)));
  const sound = setup.strikeModel ?? ((bar: BarModel, count: number): number[] => realPartials(bar, physics, count));
  const advise = setup.advise ?? nextCut;
  const trueCents = (): number[] => centsOf(sound(real, modes));
  const trueCentsByStep: number[][] = [];
  const realByStep: BarModel[] = [];
  // Readings taken 15 minutes after each cut, an hour apart (cool bars; times recorded).
  let clock = Date.parse('2025-03-03T09:00:00Z');
  const strike = (): Record<string, unknown> => {
    const truth = sound(real, modes);
    trueCentsByStep.push(centsOf(truth));
    realByStep.push(real);
    const air = climate ? climate.rangeC[0] + random() * (climate.rangeC[1] - climate.rangeC[0]) : undefined;
    const heat = climate && air !== undefined ? climate.centsPerC * (air - climate.playingC) : 0;
    const hz = truth.map((f) => f * 2 ** ((heat + (2 * random() - 1) * setup.noiseCents) / 1200));
    const reading: Record<string, unknown> = { measured_hz: hz, recorded_at: new Date(clock).toISOString() };
    if (air !== undefined) reading.air_temperature_c = Math.round(air * 10) / 10;
    return reading;
  };
  const target = climate ? { ...setup.target, playing_temperature_c: climate.playingC } : setup.target;
  const steps: Record<string, unknown>[] = [{ bar: structuredClone(setup.blank), ...strike() }];
  const session: Record<string, unknown> = { format: 'barwright.session', version: 1, target, limits: setup.limits, steps };
  const results: NextCutResult[] = [];
  let thinnest = Math.min(...real.profile.thicknesses);
  let largestAdded = -Infinity;
  let cuts = 0;
  let status: NextCutResult['status'];
  let firstCutErrorCents: number[] | null = null;
  for (;;) {
    const result = advise(session, setup.lot ? { lot: setup.lot } : {});
    results.push(result);
    status = result.status;
    if (status !== 'cut' || cuts >= (setup.maxCuts ?? 8)) break;
    const recorded = steps[steps.length - 1]!.bar as BarFile;
    largestAdded = Math.max(largestAdded, largestIncrease(recorded, result.bar_after));
    // The maker cuts: removal (1 + e) × planned, measured on the recorded shapes; the real bar loses that.
    const before = profileOf(recorded);
    const after = profileOf(result.bar_after);
    const trim = ((recorded.length_mm - result.bar_after.length_mm) / 2) * mm;
    const factor = (setup.cutScale ?? 1) + (2 * random() - 1) * setup.executionError;
    if (setup.hand) real = handCut(real, before, after, result.bar_after.length_mm, trim, factor, setup.hand);
    else {
      const positions = after.positions;
      const thicknesses = Float64Array.from(positions, (x) => thicknessAt(real.profile, x + trim) - factor * (thicknessAt(before, x + trim) - thicknessAt(after, x)));
      real = { ...real, length: result.bar_after.length_mm * mm, profile: { positions, thicknesses } };
    }
    thinnest = Math.min(thinnest, ...real.profile.thicknesses);
    cuts++;
    clock += 60 * 60_000;
    const finished = new Date(clock - 15 * 60_000).toISOString();
    const step: Record<string, unknown> = { bar: structuredClone(result.bar_after), ...strike(), cut: { made: 'as-planned' }, cut_finished_at: finished };
    if (cuts === 1) firstCutErrorCents = trueCentsByStep[trueCentsByStep.length - 1]!.map((c, n) => c - result.predicted_cents[n]!);
    if (setup.caliper && result.checkpoints.length > 0)
      step.measured_thickness_mm = result.checkpoints.map(({ x_mm }) => [x_mm, Math.round((thicknessAt(real.profile, x_mm * mm) / mm + (2 * random() - 1) * setup.caliper!.noiseMm) * 100) / 100]);
    steps.push(step);
  }
  const finalCents = trueCents();
  return { status, cuts, finalCents, thinnestMm: thinnest / mm, largestAddedMm: largestAdded, results, session, firstCutErrorCents, trueCentsByStep, realByStep };
}
