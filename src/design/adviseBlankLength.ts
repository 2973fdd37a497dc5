import type { BeamTheory } from '../fe/beamElementType.ts';
import { barModelFromFile, type BarModel } from '../modes/BarModel.ts';
import { solveBending } from '../modes/solveBending.ts';
import type { BarFile, BarFileMaterial, BarFileSection } from '../fileFormats/barFile.ts';
import { InputError } from '../fileFormats/InputError.ts';
import { uniformProfile } from '../section/ThicknessProfile.ts';
import type { CutLimits, CutLimitsInput } from './cutLimits.ts';
import { defaultWorkshop, type Workshop } from '../fileFormats/workshopFile.ts';
import { estimatedCordHoles, uncutForHoles } from './cordHolePlan.ts';
import { resolveDesignLimits, workshopRules } from './workshopLimits.ts';
import { createDesignProblem } from './designProblem.ts';
import { designShape, type ShapeOutcome } from './designShape.ts';
import { resolveDesignTarget, type DesignTarget, type DesignTargetInput } from './designTarget.ts';
import { bindingLimits, closestShapeReason } from './explainDesign.ts';
import type { SolveBudget } from './fitShape.ts';
import type { DesignRunOptions } from './designBar.ts';
import type { ShapeStart } from './searchShapes.ts';
import { roundDecimals } from '../fileFormats/roundDecimals.ts';
import { millimetre as mm } from '../units/units.ts';

/** The blank a maker would buy: its section and material (bar-file terms, mm); no length yet. */
export interface BlankSpec {
  readonly section: BarFileSection;
  readonly material: BarFileMaterial;
  readonly label?: string;
}

/** How much room a "comfortable" arch leaves below each limit. */
export interface ComfortMargins {
  /** Added to the minimum thickness, mm (default a twelfth of the blank thickness). */
  readonly thickness_margin_mm?: number;
  /** Largest slope used, as a fraction of the limit (default 0.8). */
  readonly slope_factor?: number;
  /** Tool radius used, as a multiple of the limit (default 1.25). */
  readonly radius_factor?: number;
}

/** What to advise on. */
export interface BlankAdviceRequest {
  readonly target: DesignTargetInput;
  /** Limits given explicitly (mm), each overriding the workshop's; the rest scale with each candidate length. */
  readonly limits?: CutLimitsInput;
  /** The workshop whose tools set the limits and whose cord holes set the uncut ends (default: barwright's default workshop). */
  readonly workshop?: Workshop;
  readonly theory?: BeamTheory;
  readonly comfort?: ComfortMargins;
  /** Most solver calls (default 1500). */
  readonly max_solves?: number;
}

/** One length tried. */
export interface BlankSample {
  length_mm: number;
  comfortable: boolean;
  thinnest_mm: number;
  cents_error: number[];
}

/** The advice: the range of blank lengths that reach the targets with a comfortable arch. */
export interface BlankAdvice {
  feasible: boolean;
  shortest_mm?: number;
  longest_mm?: number;
  /** The middle of the range (geometric mean), rounded to the millimetre. */
  recommended_mm?: number;
  /** Length at which the uncut blank itself sounds the fundamental: every blank must be shorter. */
  uncut_length_mm: number;
  target_hz: number[];
  samples: BlankSample[];
  reason?: string;
  solves: number;
}

/** Candidate lengths as fractions of the uncut length, longest first (step ×0.92). */
const scanFractions = Array.from({ length: 12 }, (_, i) => 0.96 * 0.92 ** i);
/**
 * Station spacing (m) of the arches the advisor tries. Coarser than a cutting plan's: it judges
 * which lengths are comfortable, not the final shape. Measured: the same shortest, recommended
 * and longest lengths at 10 mm as at 6 mm for C4 and A2 1:4:10 and C6 1:3, in 55–65 % of the time.
 */
const adviceStationSpacing = 0.01;
/**
 * Where the scan starts (0.582 of the uncut length): every bar of the demo keyboards, 1:4:10,
 * 1:4, 1:3 and the fundamental alone, is comfortable there or next to it (measured).
 */
const firstScanIndex = 6;
/** Bisection steps refining each end of the range (each halves the bracket: ~8 % → ~2 %). */
const refineSteps = 2;

/**
 * The blank length range for which the targets are reachable with a comfortable arch: the design
 * is run (multi-start on the parametric arch families, warm-started from the neighbouring length)
 * with every limit tightened by the comfort margins (the workshop's limits, the uncut ends past
 * its cord holes), on a ladder of lengths from just under the length at which the uncut blank
 * sounds the fundamental (found by solving the uniform bar, f ∝ 1/L² iteration) down to 40 % of
 * it, walked out from the middle of the usual range until each end of the comfortable run is
 * found; the ends are refined by bisection.
 * Pure and synchronous; cancellable like designBar. Throws InputError for bad input.
 */
