import type { BeamTheory } from '../fe/beamElementType.ts';
import { barModelFromFile, type BarModel } from '../modes/BarModel.ts';
import { bendingNodePositions } from '../modes/modeShape.ts';
import { solveBending } from '../modes/solveBending.ts';
import { parseBarFile, type BarFile } from '../fileFormats/barFile.ts';
import { InputError } from '../fileFormats/InputError.ts';
import { thicknessAt, type ThicknessProfile } from '../section/ThicknessProfile.ts';
import { checkProfile, cutLimitsToInput, projectRemoval, resolveCutLimits, trimProfile, type CutLimits, type CutLimitsInput } from './cutLimits.ts';
import { designCautions } from './designCautions.ts';
import { createDesignProblem } from './designProblem.ts';
import { defaultStationSpacing } from './designGrid.ts';
import { designShape, shapeFamilies, type ShapeOutcome } from './designShape.ts';
import { resolveDesignTarget, type DesignTarget, type DesignTargetInput } from './designTarget.ts';
import { bindingLimits, shortfallReason, type BindingLimit, type RatioProbe } from './explainDesign.ts';
import type { SolveBudget } from './fitShape.ts';
import { roundDecimals as round } from '../fileFormats/roundDecimals.ts';
import { millimetre as mm } from '../units/units.ts';

/** What to design: the target, the workshop limits (mm) and solver choices. */
export interface DesignRequest {
  readonly target: DesignTargetInput;
  readonly limits?: CutLimitsInput;
  /** Beam theory (default timoshenko). */
  readonly theory?: BeamTheory;
  /** Parametric families to search (default ["shoulder-arch", "power-arch"]). */
  readonly families?: readonly string[];
  /** Largest station spacing over the arch, mm (default length/64 within 4–8 mm). */
  readonly station_spacing_mm?: number;
  /** Most solver calls allowed (default 600). */
  readonly max_solves?: number;
}

/** Progress of a running design, for a worker to post; the callback may return false to stop. */
export interface DesignProgress {
  readonly solves: number;
  readonly maxSolves: number;
  readonly stage: 'search' | 'shortening' | 'final';
}

/** Options of designBar that are not part of the request (not serialisable). */
export interface DesignRunOptions {
  readonly onProgress?: (progress: DesignProgress) => boolean | void;
  readonly signal?: AbortSignal;
}

/** The designer's answer, plain JSON (contract: `barwright design --json`), mm/Hz/cents. */
export interface DesignResult {
  feasible: boolean;
  /** Why not feasible: the limit that binds and what would help. */
  reason?: string;
  /** The design was stopped by the caller before it finished. */
  cancelled?: boolean;
  /** The bar with `profile_mm` filled (and `length_mm` shortened if that was allowed and needed). */
  bar: BarFile;
  note?: string;
  a4_hz: number;
  ratios: number[];
  target_hz: number[];
  predicted_hz: number[];
  cents_error: number[];
  tolerance_cents: number[];
  /** Volume of wood (or metal) removed from the bar as it was, mm³. */
  removed_volume_mm3: number;
  thinnest_mm: number;
  thinnest_at_mm: number;
  /** Cord-hole positions: nodes of the fundamental of the final shape, mm from the left end. */
  cord_holes_mm: number[];
  /** Total length trimmed off (both ends together), mm; 0 unless shortening was allowed and used. */
  shortened_mm: number;
  shape: { family: string; parameters: Record<string, number> };
  binding_limits: BindingLimit[];
  limits: ReturnType<typeof cutLimitsToInput>;
  theory: BeamTheory;
  /** Solver calls used. */
  solves: number;
  /** Things to check before cutting (e.g. a cord hole that falls inside the cut). */
  warnings: string[];
  cautions: string[];
}

/** Finite-element solves a design may use by default. */
export const defaultMaxSolves = 600;

