import type { BarFile } from '../fileFormats/barFile.ts';
import { InputError } from '../fileFormats/InputError.ts';
import { thicknessAt, type ThicknessProfile } from '../section/ThicknessProfile.ts';
import { roundDecimals as round } from '../fileFormats/roundDecimals.ts';

/** One row of the maker's thickness table (mm). */
export interface StationRow {
  from_left_mm: number;
  /** Signed: negative left of the centre line. */
  from_centre_mm: number;
  thickness_mm: number;
  /** Depth below the blank's full thickness. */
  depth_mm: number;
  /** What is marked at this row: a cord hole's centre (its diameter). */
  mark?: string;
}

/**
 * The thickness table a maker marks the blank from: a row every `step_mm` (default 5 mm) measured
 * out from the centre line both ways (the centre is a row), plus both ends and the centre of every
 * cord hole (marked with its diameter); each row gives the position from the left end and from
 * the centre, the thickness and the depth of cut, read off the piecewise-linear profile.
 */
export function stationTable(bar: BarFile, step_mm = 5, source = 'table'): StationRow[] {
  if (bar.section.shape !== 'rect') throw new InputError(source, 'section.shape', `only rect bars have a thickness profile (this bar is a ${bar.section.shape})`);
  if (!(step_mm >= 0.5 && step_mm <= 100)) throw new InputError(source, 'step_mm', `must be from 0.5 to 100 mm (got ${step_mm})`);
  const blank = bar.section.thickness_mm;
  const pairs = bar.profile_mm ?? [
    [0, blank],
    [bar.length_mm, blank],
  ];
  const profile: ThicknessProfile = { positions: Float64Array.from(pairs, ([x]) => x), thicknesses: Float64Array.from(pairs, ([, t]) => t) };
  const centre = bar.length_mm / 2;
  const offsets = new Set<number>([-centre, centre]);
  for (let k = 0; k * step_mm <= centre + 1e-9; k++) {
    offsets.add(k * step_mm);
    offsets.add(-k * step_mm);
  }
  const holeAt = new Map<number, string>();
  for (const hole of bar.holes ?? []) {
    const offset = round(hole.x_mm - centre, 2);
    offsets.add(offset);
    holeAt.set(offset, `cord hole ${+hole.diameter_mm.toFixed(2)} mm`);
  }
  return [...offsets]
    .filter((o) => Math.abs(o) <= centre + 1e-9)
    .sort((a, b) => a - b)
    .map((offset) => {
      const x = Math.min(bar.length_mm, Math.max(0, centre + offset));
      const thickness = thicknessAt(profile, x);
      const mark = holeAt.get(offset);
      return { from_left_mm: round(x, 2), from_centre_mm: round(offset, 2), thickness_mm: round(thickness, 2), depth_mm: round(blank - thickness, 2), ...(mark ? { mark } : {}) };
    });
}

/** The table as CSV text (header row, comma-separated, mm), for a spreadsheet or printing; a `mark` column when a row is marked (cord holes). */
export function stationTableCsv(rows: readonly StationRow[]): string {
  const marked = rows.some((row) => row.mark);
  const lines = [`from_left_mm,from_centre_mm,thickness_mm,depth_mm${marked ? ',mark' : ''}`];
  for (const row of rows) lines.push(`${row.from_left_mm},${row.from_centre_mm},${row.thickness_mm},${row.depth_mm}${marked ? `,${row.mark ?? ''}` : ''}`);
  return `${lines.join('\n')}\n`;
}
