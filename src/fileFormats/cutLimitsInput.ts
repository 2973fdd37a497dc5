// The workshop limits as files and command lines give them (millimetres): the session file's
// `limits`, the keyboard file's limits and the design command's options share this shape; the
// design floor resolves them against a blank (src/design/cutLimits.ts).

/** Cut limits as a file or a command line gives them (mm; every field optional). */
export interface CutLimitsInput {
  min_thickness_mm?: number;
  /** Uncut length at both ends (mm); `uncut_left_mm` / `uncut_right_mm` override one end. */
  uncut_end_mm?: number;
  uncut_left_mm?: number;
  uncut_right_mm?: number;
  /** Largest slope of the cut surface, rise over run (e.g. 0.5 ≈ 27°). */
  max_slope?: number;
  /** Smallest tool radius (mm); 0 for no limit. */
  min_tool_radius_mm?: number;
  allow_shortening?: boolean;
  max_shortening_mm?: number;
  /**
   * Where a shortening is taken (barwright's addition, sessions only): `"free-end"` for a chime hung
   * from one end, `"both-ends"` (equally) for a bar on cords. Absent: free end for a tube or rod,
   * both ends for a bar.
   */
  shorten_at?: 'free-end' | 'both-ends';
}