/**
 * Plans an undercut: from a bar (its current profile is the start, material is only removed), a
 * target note and ratios, and the workshop limits, finds the arch that brings the tuned partials
 * within tolerance with the least material removed (designShape: multi-start Levenberg–Marquardt
 * over smooth arch families, exact eigenvalue sensitivities, QP steps for bounds and limits,
 * free-form polish), clips it to the limits (projectRemoval), re-analyses the final profile and
 * reports. If the targets cannot be met, returns the closest shape with `feasible: false` and a
 * reason. With shortening allowed, trims both ends when the blank proves too long. Pure and
 * synchronous; cancellable through onProgress returning false or an AbortSignal.
 * Throws InputError for bad requests (source names the file or form).
 */
export function designBar(bar: BarFile, request: DesignRequest, run: DesignRunOptions = {}, source = 'design'): DesignResult {
  if (bar.section.shape !== 'rect') throw new InputError(source, 'section.shape', `only rect bars are undercut (this bar is a ${bar.section.shape})`);
  const target = resolveDesignTarget(request.target, source);
  const model = barModelFromFile(bar);
  const blank = { length: model.length, thickness: bar.section.thickness_mm * mm };
  const limits = resolveCutLimits(request.limits, blank, source);
  const theory = request.theory ?? 'timoshenko';
  if (theory !== 'timoshenko' && theory !== 'euler-bernoulli') throw new InputError(source, 'theory', `must be timoshenko or euler-bernoulli (got "${String(theory)}")`);
  const families = (request.families ?? ['shoulder-arch', 'power-arch']).map((name) => {
    const family = shapeFamilies[name];
    if (!family || name === 'free-form') throw new InputError(source, 'families', `unknown arch family "${name}" (known: shoulder-arch, power-arch)`);
    return family;
  });
  const spacingMm = request.station_spacing_mm ?? defaultStationSpacing(model.length) / mm;
  if (!Number.isFinite(spacingMm) || spacingMm < 1 || spacingMm > 10) throw new InputError(source, 'station_spacing_mm', `must be from 1 to 10 mm (got ${spacingMm})`);
  const maxSolves = request.max_solves ?? defaultMaxSolves;
  if (!Number.isInteger(maxSolves) || maxSolves < 10) throw new InputError(source, 'max_solves', `must be a whole number of at least 10 (got ${maxSolves})`);
  let stage: DesignProgress['stage'] = 'search';
  let stopped = false;
  const budget: SolveBudget = {
    solves: 0,
    maxSolves,
    cancelled: () => {
      if (stopped) return true;
      if (run.signal?.aborted) stopped = true;
      else if (run.onProgress?.({ solves: budget.solves, maxSolves, stage }) === false) stopped = true;
      return stopped;
    },
  };
  const attempt = (trim: number): { model: BarModel; original: ThicknessProfile; outcome: ShapeOutcome; limits: CutLimits; problem: ReturnType<typeof createDesignProblem> } => {
    const original = trim > 0 ? trimProfile(model.profile, trim / 2, trim / 2) : model.profile;
    const trimmed: BarModel = { ...model, length: model.length - trim, profile: original };
    const problem = createDesignProblem(trimmed, target, limits, theory, spacingMm * mm);
    return { model: trimmed, original, outcome: designShape(problem, budget, { families }), limits, problem };
  };
  const missed = (outcome: ShapeOutcome): boolean => outcome.best.evaluation.cents.some((c, k) => Math.abs(c) > target.toleranceCents[k]!);
  // The same search with the fundamental left free tells a blank of the wrong length from ratios
  // out of reach (for shortening, and for the reason given to the maker).
  const probeRatios = (state: ReturnType<typeof attempt>): RatioProbe | undefined => {
    if (target.hz.length < 2 || budget.cancelled() || budget.solves >= maxSolves) return undefined;
    const found = designShape({ ...state.problem, ratioOnly: true }, budget, { families, polish: false, reduce: false, maxIterations: 25 }).best.evaluation;
    return {
      ratioCents: Array.from(found.cents),
      fundamentalCents: 1200 * Math.log2(found.hz[0]! / target.hz[0]!),
      binding: bindingLimits(state.problem.space.grid, found.thickness, state.limits),
    };
  };
  const ratiosReachable = (probe: RatioProbe): boolean => Array.from(probe.ratioCents).every((c, k) => Math.abs(c) <= target.toleranceCents[k]!);
  let trim = 0;
  let current = attempt(0);
  let probe: RatioProbe | undefined;
  if (limits.allowShortening) {
    stage = 'shortening';
    // Too long a blank ends with the fundamental flat (before any cut, or under the arch the ratios
    // need): f₁ ∝ 1/L² (Blevins 1979, table 8-1) gives the next length; a few rounds settle it.
    for (let round = 0; round < 4 && missed(current.outcome) && !budget.cancelled() && budget.solves < maxSolves; round++) {
      let flatBy = current.outcome.uncutCents[0]!;
      if (flatBy >= -target.toleranceCents[0]!) {
        flatBy = current.outcome.best.evaluation.cents[0]!;
        if (flatBy >= -target.toleranceCents[0]! && target.hz.length > 1) {
          probe = probeRatios(current);
          if (!probe || !ratiosReachable(probe)) break;
          flatBy = probe.fundamentalCents;
        }
      }
      if (flatBy >= -target.toleranceCents[0]!) break;
      const length = model.length - trim;
      // Whole tenths of a millimetre: a length a maker can saw to.
      const next = Math.min(Math.floor(limits.maxShortening * 1e4) / 1e4, Math.ceil((trim + length * (1 - 2 ** (flatBy / 2400))) * 1e4) / 1e4);
      if (next <= trim + 1e-5) break;
      trim = next;
      probe = undefined;
      current = attempt(trim);
    }
  }
  if (missed(current.outcome) && !probe && current.outcome.uncutCents[0]! >= -target.toleranceCents[0]!) probe = probeRatios(current);
  stage = 'final';
  return finish(bar, model.profile, target, current.original, current.limits, current.problem, current.outcome, trim, theory, budget, stopped, probe);
}

