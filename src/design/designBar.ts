import type { BeamTheory } from '../fe/beamElementType.ts';
import { barModelFromFile, type BarModel } from '../modes/BarModel.ts';
import type { BarFile } from '../fileFormats/barFile.ts';
import { InputError } from '../fileFormats/InputError.ts';
import { defaultWorkshop } from '../fileFormats/workshopFile.ts';
import { millimetre as mm } from '../units/units.ts';
import { estimatedCordHoles, fundamentalNodes, holeClearanceMargin, holePlacementTolerance, modelWithCordHoles, uncutForHoles, type CordHolePlan } from './cordHolePlan.ts';
import { trimProfile, type CutLimits } from './cutLimits.ts';
import { createDesignProblem } from './designProblem.ts';
import { defaultStationSpacing } from './designGrid.ts';
import { designRemedies } from './designRemedies.ts';
import { designResult, type DesignResult } from './designResult.ts';
import { designShape, refitShape, shapeFamilies, type ShapeOutcome } from './designShape.ts';
import { resolveDesignTarget } from './designTarget.ts';
import { bindingLimits, type RatioProbe } from './explainDesign.ts';
import type { SolveBudget } from './fitShape.ts';
import type { ShapeFamily } from './ShapeFamily.ts';
import { resolveDesignLimits, workshopRules, type UncutFromHoles, type WorkshopRules } from './workshopLimits.ts';

export type { DesignResult } from './designResult.ts';
export type { DesignProgress, DesignRequest, DesignRunOptions, DesignState } from './designRequest.ts';
import type { DesignProgress, DesignRequest, DesignRunOptions, DesignState } from './designRequest.ts';

/** Finite-element solves a design may use by default. */
export const defaultMaxSolves = 600;

/**
 * Plans an undercut: from a bar (its current profile is the start, material is only removed), a
 * target note and ratios, and the workshop (whose tools set the limits; explicit limits
 * override), finds the arch that brings the tuned partials within tolerance with the least
 * material removed (designShape: multi-start Levenberg–Marquardt over smooth arch families and
 * the free form, exact eigenvalue sensitivities, QP steps for bounds and limits), with the cord
 * holes in the model: drilled at the nodes of the designed bar's fundamental and kept clear of the
 * arch (the uncut ends reach past them; the design is repeated with the holes moved until they
 * sit within 0.25 mm of the nodes). Then clips the shape to the limits (projectRemoval),
 * re-analyses it and reports, with how much drilling moves each partial. If the targets cannot
 * be met, returns the closest shape with `feasible: false`, a reason and the remedies that would
 * meet them, each checked by designing again (designRemedies). With shortening allowed, trims
 * both ends when the blank proves too long. Pure and synchronous; cancellable through onProgress
 * returning false or an AbortSignal. Throws InputError for bad requests (source names the file
 * or form).
 */
export function designBar(bar: BarFile, request: DesignRequest, run: DesignRunOptions = {}, source = 'design'): DesignResult {
  if (bar.section.shape !== 'rect') throw new InputError(source, 'section.shape', `only rect bars are undercut (this bar is a ${bar.section.shape})`);
  const target = resolveDesignTarget(request.target, source);
  const model = barModelFromFile(bar);
  const blank = { length: model.length, thickness: bar.section.thickness_mm * mm };
  const rules = workshopRules(request.workshop ?? defaultWorkshop);
  const givenBy = request.limits_given_by ?? 'given';
  // Bad limits fail here, before any work.
  const { limits } = resolveDesignLimits(rules, request.limits, blank, undefined, source, givenBy);
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
  const rounds = designRounds(model, blank, target, rules, request, { families, theory, spacing: spacingMm * mm, source, givenBy, budget });
  const missed = (outcome: ShapeOutcome): boolean => outcome.best.evaluation.cents.some((c, k) => Math.abs(c) > target.toleranceCents[k]!);
  // The same search with the fundamental left free tells a blank of the wrong length from ratios
  // out of reach (it steers shortening).
  const probeRatios = (state: DesignState): RatioProbe | undefined => {
    if (target.hz.length < 2 || budget.cancelled() || budget.solves >= maxSolves) return undefined;
    const found = designShape({ ...state.problem, ratioOnly: true }, budget, { families, polish: false, reduce: false, maxIterations: 25 }).best.evaluation;
    return {
      ratioCents: Array.from(found.cents),
      fundamentalCents: 1200 * Math.log2(found.hz[0]! / target.hz[0]!),
      binding: bindingLimits(state.problem.space.grid, found.thickness, state.limits),
    };
  };
  let trim = 0;
  let current = rounds(0);
  if (limits.allowShortening) {
    stage = 'shortening';
    // Too long a blank ends with the fundamental flat (before any cut, or under the arch the ratios
    // need): f₁ ∝ 1/L² (Blevins 1979, table 8-1) gives the next length; a few rounds settle it.
    for (let round = 0; round < 4 && missed(current.outcome) && !budget.cancelled() && budget.solves < maxSolves; round++) {
      let flatBy = current.outcome.uncutCents[0]!;
      if (flatBy >= -target.toleranceCents[0]!) {
        flatBy = current.outcome.best.evaluation.cents[0]!;
        if (flatBy >= -target.toleranceCents[0]! && target.hz.length > 1) {
          const probe = probeRatios(current);
          if (!probe || !Array.from(probe.ratioCents).every((c, k) => Math.abs(c) <= target.toleranceCents[k]!)) break;
          flatBy = probe.fundamentalCents;
        }
      }
      if (flatBy >= -target.toleranceCents[0]!) break;
      const length = model.length - trim;
      // Whole tenths of a millimetre: a length a maker can saw to; drilled holes stay on the bar.
      const next = Math.min(Math.floor(shorteningRoom(limits, model) * 1e4) / 1e4, Math.ceil((trim + length * (1 - 2 ** (flatBy / 2400))) * 1e4) / 1e4);
      if (next <= trim + 1e-5) break;
      trim = next;
      current = rounds(trim);
    }
  }
  stage = 'final';
  const result = designResult(bar, current, { target, theory, rules, budget, stopped });
  if (!result.feasible && !stopped && request.remedies !== false) {
    stage = 'remedies';
    const designAgain = (changed: BarFile, changedRequest: DesignRequest, changedRun: DesignRunOptions): DesignResult => designBar(changed, changedRequest, changedRun, source);
    Object.assign(result, designRemedies(bar, request, result, target, current, { run, designAgain, ...(request.remedy_kinds ? { kinds: request.remedy_kinds } : {}), firstOnly: request.remedy_first_only ?? false }));
  }
  return result;
}

