// Designing on the solid model: the line model inside the optimiser, its targets corrected by the
// solid model in outer rounds (output space mapping).
import type { BarFile } from '../fileFormats/barFile.ts';
import { analyzeBar } from '../modes/analyzeBar.ts';
import { designBar, type DesignRequest, type DesignResult, type DesignRunOptions } from './designBar.ts';
import { resolveDesignTarget } from './designTarget.ts';

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
  /** Solid analyses run (one per round). */
  solid_solves: number;
  /** Line-model solver calls over all rounds. */
  line_solves: number;
  rounds: SolidDesignRound[];
  /** True when the solid partials of the final arch meet every tolerance. */
  converged: boolean;
  /** The line model's opinion of the final arch against the true targets: its partials (Hz) and their cents. */
  line_model_hz: number[];
  line_model_cents: number[];
  /** Where the line model puts the fundamental's nodes on the same arch, mm from the left end (the cord holes follow the solid's: `cord_holes_mm`). */
  line_model_cord_holes_mm: number[];
}

/** A design whose `predicted_hz` and `cents_error` are the solid model's, with the rounds that led there. */
export type SolidDesignResult = Omit<DesignResult, 'theory'> & { theory: 'solid'; solid: SolidDesignReport };

/** Most outer rounds (each one line-model design and one solid analysis). */
const maxRounds = 5;
/** The line-model rounds aim at this share of each tolerance, so the correction's drift between rounds still fits inside it. */
const innerToleranceShare = 0.4;

const centsBetween = (hz: number, reference: number): number => 1200 * Math.log2(hz / reference);

/**
 * Designs an undercut whose solid-model partials meet the targets: the line-model designer
 * (designBar) does the search, and its targets are corrected in outer rounds by the ratio of the
 * line model's to the solid model's partials on the arch it returned (output space mapping: the
 * survey by Bandler et al., IEEE Trans. Microwave Theory Tech. 52 (2004) 337, from memory), until
 * the solid partials meet every tolerance or `maxRounds` rounds have run. Each round starts again
 * from the blank as given; the cord holes go at the solid model's nodes of the fundamental. The
 * solid model does not model cord holes: the line model's holes are part of what the correction
 * absorbs. Pure and synchronous; cancellable as designBar is.
 */
export function designBarSolid(bar: BarFile, request: DesignRequest, run: DesignRunOptions = {}, source = 'design'): SolidDesignResult {
  const target = resolveDesignTarget(request.target, source);
  const partials = target.hz.length;
  const innerTolerance = target.toleranceCents.map((t) => Math.max(0.5, t * innerToleranceShare));
  let lineTarget = target.hz.slice();
  const rounds: SolidDesignRound[] = [];
  let lineSolves = 0;
  let result: DesignResult | undefined;
  let lineHz: number[] = [];
  let solidHz: number[] = [];
  let solidNodes: number[] = [];
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
    lineHz = result.predicted_hz.slice();
    const solidCents = solidHz.map((hz, k) => centsBetween(hz, target.hz[k]!));
    rounds.push({ line_target_hz: lineTarget.slice(), solid_hz: solidHz.slice(), solid_cents: solidCents, line_hz: lineHz.slice() });
    if (solidCents.every((c, k) => Math.abs(c) <= target.toleranceCents[k]!)) break;
    // The line model's error on this arch, f_line / f_solid, moves its targets by the same factor.
    lineTarget = target.hz.map((hz, k) => hz * (lineHz[k]! / solidHz[k]!));
    if (lineTarget.some((hz, k) => k > 0 && hz <= lineTarget[k - 1]!)) break;
  }
  if (!result) throw new Error('internal: no design round ran');
  const solidCents = solidHz.map((hz, k) => centsBetween(hz, target.hz[k]!));
  const converged = solidHz.length === partials && solidCents.every((c, k) => Math.abs(c) <= target.toleranceCents[k]!);
  const lineCents = lineHz.map((hz, k) => centsBetween(hz, target.hz[k]!));
  const missed = solidCents.map((c, k) => ({ c, k })).filter(({ c, k }) => Math.abs(c) > target.toleranceCents[k]!);
  const reason = converged
    ? undefined
    : result.cancelled
      ? 'stopped before the solid model was consulted'
      : `the solid model of the closest arch leaves ${missed.map(({ c, k }) => `partial ${k + 1} ${c >= 0 ? '+' : ''}${c.toFixed(1)} cents`).join(', ')}${result.reason ? `; the line-model design: ${result.reason}` : ''}`;
  const { theory: _lineTheory, reason: _lineReason, ...rest } = result;
  return {
    ...rest,
    feasible: converged && result.feasible,
    ...(reason ? { reason } : {}),
    ...(target.note !== undefined ? { note: target.note } : {}),
    a4_hz: target.a4Hz,
    ratios: target.ratios.slice(),
    target_hz: target.hz.slice(),
    predicted_hz: solidHz,
    cents_error: solidCents,
    tolerance_cents: target.toleranceCents.slice(),
    cord_holes_mm: solidNodes.length === 2 ? solidNodes : result.cord_holes_mm,
    solves: lineSolves,
    theory: 'solid',
    solid: { solid_solves: rounds.length, line_solves: lineSolves, rounds, converged, line_model_hz: lineHz, line_model_cents: lineCents, line_model_cord_holes_mm: result.cord_holes_mm },
  };
}