/** Projects, rounds and re-analyses the chosen shape, and writes the result. */
function finish(
  bar: BarFile,
  blankProfile: ThicknessProfile,
  target: DesignTarget,
  original: ThicknessProfile,
  limits: CutLimits,
  problem: ReturnType<typeof createDesignProblem>,
  outcome: ShapeOutcome,
  trim: number,
  theory: BeamTheory,
  budget: SolveBudget,
  stopped: boolean,
  probe: RatioProbe | undefined,
): DesignResult {
  const best = outcome.best.evaluation;
  const grid = problem.space.grid;
  const projected = projectRemoval({ positions: grid.positions, thicknesses: best.thickness }, original, limits);
  const profile_mm = profileForFile(projected, original);
  const length_mm = profile_mm[profile_mm.length - 1]![0];
  const { label, ...rest } = bar;
  const finalBar = parseBarFile({ ...rest, ...(label !== undefined ? { label } : {}), length_mm, profile_mm }, 'designed bar');
  const finalModel = barModelFromFile(finalBar);
  const partials = target.hz.length;
  budget.solves++;
  const solution = solveBending(finalModel, { modes: Math.max(partials, 1), theory });
  const predicted = Array.from(solution.frequencies.slice(0, partials));
  const cents = predicted.map((f, k) => 1200 * Math.log2(f / target.hz[k]!));
  const violations = checkProfile(finalModel.profile, blankProfile, limits, { trimLeft: trim / 2 });
  if (violations.length) throw new Error(`internal: the designed profile breaks a limit (${violations[0]!.message})`);
  const within = cents.every((c, k) => Math.abs(c) <= target.toleranceCents[k]!);
  const thickness = finalModel.profile.thicknesses;
  let thinnest = 0;
  for (let j = 1; j < thickness.length; j++) if (thickness[j]! < thickness[thinnest]!) thinnest = j;
  const binding = bindingLimits(grid, best.thickness, limits);
  const holes = bendingNodePositions(solution, 0);
  const warnings: string[] = [];
  for (const hole of holes) {
    const removed = thicknessAt(original, hole) - thicknessAt(finalModel.profile, hole);
    if (removed > 0.05 * mm)
      warnings.push(`the cord hole at ${round(hole / mm, 1)} mm falls inside the cut (${round(removed / mm, 2)} mm removed there): keep the hole clear of the arch, or lengthen the uncut ends`);
  }
  const result: DesignResult = {
    feasible: within && !stopped,
    bar: finalBar,
    ...(target.note !== undefined ? { note: target.note } : {}),
    a4_hz: target.a4Hz,
    ratios: [...target.ratios],
    target_hz: target.hz.map((f) => round(f, 3)),
    predicted_hz: predicted.map((f) => round(f, 3)),
    cents_error: cents.map((c) => round(c, 3)),
    tolerance_cents: [...target.toleranceCents],
    removed_volume_mm3: round(removedArea(finalModel.profile, original) * problem.width * 1e9, 1),
    thinnest_mm: round(thickness[thinnest]! / mm, 3),
    thinnest_at_mm: round(finalModel.profile.positions[thinnest]! / mm, 2),
    cord_holes_mm: holes.map((x) => round(x / mm, 1)),
    shortened_mm: round(trim / mm, 3),
    shape: { family: best.family.name, parameters: roundRecord(best.family.describe(problem.space, best.q)) },
    binding_limits: binding,
    limits: cutLimitsToInput(limits),
    theory,
    solves: budget.solves,
    warnings,
    cautions: designCautions(finalModel.material),
  };
  if (stopped) {
    result.cancelled = true;
    result.reason = 'stopped before the design finished: this is the best shape found so far';
  } else if (!within) {
    result.reason = shortfallReason({ target, limits, length: finalModel.length, cents, uncutCents: outcome.uncutCents, binding, ...(probe ? { ratioProbe: probe } : {}) });
  }
  return result;
}