/** The most that may be trimmed off (m): the limit's, and never so much that a drilled hole leaves the bar. */
function shorteningRoom(limits: CutLimits, model: BarModel): number {
  let room = limits.maxShortening;
  for (const hole of model.holes ?? []) room = Math.min(room, 2 * (Math.min(hole.position, model.length - hole.position) - hole.radius - 0.001));
  return Math.max(0, room);
}

/** What every round of a design shares. */
interface RoundSettings {
  readonly families: readonly ShapeFamily[];
  readonly theory: BeamTheory;
  readonly spacing: number;
  readonly source: string;
  readonly givenBy: string;
  readonly budget: SolveBudget;
}

/**
 * The rounds of a design at each trim: with holes already drilled, one search with the uncut
 * ends reaching past them. Otherwise the holes go first at the estimate (firstNodeEstimate), and
 * after each search to the nodes the designed bar has: when the uncut ends must grow to keep the
 * moved holes clear, or may shrink to give a missing design more room, the search runs again on
 * the new grid; when only the holes moved, the shape is fitted again from where it was
 * (refitShape). At most three moves.
 */
function designRounds(
  model: BarModel,
  blank: { length: number; thickness: number },
  target: ReturnType<typeof resolveDesignTarget>,
  rules: WorkshopRules,
  request: DesignRequest,
  settings: RoundSettings,
): (trim: number) => DesignState {
  const { families, theory, spacing, source, givenBy, budget } = settings;
  const drilled = model.holes ?? [];
  const placing = drilled.length === 0 && rules.cordHoleDiameter > 0;
  const missed = (outcome: ShapeOutcome): boolean => outcome.best.evaluation.cents.some((c, k) => Math.abs(c) > target.toleranceCents[k]!);
  const build = (trim: number, holes: CordHolePlan | undefined, ends?: UncutFromHoles): Omit<DesignState, 'outcome'> => {
    const length = model.length - trim;
    const original = trim > 0 ? trimProfile(model.profile, trim / 2, trim / 2) : model.profile;
    let trimmed: BarModel = { ...model, length, profile: original };
    if (drilled.length) trimmed = { ...trimmed, holes: drilled.map((hole) => ({ ...hole, position: hole.position - trim / 2 })) };
    if (holes) trimmed = modelWithCordHoles(trimmed, holes);
    const { limits, sources } = resolveDesignLimits(rules, request.limits, blank, ends ?? (holes ? uncutForHoles(holes, length) : undefined), source, givenBy);
    return { trim, model: trimmed, original, holes, limits, sources, problem: createDesignProblem(trimmed, target, limits, theory, spacing) };
  };
  return (trim: number): DesignState => {
    const length = model.length - trim;
    if (!placing) {
      const holes: CordHolePlan | undefined = drilled.length
        ? { positions: drilled.map((hole) => hole.position - trim / 2), diameter: Math.max(...drilled.map((hole) => 2 * hole.radius)), clearance: rules.cordHoleClearance, drilled: true }
        : undefined;
      const state = build(trim, holes);
      return { ...state, outcome: designShape(state.problem, budget, { families }) };
    }
    let holes = estimatedCordHoles(length, rules.cordHoleDiameter, rules.cordHoleClearance);
    let state = build(trim, holes);
    let outcome = designShape(state.problem, budget, { families });
    for (let move = 0; move < 3 && !budget.cancelled() && budget.solves < budget.maxSolves; move++) {
      const nodes = fundamentalNodes(outcome.best.evaluation.solution);
      if (nodes.length !== 2) break;
      const moved = nodes.some((x, i) => Math.abs(x - holes.positions[i]!) > holePlacementTolerance);
      const next: CordHolePlan = { ...holes, positions: nodes };
      const ends = build(trim, next).limits;
      // The margin added to the clearance absorbs a small move: the ends grow only beyond it.
      const grows = ends.uncutLeft > state.limits.uncutLeft + holeClearanceMargin || ends.uncutRight > state.limits.uncutRight + holeClearanceMargin;
      // A design that misses gets the room the holes leave, once.
      const roomier = move === 0 && missed(outcome) && (ends.uncutLeft < state.limits.uncutLeft - 1e-3 || ends.uncutRight < state.limits.uncutRight - 1e-3);
      if (!moved && !grows && !roomier) break;
      holes = next;
      if (grows || roomier) {
        state = build(trim, holes);
        outcome = designShape(state.problem, budget, { families });
      } else {
        state = build(trim, holes, { left: state.limits.uncutLeft, right: state.limits.uncutRight });
        outcome = refitShape(state.problem, outcome, budget, { families });
      }
    }
    return { ...state, outcome };
  };
}
