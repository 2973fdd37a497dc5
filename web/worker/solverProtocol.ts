// The solver worker's jobs (solverWorker.ts), in the workbench's one job protocol
// (jobProtocol.ts): for each kind, the payload the page sends and the result it gets back.
import type { BarAnalysis, BarFile, CalibrationSummary, ChimeSetPlan, CutEffectMap, DesignResult, LengthTrim, LengthTrimInput, LotBarRecord, LotPrior, NextCutResult, ResonatorResult, SessionFile, SolidSessionReport, Workshop } from '../../src/index.ts';

/** Analyse one bar: its modes, optionally shapes and the where-to-cut map. */
export interface AnalyzePayload {
  bar: BarFile;
  modes: number;
  /** Include sampled mode shapes for plotting. */
  withShapes: boolean;
  /** Also return the where-to-cut map (cents per 0.1 mm removed over a 10 mm strip). */
  withSensitivities: boolean;
  /** The bar's session, once it has measurements: the partials then come from its calibrated model (one truth with the advice). */
  session?: SessionFile;
  /** What the bar's lot taught (the calibration's prior), with `session`. */
  lot?: LotPrior | null;
}

/** Analyse many bars (the keyboard overview), with progress; cancellable between bars. */
export interface AnalyzeManyPayload {
  bars: { id: string; bar: BarFile }[];
  modes: number;
}

/** A bar on the 3D solid model (rectangular bars): its partials, torsion, lateral and longitudinal modes with their shapes. */
export interface SolidModesPayload {
  bar: BarFile;
  modes: number;
  /** The bar's session, once it has measurements: the 3D model then takes the calibrated E and G (the other constants scaled with them) and the bar as the session believes it is. */
  session?: SessionFile;
  /** What the bar's lot taught (the calibration's prior), with `session`. */
  lot?: LotPrior | null;
}

/** A bar on the 3D model, and the calibration its material came from (null: the bar file's material). */
export interface SolidModesResult {
  analysis: BarAnalysis;
  calibration: CalibrationSummary | null;
}

/** Plan an undercut reaching the targets (with progress; cancellable). */
export interface DesignPayload {
  bar: BarFile;
  target: { note: string; a4: number; ratios: number[]; tolerance_cents: number[] };
  limits: { min_thickness_mm: number };
  /** The project's workshop (its tools set the other limits); absent: barwright's default workshop. */
  workshop?: Workshop;
  /** The bar's session, once it has measurements: the plan is then made with its calibrated model. */
  session?: SessionFile;
  /** What the bar's lot taught (the calibration's prior), with `session`. */
  lot?: LotPrior | null;
}

/** The next cut of a tuning session. */
export interface NextCutPayload {
  session: SessionFile;
  /** What the bar's lot taught (the calibration's prior). */
  lot?: LotPrior | null;
  /** The bar (the project's id) and its note: a `done` result then carries what the bar teaches its lot. */
  learn?: { bar: string; note: string };
}

/** Next-cut advice; when done, with what the finished bar teaches its lot (`learn` given). */
export type NextCutAdvice = NextCutResult & { lot_record?: LotBarRecord };

/** Next-cut advice worked out on the 3D model too (nextCutSolid): what the solid model said, null when it was not consulted. */
export type SolidNextCutAdvice = NextCutAdvice & { theory: 'solid'; solid: SolidSessionReport | null };

/** Resonator tube lengths for a set of fundamentals at a temperature. */
export interface ResonatorPayload {
  rows: { id: string; hz: number; innerDiameterMm: number }[];
  temperatureC: number;
  end: 'unflanged' | 'flanged';
}

/** A chime set as the maker entered it (a chime-set file's fields, checked in the worker). */
export interface ChimeSetPayload {
  /** The chime-set file value (format "barwright.chime-set"), not yet validated. */
  file: unknown;
}

/** One bar's analysis. */
export interface AnalyzeResult {
  analysis: BarAnalysis;
  sensitivities: CutEffectMap | null;
  /** The calibration the partials come from, when a session was given (null: the starting guess). */
  calibration: CalibrationSummary | null;
}

/** One bar's line of a many-bar analysis. */
export interface AnalyzeManyEntry {
  id: string;
  analysis: BarAnalysis | null;
  error: string | null;
}

/** The solver's job catalog (a type alias, so it fits JobCatalog's index signature). */
export type SolverJobs = {
  analyze: { payload: AnalyzePayload; result: AnalyzeResult };
  analyzeMany: { payload: AnalyzeManyPayload; result: AnalyzeManyEntry[] };
  design: { payload: DesignPayload; result: DesignResult };
  nextCut: { payload: NextCutPayload; result: NextCutAdvice };
  resonators: { payload: ResonatorPayload; result: (ResonatorResult & { id: string })[] };
  chimeSet: { payload: ChimeSetPayload; result: { plan: ChimeSetPlan; csv: string } };
  lengthTrim: { payload: LengthTrimInput; result: LengthTrim };
};

/** The 3D model's job catalog: its own worker module, so the solver worker never loads the solid model. */
export type SolidJobs = {
  solidModes: { payload: SolidModesPayload; result: SolidModesResult };
  /** The next cut with the solid model in the calibration and the plan (3–10 solid analyses: about 20 s on the demo bars, more with an off-axis grain). */
  nextCutSolid: { payload: NextCutPayload; result: SolidNextCutAdvice };
};
