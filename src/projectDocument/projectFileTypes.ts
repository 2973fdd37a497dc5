// Types of barwright's project file (`*.project.json`, format "barwright.project"). A project
// is one instrument being built: its range, reference pitch, timber and target ratios per
// register, and every bar with its blank, its shape now, its plan and its session log. Bars embed
// the contract's bar-file and session-file shapes so each can be exported to the CLI as is.

import type { BarFile, BarFileMaterial } from '../fileFormats/barFile.ts';
import type { LotBarRecord } from '../fileFormats/lotFile.ts';
import type { ChimeSetFile } from '../fileFormats/chimeSetFile.ts';
import type { KeyboardPlanRecord } from './projectKeyboardPlan.ts';
import type { Workshop } from '../fileFormats/workshopFile.ts';
import type { SolidSessionReport } from '../session/index.ts';

/** What a session aims at: a frequency or a note at an A4, ratios and tolerances. */
export interface SessionTarget {
  hz?: number;
  note?: string;
  a4?: number;
  ratios: number[];
  tolerance_cents: number[];
  /** The temperature the instrument is tuned for, °C: the instrument's playing temperature. */
  playing_temperature_c?: number;
}

/** One measured round: the bar as shaped when it was struck, and the partials heard (Hz). */
export interface SessionStep {
  bar: BarFile;
  measured_hz: number[];
  /** When the round was recorded (ISO 8601); barwright's own addition. */
  recorded_at?: string;
  /** What the model predicted for this shape before it was struck (Hz), when known. */
  predicted_hz?: number[];
  /** How the partials were taken: typed in, heard by the microphone, or read from a file. */
  source?: 'typed' | 'microphone' | 'file';
  /** The cut made since the previous step: as advised (`as-planned`) or entered by hand (`as-done`). */
  cut?: {
    made: 'as-planned' | 'as-done';
    note?: string;
    /** Length taken off since the previous round, mm (a piece tuned by trimming; barwright's addition). */
    shortened_mm?: number;
    /** Where it was taken: the free end (a hung chime) or half from each end (a bar on cords). */
    shortened_at?: 'free-end' | 'both-ends';
  };
  /** Air temperature when the bar was struck, °C. */
  air_temperature_c?: number;
  /** When the cut before this round was finished (ISO 8601). */
  cut_finished_at?: string;
  /** Caliper readings `[x_mm, thickness_mm]` taken with this round. */
  measured_thickness_mm?: [number, number][];
  /** The first twisting (torsion) mode heard with this round, Hz. */
  measured_torsion_hz?: number;
  /** The first sideways (lateral) mode heard with this round, Hz. */
  measured_lateral_hz?: number;
}

/** A place to check a cut with the caliper, and the thickness to expect there (mm). */
export interface CaliperCheckpoint {
  x_mm: number;
  thickness_mm: number;
}

/** The contract's session file (`*.session.json`). */
export interface SessionFile {
  format: 'barwright.session';
  version: 1;
  target: SessionTarget;
  limits: {
    min_thickness_mm: number;
    /** Whether advice may shorten the piece (raises every partial; costs length). Default false; a tube or rod is tuned by length alone. */
    allow_shortening?: boolean;
    /** Most length that may be taken off in all, mm (with allow_shortening). */
    max_shortening_mm?: number;
    /** Where a shortening is taken: the free end (a hung chime) or half from each end (a bar on cords). Default: free end for a tube or rod, both ends for a bar. */
    shorten_at?: 'free-end' | 'both-ends';
  };
  steps: SessionStep[];
}

/** Where a bar stands: not started, rough-cut, being tuned, or done. */
export type BarState = 'not-started' | 'rough' | 'tuning' | 'done';

/** The planned undercut, as the planner returned it. */
export interface DesignRecord {
  feasible: boolean;
  bar: BarFile;
  target_hz: number[];
  predicted_hz: number[];
  cents_error: number[];
  reason?: string;
  planned_at: string;
}

