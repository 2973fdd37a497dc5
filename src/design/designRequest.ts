// What a design is asked for and how it runs: the request (plain data, as a file, a form or a
// command line gives it), progress and cancellation, and one round's state (shared by the
// designer, its result and its remedies).
import type { BeamTheory } from '../fe/beamElementType.ts';
import type { CutLimitsInput } from '../fileFormats/cutLimitsInput.ts';
import type { Workshop } from '../fileFormats/workshopFile.ts';
import type { BarModel } from '../modes/BarModel.ts';
import type { ThicknessProfile } from '../section/ThicknessProfile.ts';
import type { CordHolePlan } from './cordHolePlan.ts';
import type { RemedyKind } from './designResult.ts';
import type { CutLimits } from './cutLimits.ts';
import type { ShapeOutcome } from './designShape.ts';
import type { DesignTargetInput } from './designTarget.ts';
import type { DesignProblem } from './evaluateShape.ts';
import type { LimitName } from './workshopLimits.ts';

/** What to design: the target, the workshop and its limits (mm), and solver choices. */
export interface DesignRequest {
  readonly target: DesignTargetInput;
  /** Limits given explicitly (mm): each overrides what the workshop's tools set. */
  readonly limits?: CutLimitsInput;
  /** The workshop whose tools set the limits and whose drill makes the cord holes (default: barwright's default workshop). */
  readonly workshop?: Workshop;
  /** Who gave `limits`, for the report (default "given"), e.g. "--max-slope" or "the keyboard file". */
  readonly limits_given_by?: string;
  /** Beam theory (default timoshenko). */
  readonly theory?: BeamTheory;
  /** Parametric families to search (default ["shoulder-arch", "power-arch"]). */
  readonly families?: readonly string[];
  /** Largest station spacing over the arch, mm (default length/64 within 4–8 mm). */
  readonly station_spacing_mm?: number;
  /** Most solver calls allowed per design (default 600). */
  readonly max_solves?: number;
  /** When the target cannot be met, look for the changes that would meet it (default true). */
  readonly remedies?: boolean;
  /** Only these kinds of remedy (default every kind that applies); a keyboard plan asks for the blank only. */
  readonly remedy_kinds?: readonly RemedyKind[];
  /** Stop looking at the first remedy found (in the order cheapest kinds are searched); default false. */
  readonly remedy_first_only?: boolean;
  /**
   * Solid theory only (designBarSolid): keep every torsion, lateral and longitudinal mode farther
   * from every tuned partial than the beating rule (6 Hz below 1 kHz, 15 Hz below 2 kHz, 30 Hz
   * above) by narrowing the arch, and call the design infeasible when no arch tried does; false
   * only reports them (default true).
   */
  readonly keep_other_modes_clear?: boolean;
}

/** Progress of a running design, for a worker to post; the callback may return false to stop. */
export interface DesignProgress {
  readonly solves: number;
  readonly maxSolves: number;
  readonly stage: 'search' | 'shortening' | 'final' | 'remedies';
}

/** Options of designBar that are not part of the request (not serialisable). */
export interface DesignRunOptions {
  readonly onProgress?: (progress: DesignProgress) => boolean | void;
  readonly signal?: AbortSignal;
}

/** One round of a design: the (possibly shortened) bar with its cord holes, its limits and what the search found. */
export interface DesignState {
  /** Length trimmed off, both ends together (m). */
  readonly trim: number;
  /** The bar as it is now, shortened by `trim`, with its cord holes. */
  readonly model: BarModel;
  /** Its profile before this design's cut (m). */
  readonly original: ThicknessProfile;
  readonly holes: CordHolePlan | undefined;
  readonly limits: CutLimits;
  readonly sources: Record<LimitName, string>;
  readonly problem: DesignProblem;
  readonly outcome: ShapeOutcome;
}

