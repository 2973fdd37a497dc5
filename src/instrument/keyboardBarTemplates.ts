import { profileTemplateSize, profileTemplateSvg } from '../design/profileTemplateSvg.ts';
import { stationTable } from '../design/stationTable.ts';
import { csvNumber, csvTable } from './csvTable.ts';
import type { KeyboardBarResult } from './keyboardBarResult.ts';

/** One printable file of a bar: a file name and its text, the bar's note and the printed size (mm). */
export interface BarTemplate {
  file: string;
  svg: string;
  note: string;
  width_mm: number;
  height_mm: number;
}

/** One bar's station table: a file name and its CSV text. */
export interface BarStationTable {
  file: string;
  csv: string;
}

/** File stem of a bar: its place on the keyboard and note, sharps as "s" (01-A2, 04-Cs3). */
export function barFileStem(bar: Pick<KeyboardBarResult, 'index' | 'note'>): string {
  return `${String(bar.index + 1).padStart(2, '0')}-${bar.note.replace(/#/g, 's')}`;
}

/**
 * The printable set: one 1:1 side-profile SVG per planned bar, lowest first — the designer's
 * single-bar template (profileTemplateSvg: flat top, undercut, blank outline, centre, 10 mm
 * ticks, scale bar, caution line) with the bar's note, target, blank and status in the heading
 * and its cord holes (drawn to size where the bar has them, else marked at the nodes).
 */
export function keyboardBarTemplates(bars: readonly KeyboardBarResult[]): BarTemplate[] {
  return [...bars]
    .sort((a, b) => a.midi - b.midi)
    .map((bar) => ({
      file: `${barFileStem(bar)}.svg`,
      note: bar.note,
      ...profileTemplateSize(bar.bar.length_mm, bar.bar.section.shape === 'rect' ? bar.bar.section.thickness_mm : 0),
      svg: profileTemplateSvg(
        bar.bar,
        {
          title: `${bar.note} (MIDI ${bar.midi}) — ${bar.target_hz[0]!.toFixed(2)} Hz, ratios ${bar.ratios.join(':')}`,
          subtitle: `blank ${bar.blank.length_mm} × ${bar.blank.width_mm} × ${bar.blank.thickness_mm} mm, centre ${bar.centre_thickness_mm.toFixed(1)} mm, ${bar.status}`,
          cord_holes_mm: bar.cord_holes_mm.map((x) => Math.round(x * 10) / 10),
        },
        `template ${bar.note}`,
      ),
    }));
}

/**
 * Each planned bar's thickness at regular stations (the designer's stationTable, every `stepMm`
 * mm) as CSV per RFC 4180 (header, CRLF): position from the left end and from the centre,
 * thickness and depth of cut, mm to 0.01, and a row at each cord hole marked with its diameter
 * (a `mark` column, when the bar has holes) — the table a maker marks the underside from.
 */
export function keyboardStationTables(bars: readonly KeyboardBarResult[], stepMm = 5): BarStationTable[] {
  return [...bars]
    .sort((a, b) => a.midi - b.midi)
    .map((bar) => {
      const rows = stationTable(bar.bar, stepMm, `stations ${bar.note}`);
      const marked = rows.some((row) => row.mark);
      return {
        file: `${barFileStem(bar)}.csv`,
        csv: csvTable([
          ['from_left_mm', 'from_centre_mm', 'thickness_mm', 'depth_mm', ...(marked ? ['mark'] : [])],
          ...rows.map((row) => [csvNumber(row.from_left_mm, 2), csvNumber(row.from_centre_mm, 2), csvNumber(row.thickness_mm, 2), csvNumber(row.depth_mm, 2), ...(marked ? [row.mark ?? ''] : [])]),
        ]),
      };
    });
}
