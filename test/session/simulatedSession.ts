// Drives a simulated tune-and-trim session: the simulated bar (simulatedBar.ts) is struck, the
// session gets the measurement, nextCut recommends a cut, the simulated maker makes it (with an
// execution error) and records the planned shape, and round again, until done, stuck or out of cuts.
import { barModelFromFile } from '../../src/modes/BarModel.ts';
import { parseBarFile, type BarFile } from '../../src/fileFormats/barFile.ts';
import { thicknessAt, type ThicknessProfile } from '../../src/section/ThicknessProfile.ts';
import { nextCut, type NextCutResult } from '../../src/session/nextCut.ts';
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

/** Runs one simulated session from the blank (its first measurement is the uncut blank). */
export function runSimulatedSession(setup: SimulatedSessionSetup): SimulatedSessionOutcome {
  const random = seededRandom(setup.seed);
  const physics = setup.physics ?? defaultRealPhysics;
  const guess = barModelFromFile(parseBarFile(setup.blank));
  const trueMaterial = { ...guess.material, youngModulus: guess.material.youngModulus * setup.youngFactor, shearModulus: guess.material.shearModulus * setup.shearFactor };
  let real = { ...guess, material: trueMaterial };
  const modes = setup.target.ratios.length;
  const strike = (): number[] => realPartials(real, physics, modes).map((f) => f * 2 ** (((2 * random() - 1) * setup.noiseCents) / 1200));
  const steps: Record<string, unknown>[] = [{ bar: structuredClone(setup.blank), measured_hz: strike() }];
  const session: Record<string, unknown> = { format: 'barwright.session', version: 1, target: setup.target, limits: setup.limits, steps };
  const results: NextCutResult[] = [];
  let thinnest = Math.min(...real.profile.thicknesses);
  let largestAdded = -Infinity;
  let cuts = 0;
  let status: NextCutResult['status'];
  for (;;) {
    const result = nextCut(session);
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
    const positions = after.positions;
    const thicknesses = Float64Array.from(positions, (x) => thicknessAt(real.profile, x + trim) - factor * (thicknessAt(before, x + trim) - thicknessAt(after, x)));
    real = { ...real, length: result.bar_after.length_mm * mm, profile: { positions, thicknesses } };
    thinnest = Math.min(thinnest, ...thicknesses);
    cuts++;
    steps.push({ bar: structuredClone(result.bar_after), measured_hz: strike(), cut: { made: 'as-planned' } });
  }
  const truth = realPartials(real, physics, modes);
  const fundamental = setup.target.hz;
  const finalCents = truth.map((f, n) => 1200 * Math.log2(f / (fundamental * setup.target.ratios[n]!)));
  return { status, cuts, finalCents, thinnestMm: thinnest / mm, largestAddedMm: largestAdded, results, session };
}
