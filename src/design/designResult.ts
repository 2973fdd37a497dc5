import type { BeamTheory } from '../fe/beamElementType.ts';
import { barModelFromFile } from '../modes/BarModel.ts';
import { solveBending } from '../modes/solveBending.ts';
import { parseBarFile, type BarFile, type BarFileHole } from '../fileFormats/barFile.ts';
import { roundDecimals as round } from '../fileFormats/roundDecimals.ts';
import { thicknessAt, type ThicknessProfile } from '../section/ThicknessProfile.ts';
import { millimetre as mm } from '../units/units.ts';
import { fundamentalNodes } from './cordHolePlan.ts';
import { checkProfile, cutLimitsToInput, projectRemoval } from './cutLimits.ts';
import type { DesignState } from './designRequest.ts';
import { designCautions } from './designCautions.ts';
import type { DesignTarget } from './designTarget.ts';
import { bindingLimits, closestShapeReason, type BindingLimit } from './explainDesign.ts';
import type { SolveBudget } from './fitShape.ts';
import type { LimitName, WorkshopRules } from './workshopLimits.ts';

/** What a remedy changes (contract: `remedies[].kind`). */
export type RemedyKind = 'tool_radius_mm' | 'max_slope' | 'uncut_end_mm' | 'blank_length_mm' | 'blank_thickness_mm' | 'ratios';

/**
 * A change that meets the target: checked by designing again with it (applyRemedy, then
 * designBar). `value` is the new tool radius (mm), steepest wall, uncut end (mm), blank length or
 * thickness (mm), or the ratios to tune; `cents_gained` the cents beyond tolerance it recovers
 * (all of them: the target is met); `change` says it in a maker's words.
 */
export interface Remedy {
  kind: RemedyKind;
  value: number | number[];
  cents_gained: number;
  change: string;
}

/** What relaxing one limit, or changing the blank, buys: from the limit as it was to the value tried. */
export interface Relaxation {
  kind: RemedyKind;
  from: number;
  to: number;
  /** Cents beyond tolerance recovered at `to`. */
  cents_gained: number;
  /** cents_gained per unit of the change (per mm, or per unit of slope). */
  cents_per_unit: number;
  /** Whether `to` meets the target. */
  meets_target: boolean;
}

/** The cord holes of a design: where, how big, whether the plan drills them, and what drilling does. */
export interface DesignCordHoles {
  /** Centres, mm from the left end. */
  x_mm: number[];
  diameter_mm: number;
  /** Wood kept between each hole's edge and the arch, mm. */
  clearance_mm: number;
  /** The bar came with these holes (the plan keeps them where they are). */
  drilled_already: boolean;
  /** Each hole's centre less the nearest node of the designed bar's fundamental, mm. */
  node_offset_mm: number[];
  /** How much drilling the holes moves each tuned partial, cents (null when they are drilled already). */
  shift_cents: number[] | null;
  /** The partials of the designed profile before the holes are drilled, Hz (null when drilled already). */
  undrilled_hz: number[] | null;
}

/** The designer's answer, plain JSON (contract: `barwright design --json`), mm/Hz/cents. */
export interface DesignResult {
  feasible: boolean;
  /** Why not feasible: the closest shape, the limits that bind and what would meet the target. */
  reason?: string;
  /** The design was stopped by the caller before it finished. */
  cancelled?: boolean;
  /** The bar with `profile_mm` filled, its cord holes (`holes`), and `length_mm` shortened if that was allowed and needed. */
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
  /** Nodes of the fundamental of the final shape (where the cords go), mm from the left end. */
  cord_holes_mm: number[];
  /** The cord holes in the bar (null for bars hung without holes). */
  cord_holes: DesignCordHoles | null;
  /** Total length trimmed off (both ends together), mm; 0 unless shortening was allowed and used. */
  shortened_mm: number;
  shape: { family: string; parameters: Record<string, number> };
  binding_limits: BindingLimit[];
  limits: ReturnType<typeof cutLimitsToInput>;
  /** Which tool or rule sets each limit. */
  limit_sources: Record<LimitName, string>;
  /** The workshop the limits come from. */
  workshop: string;
  theory: BeamTheory;
  /** Solver calls used by this design (not counting the designs tried for remedies). */
  solves: number;
  /** Things to check before cutting. */
  warnings: string[];
  cautions: string[];
  /** When infeasible: what relaxing each limit or changing the blank buys (cents per unit). */
  relaxations?: Relaxation[];
  /** When infeasible: the changes that meet the target, cheapest to the maker first, each checked by designing again. */
  remedies?: Remedy[];
}

/** What designResult needs besides the round. */
export interface ResultContext {
  readonly target: DesignTarget;
  readonly theory: BeamTheory;
  readonly rules: WorkshopRules;
  readonly budget: SolveBudget;
  readonly stopped: boolean;
}

/** A node further than this (mm) from its hole is reported. */
const nodeWarning = 0.5;

/**
 * The final design from a round: the chosen shape clipped to the limits (projectRemoval), rounded
 * for the file, with its cord holes (placed ones to 0.1 mm), re-analysed on the solver's default
 * mesh; the partials before drilling (the same profile without the holes) give each partial's
 * drilling shift. Throws if the clipped profile broke a limit (an internal error).
 */
