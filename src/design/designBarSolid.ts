// Designing on the solid model: the line model inside the optimiser, its targets corrected by the
// solid model in outer rounds (output space mapping), and the other modes kept clear of the tuned
// partials (otherModesClear.ts).
import type { BarFile } from '../fileFormats/barFile.ts';
import { analyzeBar } from '../modes/analyzeBar.ts';
import { collisionWarnings, type OtherMode } from '../modes/collisionWarnings.ts';
import { designBar, type DesignRequest, type DesignResult, type DesignRunOptions } from './designBar.ts';
import { resolveDesignTarget, type DesignTarget } from './designTarget.ts';
import { clearanceText, keepOtherModesClear, type ClearanceTrial, type OtherModesReport } from './otherModesClear.ts';

/** One outer round: what the line model was asked for, and what the solid and line models say of the arch it gave. */
export interface SolidDesignRound {
  /** The corrected targets the line-model designer was given, Hz. */
  line_target_hz: number[];
  /** The solid model's tuned partials of the round's arch, Hz, and their cents from the true targets. */
  solid_hz: number[];
  solid_cents: number[];
  /** The line model's tuned partials of the same arch, Hz. */
  line_hz: number[];
}

/** The solid model's verdict on a design, beside the line model's opinion of the same arch. */
export interface SolidDesignReport {
  /** Solid analyses run, over every design made (one per round), the other-modes search's included. */
  solid_solves: number;
  /** Line-model solver calls over all rounds of every design made. */
  line_solves: number;
  /** The rounds of the returned design. */
  rounds: SolidDesignRound[];
  /** True when the solid partials of the final arch meet every tolerance. */
  converged: boolean;
  /** The line model's opinion of the final arch against the true targets: its partials (Hz) and their cents. */
  line_model_hz: number[];
  line_model_cents: number[];
  /** Where the line model puts the fundamental's nodes on the same arch, mm from the left end (the cord holes follow the solid's: `cord_holes_mm`). */
  line_model_cord_holes_mm: number[];
  /** Torsion, lateral and longitudinal modes against the beating rule, before and after keeping them clear. */
  collisions: OtherModesReport;
}

/** A design whose `predicted_hz` and `cents_error` are the solid model's, with the rounds that led there. */
export type SolidDesignResult = Omit<DesignResult, 'theory'> & { theory: 'solid'; solid: SolidDesignReport };

/** Most outer rounds (each one line-model design and one solid analysis). */
const maxRounds = 5;
/** The line-model rounds aim at this share of each tolerance, so the correction's drift between rounds still fits inside it. */
const innerToleranceShare = 0.4;

const centsBetween = (hz: number, reference: number): number => 1200 * Math.log2(hz / reference);

/** One space-mapped design: the line design of its last round and the solid model's view of it. */
interface SpaceMappedDesign extends ClearanceTrial {
  readonly result: DesignResult;
  readonly rounds: SolidDesignRound[];
  readonly lineSolves: number;
  readonly lineHz: number[];
  readonly solidHz: number[];
  readonly solidNodes: number[];
  /** f_line / f_solid per partial on the last arch: the correction the next design starts from. */
  readonly correction: number[];
}

/**
 * The outer rounds on one request: design on the line model, analyse the arch on the solid model,
 * move the line targets by f_line/f_solid, until the solid partials meet every tolerance.
 * `startCorrection` (f_line/f_solid per partial) starts the first round's targets already moved.
 */