export function adviseBlankLength(blank: BlankSpec, request: BlankAdviceRequest, run: DesignRunOptions = {}, source = 'blank'): BlankAdvice {
  if (blank.section.shape !== 'rect') throw new InputError(source, 'section.shape', `only rect bars are undercut (this blank is a ${blank.section.shape})`);
  const target = resolveDesignTarget(request.target, source);
  const thickness = blank.section.thickness_mm * mm;
  const comfort = request.comfort ?? {};
  const margin = (comfort.thickness_margin_mm ?? blank.section.thickness_mm / 12) * mm;
  const slopeFactor = comfort.slope_factor ?? 0.8;
  const radiusFactor = comfort.radius_factor ?? 1.25;
  if (!(margin >= 0) || !(slopeFactor > 0 && slopeFactor <= 1) || !(radiusFactor >= 1)) throw new InputError(source, 'comfort', 'margins must be ≥ 0 mm, a slope factor in (0, 1] and a radius factor ≥ 1');
  const maxSolves = request.max_solves ?? 1500;
  const theory = request.theory ?? 'timoshenko';
  let stopped = false;
  const budget: SolveBudget = {
    solves: 0,
    maxSolves,
    cancelled: () => {
      if (!stopped && (run.signal?.aborted || run.onProgress?.({ solves: budget.solves, maxSolves, stage: 'search' }) === false)) stopped = true;
      return stopped;
    },
  };
  const modelAt = (length: number): BarModel => {
    const bar: BarFile = { length_mm: length / mm, section: blank.section, material: blank.material };
    const model = barModelFromFile(bar);
    return { ...model, profile: uniformProfile(length, thickness) };
  };
  const uncutLength = lengthSoundingUncut(modelAt, target, theory, budget);
  const rules = workshopRules(request.workshop ?? defaultWorkshop);
  // The limits the designer will use at each length: the workshop's, with the uncut ends reaching
  // past the cord holes at the designer's first estimate of the nodes.
  const limitsAt = (length: number): CutLimits => {
    const holes = rules.cordHoleDiameter > 0 ? uncutForHoles(estimatedCordHoles(length, rules.cordHoleDiameter, rules.cordHoleClearance), length) : undefined;
    const { limits } = resolveDesignLimits(rules, request.limits, { length, thickness }, holes, source);
    return { ...limits, minThickness: Math.min(thickness * 0.95, limits.minThickness + margin), maxSlope: limits.maxSlope * slopeFactor, minToolRadius: limits.minToolRadius * radiusFactor, allowShortening: false, maxShortening: 0 };
  };
  const samples: (BlankSample & { outcome: ShapeOutcome; limits: CutLimits; length: number })[] = [];
  const tryLength = (length: number, warm: readonly ShapeStart[]): (typeof samples)[number] => {
    const limits = limitsAt(length);
    const problem = createDesignProblem(modelAt(length), target, limits, theory, adviceStationSpacing);
    let outcome = designShape(problem, budget, { polish: false, reduce: false, maxIterations: 20, ...(warm.length ? { starts: warm } : {}) });
    const miss = (o: ShapeOutcome): boolean => o.best.evaluation.cents.some((c, k) => Math.abs(c) > target.toleranceCents[k]!);
    if (warm.length && miss(outcome)) outcome = designShape(problem, budget, { polish: false, reduce: false, maxIterations: 20 });
    const best = outcome.best.evaluation;
    const sample = {
      length_mm: roundDecimals(length / mm, 1),
      comfortable: !miss(outcome),
      thinnest_mm: roundDecimals(Math.min(...best.thickness) / mm, 2),
      cents_error: Array.from(best.cents, (c) => roundDecimals(c, 2)),
      outcome,
      limits,
      length,
    };
    samples.push(sample);
    return sample;
  };
  const warmFrom = (sample: (typeof samples)[number] | undefined): ShapeStart[] =>
    sample ? sample.outcome.fits.slice(0, 2).map((fit) => ({ family: fit.evaluation.family, q: fit.evaluation.q })) : [];
  // The scan starts where tuned bars of every usual ratio are comfortable (firstScanIndex) and
  // walks out both ways, longer first, each way stopping at its first uncomfortable length; when
  // the first length is not comfortable, it walks out both ways, nearest first, to the first that is.
  const tried = new Map<number, (typeof samples)[number]>();
  const sampleAt = (index: number, warm: (typeof samples)[number] | undefined): (typeof samples)[number] | undefined => {
    if (index < 0 || index >= scanFractions.length || budget.cancelled() || budget.solves >= maxSolves) return undefined;
    const known = tried.get(index);
    if (known) return known;
    const sample = tryLength(uncutLength * scanFractions[index]!, warmFrom(warm));
    tried.set(index, sample);
    return sample;
  };
  let seed = firstScanIndex;
  let first = sampleAt(seed, undefined);
  for (let step = 1; first && !first.comfortable && step < scanFractions.length; step++) {
    for (const index of [firstScanIndex - step, firstScanIndex + step]) {
      const sample = sampleAt(index, first);
      if (sample?.comfortable) {
        seed = index;
        first = sample;
        break;
      }
    }
    if (seed !== firstScanIndex) break;
    if (firstScanIndex - step < 0 && firstScanIndex + step >= scanFractions.length) break;
  }
  if (first?.comfortable)
    for (const direction of [-1, 1]) {
      let warm = first;
      for (let index = seed + direction; ; index += direction) {
        const sample = sampleAt(index, warm);
        if (!sample || !sample.comfortable) break;
        warm = sample;
      }
    }
  const scanned = [...samples].sort((a, b) => a.length - b.length);
  const feasibleSamples = scanned.filter((s) => s.comfortable);
  let shortest = feasibleSamples[0];
  let longest = feasibleSamples[feasibleSamples.length - 1];
  if (shortest && longest) {
    const refine = (inside: (typeof samples)[number], outside: number): (typeof samples)[number] => {
      let good = inside;
      let bad = outside;
      for (let step = 0; step < refineSteps && !budget.cancelled() && budget.solves < maxSolves; step++) {
        const middle = Math.sqrt(good.length * bad);
        const sample = tryLength(middle, warmFrom(good));
        if (sample.comfortable) good = sample;
        else bad = middle;
      }
      return good;
    };
    const below = scanned.filter((s) => s.length < shortest!.length).pop();
    const above = scanned.find((s) => s.length > longest!.length);
    shortest = refine(shortest, below ? below.length : shortest.length * 0.92);
    longest = refine(longest, above ? above.length : Math.min(uncutLength, longest.length / 0.92));
  }
  const sampleList = [...samples].sort((a, b) => a.length - b.length).map(({ length_mm, comfortable, thinnest_mm, cents_error }) => ({ length_mm, comfortable, thinnest_mm, cents_error }));
  const advice: BlankAdvice = {
    feasible: Boolean(shortest && longest) && !stopped,
    uncut_length_mm: roundDecimals(uncutLength / mm, 1),
    target_hz: target.hz.map((f) => roundDecimals(f, 3)),
    samples: sampleList,
    solves: budget.solves,
  };
  if (shortest && longest) {
    advice.shortest_mm = shortest.length_mm;
    advice.longest_mm = longest.length_mm;
    advice.recommended_mm = Math.round(Math.sqrt(shortest.length * longest.length) / mm);
  } else {
    const closest = [...samples].sort((a, b) => a.outcome.best.cost - b.outcome.best.cost)[0];
    advice.reason = stopped
      ? 'stopped before the advice finished'
      : closest
        ? `no length from ${samples.length ? Math.min(...samples.map((s) => s.length_mm)) : 0} to ${samples.length ? Math.max(...samples.map((s) => s.length_mm)) : 0} mm reaches the targets with a comfortable arch on this section; at ${closest.length_mm} mm the ${closestShapeReason({
            target,
            limits: closest.limits,
            sources: { min_thickness_mm: 'the minimum thickness with a margin', uncut_end_mm: 'the uncut ends', max_slope: 'the steepest wall with a margin', tool_radius_mm: 'the tool with a margin' },
            cents: closest.outcome.best.evaluation.cents,
            uncutCents: closest.outcome.uncutCents,
            binding: bindingLimits(createDesignProblem(modelAt(closest.length), target, closest.limits, theory, adviceStationSpacing).space.grid, closest.outcome.best.evaluation.thickness, closest.limits),
          })}`
        : 'no length could be tried';
  }
  return advice;
}

/**
 * The length (m) at which the uniform, uncut blank sounds the target fundamental: starts from the
 * Euler–Bernoulli closed form L = √((β₁L)²/(2π f)·√(EI/ρA)) (Blevins 1979, table 8-1) and corrects
 * with the solver (f ∝ 1/L²) until within 0.01 cent.
 */
function lengthSoundingUncut(modelAt: (length: number) => BarModel, target: DesignTarget, theory: BeamTheory, budget: SolveBudget): number {
  const probe = modelAt(1);
  const section = probe.section;
  if (section.shape !== 'rect') throw new Error('internal: rect expected');
  const radiusOfGyration = section.thickness / Math.sqrt(12);
  let length = Math.sqrt(((4.730041 ** 2 / (2 * Math.PI)) * radiusOfGyration * Math.sqrt(probe.material.youngModulus / probe.material.density)) / target.fundamentalHz);
  for (let iteration = 0; iteration < 8; iteration++) {
    budget.solves++;
    const hz = solveBending(modelAt(length), { modes: 1, theory }).frequencies[0]!;
    const correction = Math.sqrt(hz / target.fundamentalHz);
    length *= correction;
    if (Math.abs(1200 * Math.log2(correction * correction)) < 0.01) break;
  }
  return length;
}