function roundRecord(record: Record<string, number>): Record<string, number> {
  return Object.fromEntries(Object.entries(record).map(([k, v]) => [k, round(v, 4)]));
}

/** ∫ (original − profile) dx (m²) by the trapezoid rule over both profiles' stations (exact). */
function removedArea(profile: ThicknessProfile, original: ThicknessProfile): number {
  const xs = Array.from(new Set([...profile.positions, ...original.positions])).sort((a, b) => a - b);
  let area = 0;
  const depthAt = (x: number): number => thicknessAt(original, x) - thicknessAt(profile, x);
  for (let i = 0; i + 1 < xs.length; i++) area += 0.5 * (depthAt(xs[i]!) + depthAt(xs[i + 1]!)) * (xs[i + 1]! - xs[i]!);
  return area;
}

/**
 * The profile as bar-file pairs in mm: stations rounded to 10 nm (far below any cut; keeps every
 * limit check exact), untouched stations copied from the original, interior stations of a flat
 * uncut run dropped.
 */
function profileForFile(profile: ThicknessProfile, original: ThicknessProfile): [number, number][] {
  const x = profile.positions;
  const t = profile.thicknesses;
  const n = x.length;
  const originalAt = (position: number): number => thicknessAt(original, position);
  const pairs: [number, number][] = [];
  for (let j = 0; j < n; j++) {
    const flatRun = j > 0 && j + 1 < n && t[j - 1] === t[j] && t[j + 1] === t[j] && Math.abs(originalAt(x[j]!) - t[j]!) < 1e-12 && !original.positions.includes(x[j]!);
    if (flatRun) continue;
    const before = originalAt(x[j]!);
    const thickness = Math.abs(before - t[j]!) < 1e-10 ? before : Math.min(before, t[j]!);
    pairs.push([round(x[j]! / mm, 5), round(thickness / mm, 5)]);
  }
  return pairs;
}
