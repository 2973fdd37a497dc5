// The message protocol between the workbench page and its solver workers. Every request carries
// an id; the worker answers with progress messages (long jobs) and exactly one final message:
// a result, an input error (field and rule, shown next to the field), "unavailable" when a
// computation is not offered, "failed" for an internal error, or "cancelled".
import type { BarAnalysis, BarFile, ChimeSetPlan, CutEffectMap, DesignResult, NextCutResult, ResonatorResult, SessionFile } from '../../src/index.ts';

/** Analyse one bar: its modes, optionally shapes and the where-to-cut map. */
export interface AnalyzeRequest {
  kind: 'analyze';
  bar: BarFile;
  modes: number;
  /** Include sampled mode shapes for plotting. */
  withShapes: boolean;
  /** Also return the where-to-cut map (cents per 0.1 mm removed over a 10 mm strip). */
  withSensitivities: boolean;
}

/** Analyse many bars (the keyboard overview), with progress; cancellable between bars. */
export interface AnalyzeManyRequest {
  kind: 'analyzeMany';
  bars: { id: string; bar: BarFile }[];
  modes: number;
}

/** Plan an undercut reaching the targets (with progress; cancel stops the worker). */
export interface DesignRequest {
  kind: 'design';
  bar: BarFile;
  target: { note: string; a4: number; ratios: number[]; tolerance_cents: number[] };
  limits: { min_thickness_mm: number };
}

/** The next cut of a tuning session. */
export interface NextCutRequest {
  kind: 'nextCut';
  session: SessionFile;
}

/** Resonator tube lengths for a set of fundamentals at a temperature. */
export interface ResonatorRequest {
  kind: 'resonators';
  rows: { id: string; hz: number; innerDiameterMm: number }[];
  temperatureC: number;
  end: 'unflanged' | 'flanged';
}

/** A chime set as the maker entered it (a chime-set file's fields, checked in the worker). */
export interface ChimeSetRequest {
  kind: 'chimeSet';
  /** The chime-set file value (format "barwright.chime-set"), not yet validated. */
  file: unknown;
}

/** Any request the page can send. */
export type SolverRequest = AnalyzeRequest | AnalyzeManyRequest | DesignRequest | NextCutRequest | ResonatorRequest | ChimeSetRequest;

/** What each request kind answers with. */
export interface SolverResults {
  analyze: { analysis: BarAnalysis; sensitivities: CutEffectMap | null };
  analyzeMany: { id: string; analysis: BarAnalysis | null; error: string | null }[];
  design: DesignResult;
  nextCut: NextCutResult;
  resonators: (ResonatorResult & { id: string })[];
  chimeSet: { plan: ChimeSetPlan; csv: string };
}

/** Page → worker. */
export type ToWorker = { type: 'request'; id: number; request: SolverRequest } | { type: 'cancel'; id: number };

/** Worker → page. */
export type FromWorker =
  | { type: 'progress'; id: number; done: number; total: number }
  | { type: 'result'; id: number; value: unknown; elapsedMs: number }
  | { type: 'input-error'; id: number; source: string; field: string; rule: string; message: string }
  | { type: 'unavailable'; id: number; what: string }
  | { type: 'failed'; id: number; message: string }
  | { type: 'cancelled'; id: number };
