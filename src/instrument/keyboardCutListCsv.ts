import { csvNumber, csvTable } from './csvTable.ts';
import type { KeyboardBarResult } from './keyboardBarResult.ts';

/** Header of the keyboard cut list, in column order. */
export const keyboardCutListColumns = [
  'note', 'midi', 'target_hz', 'blank_length_mm', 'blank_width_mm', 'blank_thickness_mm', 'centre_thickness_mm', 'thinnest_mm',
  'arch_start_mm', 'arch_end_mm', 'arch_extent_mm', 'cord_hole_1_mm', 'cord_hole_2_mm', 'resonator_length_mm', 'resonator_bore_mm',
  'ratios', 'status', 'reason',
] as const;

/**
 * The keyboard's cut list as CSV (RFC 4180: header row, CRLF record ends, quoting where needed),
 * one row per bar from the lowest: note, MIDI, target fundamental (0.01 Hz), blank length ×
 * width × thickness, centre and thinnest thickness, arch start/end/extent, cord holes from the
 * left end, resonator length and bore (all mm to 0.1), the tuned ratios ("1:4:10"), the status
 * and any reason it is flagged. Empty cells where a value does not apply (no arch, no resonator).
 */
export function keyboardCutListCsv(bars: readonly KeyboardBarResult[]): string {
  const mm = (value: number | undefined): string => (value === undefined ? '' : csvNumber(value, 1));
  const rows = [...bars]
    .sort((a, b) => a.midi - b.midi)
    .map((bar) => [
      bar.note,
      String(bar.midi),
      csvNumber(bar.target_hz[0]!, 2),
      mm(bar.blank.length_mm),
      mm(bar.blank.width_mm),
      mm(bar.blank.thickness_mm),
      mm(bar.centre_thickness_mm),
      mm(bar.thinnest_mm),
      mm(bar.arch?.start_mm),
      mm(bar.arch?.end_mm),
      mm(bar.arch?.extent_mm),
      mm(bar.cord_holes_mm[0]),
      mm(bar.cord_holes_mm[1]),
      mm(bar.resonator?.length_mm),
      mm(bar.resonator?.inner_diameter_mm),
      bar.ratios.map((r) => String(r)).join(':'),
      bar.status,
      bar.reason ?? '',
    ]);
  return csvTable([[...keyboardCutListColumns], ...rows]);
}