function spaceMappedDesign(bar: BarFile, request: DesignRequest, run: DesignRunOptions, source: string, target: DesignTarget, startCorrection?: readonly number[]): SpaceMappedDesign {
  const partials = target.hz.length;
  const innerTolerance = target.toleranceCents.map((t) => Math.max(0.5, t * innerToleranceShare));
  let lineTarget = target.hz.map((hz, k) => hz * (startCorrection?.[k] ?? 1));
  const rounds: SolidDesignRound[] = [];
  let lineSolves = 0;
  let result: DesignResult | undefined;
  let lineHz: number[] = [];
  let solidHz: number[] = [];
  let solidNodes: number[] = [];
  let others: OtherMode[] = [];
  for (let round = 0; round < maxRounds; round++) {
    const lineRequest: DesignRequest = {
      ...request,
      theory: 'timoshenko',
      // Remedies on the line model would not be the solid's: the rounds look for none.
      remedies: false,
      target: { hz: lineTarget[0]!, ratios: lineTarget.map((hz) => hz / lineTarget[0]!), tolerance_cents: innerTolerance },
    };
    result = designBar(bar, lineRequest, run, source);
    lineSolves += result.solves;
    if (result.cancelled || run.signal?.aborted) break;
    const solid = analyzeBar(result.bar, { theory: 'solid', modes: Math.max(partials, 1) });
    solidHz = solid.bending.slice(0, partials).map((mode) => mode.hz);
    solidNodes = solid.bending[0]?.nodes_mm?.slice() ?? [];
    others = [
      ...solid.torsion.map((m) => ({ family: 'torsion' as const, mode: m.mode, hz: m.hz })),
      ...solid.lateral.map((m) => ({ family: 'lateral' as const, mode: m.mode, hz: m.hz })),
      ...(solid.longitudinal ?? []).map((m) => ({ family: 'longitudinal' as const, mode: m.mode, hz: m.hz })),
    ];
    lineHz = result.predicted_hz.slice();
    const solidCents = solidHz.map((hz, k) => centsBetween(hz, target.hz[k]!));
    rounds.push({ line_target_hz: lineTarget.slice(), solid_hz: solidHz.slice(), solid_cents: solidCents, line_hz: lineHz.slice() });
    if (solidCents.every((c, k) => Math.abs(c) <= target.toleranceCents[k]!)) break;
    // The line model's error on this arch, f_line / f_solid, moves its targets by the same factor.
    lineTarget = target.hz.map((hz, k) => hz * (lineHz[k]! / solidHz[k]!));
    if (lineTarget.some((hz, k) => k > 0 && hz <= lineTarget[k - 1]!)) break;
  }
  if (!result) throw new Error('internal: no design round ran');
  const converged = solidHz.length === partials && solidHz.every((hz, k) => Math.abs(centsBetween(hz, target.hz[k]!)) <= target.toleranceCents[k]!);
  return {
    result,
    rounds,
    lineSolves,
    lineHz,
    solidHz,
    solidNodes,
    others,
    correction: solidHz.length === partials ? lineHz.map((hz, k) => hz / solidHz[k]!) : target.hz.map(() => 1),
    meetsTargets: converged && result.feasible && !result.cancelled,
    uncutEndMm: Math.max(result.limits.uncut_left_mm, result.limits.uncut_right_mm),
    solidSolves: rounds.length,
  };
}

/** The request with the arch kept at least `uncutEndMm` from each end (an end given farther stays). */
function withUncutEnds(request: DesignRequest, uncutEndMm: number): DesignRequest {
  const { uncut_end_mm: given, ...limits } = request.limits ?? {};
  return {
    ...request,
    limits: { ...limits, uncut_left_mm: Math.max(uncutEndMm, limits.uncut_left_mm ?? given ?? 0), uncut_right_mm: Math.max(uncutEndMm, limits.uncut_right_mm ?? given ?? 0) },
    ...(request.limits && Object.keys(request.limits).length ? {} : { limits_given_by: 'barwright, to keep the other modes clear of the partials' }),
  };
}

/**
 * Designs an undercut whose solid-model partials meet the targets: the line-model designer
 * (designBar) does the search, and its targets are corrected in outer rounds by the ratio of the
 * line model's to the solid model's partials on the arch it returned (output space mapping: the
 * survey by Bandler et al., IEEE Trans. Microwave Theory Tech. 52 (2004) 337, from memory), until
 * the solid partials meet every tolerance or `maxRounds` rounds have run. Each round starts again
 * from the blank as given; the cord holes go at the solid model's nodes of the fundamental. The
 * solid model does not model cord holes: the line model's holes are part of what the correction
 * absorbs. Then, unless `keep_other_modes_clear` is false, every torsion, lateral and
 * longitudinal mode is kept farther from every tuned partial than the beating rule
 * (collisionDistanceHz) by designing again with longer uncut ends (keepOtherModesClear); when no
 * arch tried keeps them clear the design is not feasible and `reason` says which mode and how far.
 * Pure and synchronous; cancellable as designBar is.
 */