export function designResult(bar: BarFile, state: DesignState, context: ResultContext): DesignResult {
  const { target, theory, rules, budget, stopped } = context;
  const { limits, problem, outcome, original, trim } = state;
  const best = outcome.best.evaluation;
  const grid = problem.space.grid;
  const projected = projectRemoval({ positions: grid.positions, thicknesses: best.thickness }, original, limits);
  const profile_mm = profileForFile(projected, original);
  const length_mm = profile_mm[profile_mm.length - 1]![0];
  const plan = state.holes;
  const placed = plan !== undefined && !plan.drilled;
  const holes: BarFileHole[] | undefined = placed
    ? plan.positions.map((x) => ({ x_mm: round(x / mm, 1), diameter_mm: round(plan.diameter / mm, 3) }))
    : bar.holes?.map((hole) => ({ ...hole, x_mm: round(hole.x_mm - trim / 2 / mm, 5) }));
  const { label, holes: _old, ...rest } = bar;
  const finalBar = parseBarFile({ ...rest, ...(label !== undefined ? { label } : {}), length_mm, profile_mm, ...(holes && holes.length ? { holes } : {}) }, 'designed bar');
  const finalModel = barModelFromFile(finalBar);
  const partials = target.hz.length;
  budget.solves++;
  const solution = solveBending(finalModel, { modes: Math.max(partials, 1), theory });
  const predicted = Array.from(solution.frequencies.slice(0, partials));
  const cents = predicted.map((f, k) => 1200 * Math.log2(f / target.hz[k]!));
  const blankProfile = barModelFromFile({ ...bar, holes: undefined }).profile;
  const violations = checkProfile(finalModel.profile, blankProfile, limits, { trimLeft: trim / 2 });
  if (violations.length) throw new Error(`internal: the designed profile breaks a limit (${violations[0]!.message})`);
  const within = cents.every((c, k) => Math.abs(c) <= target.toleranceCents[k]!);
  const thickness = finalModel.profile.thicknesses;
  let thinnest = 0;
  for (let j = 1; j < thickness.length; j++) if (thickness[j]! < thickness[thinnest]!) thinnest = j;
  const binding = bindingLimits(grid, best.thickness, limits);
  const nodes = fundamentalNodes(solution);
  const warnings: string[] = [];
  let cordHoles: DesignCordHoles | null = null;
  if (finalBar.holes && finalBar.holes.length) {
    const clearance = rules.cordHoleClearance;
    const offsets = finalBar.holes.map((hole) => {
      const nearest = nodes.reduce((a, b) => (Math.abs(b - hole.x_mm * mm) < Math.abs(a - hole.x_mm * mm) ? b : a), nodes[0] ?? hole.x_mm * mm);
      return round(hole.x_mm - nearest / mm, 2);
    });
    finalBar.holes.forEach((hole, i) => {
      const radius = (hole.diameter_mm * mm) / 2;
      for (const x of [hole.x_mm * mm - radius - clearance, hole.x_mm * mm, hole.x_mm * mm + radius + clearance]) {
        const removed = thicknessAt(original, x) - thicknessAt(finalModel.profile, x);
        if (removed > 0.05 * mm) {
          warnings.push(`the cord hole at ${round(hole.x_mm, 1)} mm lies in the cut (${round(removed / mm, 2)} mm removed within ${round(clearance / mm, 1)} mm of it): keep the arch clear of it`);
          break;
        }
      }
      if (Math.abs(offsets[i]!) > nodeWarning)
        warnings.push(`the cord hole at ${round(hole.x_mm, 1)} mm is ${Math.abs(offsets[i]!).toFixed(1)} mm from the node of the designed bar's fundamental: hang the bar at the node, or redrill`);
    });
    let shift: number[] | null = null;
    let undrilledHz: number[] | null = null;
    if (placed) {
      budget.solves++;
      const undrilled = solveBending({ ...finalModel, holes: undefined } as typeof finalModel, { modes: Math.max(partials, 1), theory });
      undrilledHz = Array.from(undrilled.frequencies.slice(0, partials), (f) => round(f, 3));
      shift = predicted.map((f, k) => round(1200 * Math.log2(f / undrilled.frequencies[k]!), 2));
    }
    cordHoles = {
      x_mm: finalBar.holes.map((hole) => hole.x_mm),
      diameter_mm: Math.max(...finalBar.holes.map((hole) => hole.diameter_mm)),
      clearance_mm: round(clearance / mm, 3),
      drilled_already: !placed,
      node_offset_mm: offsets,
      shift_cents: shift,
      undrilled_hz: undrilledHz,
    };
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
    cord_holes_mm: nodes.map((x) => round(x / mm, 1)),
    cord_holes: cordHoles,
    shortened_mm: round(trim / mm, 3),
    shape: { family: best.family.name, parameters: roundRecord(best.family.describe(problem.space, best.q)) },
    binding_limits: binding,
    limits: cutLimitsToInput(limits),
    limit_sources: { ...state.sources },
    workshop: rules.name,
    theory,
    solves: budget.solves,
    warnings,
    cautions: designCautions(finalModel.material),
  };
  if (stopped) {
    result.cancelled = true;
    result.reason = 'stopped before the design finished: this is the best shape found so far';
  } else if (!within) {
    result.reason = closestShapeReason({ target, limits, cents, uncutCents: outcome.uncutCents, binding, sources: state.sources });
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