/** The last cut advice, kept so the round screen can show it after a reload. */
export interface CutAdvice {
  status: 'cut' | 'done' | 'stuck';
  bar_after: BarFile;
  predicted_hz: number[];
  calibrated_material?: BarFileMaterial;
  reason?: string;
  /** Where to check the cut with a caliper (with a cut). */
  checkpoints?: CaliperCheckpoint[];
  /** With a done verdict: what the finished bar teaches its lot (kept in the project's lots when it is marked done). */
  lot_record?: LotBarRecord;
  /** The model the advice was worked out on: absent or 'line' the line model (nextCut), 'solid' the 3D model too (nextCutSolid). */
  theory?: 'line' | 'solid';
  /** With theory 'solid': what the 3D model said (the fitted wood, the grain, how the cut was planned); null when it was not consulted. */
  solid?: SolidSessionReport | null;
  /** Number of session steps the advice was computed from (stale when steps change). */
  from_steps: number;
  advised_at: string;
}

/** A group of bars sharing target ratios, tolerances and resonator size. */
export interface Register {
  id: string;
  label: string;
  family: 'keyboard' | 'chime';
  ratios: number[];
  tolerance_cents: number[];
  /** Inner diameter of the resonator tubes under this register, mm (keyboard only). */
  resonator_inner_diameter_mm?: number;
}

/** One bar (or chime tube) of the project. */
export interface ProjectBar {
  id: string;
  note: string;
  register: string;
  state: BarState;
  /** The blank as bought and cut to length, before any undercut. */
  blank: BarFile;
  /** The bar as it is now. */
  current: BarFile;
  design: DesignRecord | null;
  session: SessionFile;
  advice: CutAdvice | null;
  /** What the calibrated model expects this shape to sound (Hz), set when an advised cut is made. */
  expected_hz?: number[];
  /** When the last cut was finished (ISO 8601), until the next round records it: the bar rests before it is struck. */
  cut_finished_at?: string;
  /** The advised cut's caliper checkpoints, until the next round records what was measured there. */
  checkpoints?: CaliperCheckpoint[];
  /** When only part of the advised cut was made: what was done (the next round's `cut.note`). */
  cut_note?: string;
  notes: string;
  updated_at: string;
}

/** The instrument a project builds. */
export interface Instrument {
  name: string;
  lowest_note: string;
  highest_note: string;
  a4_hz: number;
  /** The maker's starting guess for the timber (each bar carries its own copy). */
  material: BarFileMaterial;
  registers: Register[];
  /**
   * The playing temperature: the air temperature of the room the instrument will be played in, °C.
   * Resonators are sized for it and every bar's readings are projected to it.
   */
  air_temperature_c: number;
  /** Resonator open end: unflanged (plain tube) or flanged (end correction 0.6133 r or 0.8216 r). */
  resonator_end: 'unflanged' | 'flanged';
  /** The longest resonator tube the frame takes, mm (absent: no limit set). */
  resonator_max_length_mm?: number;
}

/** The project file, current version. */
export interface ProjectFile {
  format: 'barwright.project';
  version: 2;
  id: string;
  name: string;
  /** Increases by one on every save; a save based on an older revision is refused. */
  revision: number;
  saved_at: string | null;
  instrument: Instrument;
  bars: ProjectBar[];
  /** The whole-keyboard plan made in the workbench, with the keyboard file it came from (optional). */
  keyboard_plan?: KeyboardPlanRecord;
  /** What each lot (board or batch) of wood taught, bar by bar, from its finished bars (optional; by lot name). */
  lots?: Record<string, { bars: LotBarRecord[] }>;
  /**
   * The chime set (optional): stock, notes and tuned pitch, as a chime-set file (`barwright chime`
   * reads it as is). Its A4 is the instrument's. Files without it get one from their chime pieces when read.
   */
  chime_set?: ChimeSetFile;
  /**
   * The workshop the bars are cut in: its tools set the designer's limits for every bar and plan
   * of the project (the same section as a keyboard file's `workshop`). Absent: barwright's default
   * workshop.
   */
  workshop?: Workshop;
}

/** Current version of the project file format. */
export const projectFileVersion = 2;

/** The `format` value of a project file. */
export const projectFileFormat = 'barwright.project';