export function designBarSolid(bar: BarFile, request: DesignRequest, run: DesignRunOptions = {}, source = 'design'): SolidDesignResult {
  const target = resolveDesignTarget(request.target, source);
  const first = spaceMappedDesign(bar, request, run, source, target);
  const made: SpaceMappedDesign[] = [first];
  const keep = request.keep_other_modes_clear ?? true;
  const { chosen, report } = keepOtherModesClear(
    first,
    (uncutEndMm, from) => {
      if (run.signal?.aborted) return undefined;
      const next = spaceMappedDesign(bar, withUncutEnds(request, uncutEndMm), run, source, target, from.correction);
      made.push(next);
      return next.result.cancelled ? undefined : next;
    },
    { lengthMm: bar.length_mm, keep },
  );
  const { result, solidHz, lineHz, solidNodes, rounds } = chosen;
  const partials = target.hz.length;
  const solidCents = solidHz.map((hz, k) => centsBetween(hz, target.hz[k]!));
  const converged = solidHz.length === partials && solidCents.every((c, k) => Math.abs(c) <= target.toleranceCents[k]!);
  const lineCents = lineHz.map((hz, k) => centsBetween(hz, target.hz[k]!));
  const missed = solidCents.map((c, k) => ({ c, k })).filter(({ c, k }) => Math.abs(c) > target.toleranceCents[k]!);
  const collide = report.after.filter((c) => !c.clear);
  const clash = keep && converged && collide.length > 0;
  const tried = report.uncut_ends_tried_mm.length ? ` (uncut ends tried up to ${Math.max(...report.uncut_ends_tried_mm).toFixed(1)} mm)` : '';
  const reason = !converged
    ? result.cancelled
      ? 'stopped before the solid model was consulted'
      : `the solid model of the closest arch leaves ${missed.map(({ c, k }) => `partial ${k + 1} ${c >= 0 ? '+' : ''}${c.toFixed(1)} cents`).join(', ')}${result.reason ? `; the line-model design: ${result.reason}` : ''}`
    : clash
      ? `the partials are on target, but no arch within the limits keeps every other mode clear of them${tried}: ${collide.map(clearanceText).join('; ')} — it can buzz or beat; the blank's width moves them and hardly the tuned partials (narrower: torsion up, lateral down)`
      : undefined;
  const solidWarnings = collide.length ? collisionWarnings(solidHz, chosen.others) : [];
  const { theory: _lineTheory, reason: _lineReason, ...rest } = result;
  return {
    ...rest,
    feasible: converged && result.feasible && !clash,
    ...(reason ? { reason } : {}),
    ...(target.note !== undefined ? { note: target.note } : {}),
    a4_hz: target.a4Hz,
    ratios: target.ratios.slice(),
    target_hz: target.hz.slice(),
    predicted_hz: solidHz,
    cents_error: solidCents,
    tolerance_cents: target.toleranceCents.slice(),
    cord_holes_mm: solidNodes.length === 2 ? solidNodes : result.cord_holes_mm,
    warnings: [...result.warnings, ...solidWarnings.map((w) => `on the solid model, ${w}`)],
    solves: made.reduce((sum, design) => sum + design.lineSolves, 0),
    theory: 'solid',
    solid: {
      solid_solves: made.reduce((sum, design) => sum + design.solidSolves, 0),
      line_solves: made.reduce((sum, design) => sum + design.lineSolves, 0),
      rounds,
      converged,
      line_model_hz: lineHz,
      line_model_cents: lineCents,
      line_model_cord_holes_mm: result.cord_holes_mm,
      collisions: report,
    },
  };
}
