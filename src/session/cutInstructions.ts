import type { BarFile } from '../fileFormats/barFile.ts';
import { roundDecimals as round } from '../fileFormats/roundDecimals.ts';

/** Thickness (mm) of a bar file at a position (mm): its profile interpolated, or the blank's; 0 off the bar. */
export function fileThicknessMm(bar: BarFile, position: number): number {
  if (bar.section.shape !== 'rect') return 0;
  if (position < -1e-9 || position > bar.length_mm + 1e-9) return 0;
  const profile = bar.profile_mm;
  if (!profile || profile.length < 2) return bar.section.thickness_mm;
  for (let k = 1; k < profile.length; k++) {
    const [x1, t1] = profile[k]!;
    if (position <= x1 || k === profile.length - 1) {
      const [x0, t0] = profile[k - 1]!;
      return x1 > x0 ? t0 + ((Math.min(Math.max(position, x0), x1) - x0) / (x1 - x0)) * (t1 - t0) : t1;
    }
  }
  return profile[profile.length - 1]![1];
}

/** One station of a cut, for a maker with a caliper (mm). */
export interface CutInstructionStation {
  position_mm: number;
  thickness_now_mm: number;
  thickness_after_mm: number;
  remove_mm: number;
}

/** The cut written out for the workshop. */
export interface CutInstructions {
  /** Stations where at least 0.01 mm comes off, left to right (positions on the bar now). */
  stations: CutInstructionStation[];
  /** Where wood comes off, as [from_mm, to_mm] spans of the bar now. */
  regions_mm: [number, number][];
  /** Largest depth removed anywhere (mm). */
  max_depth_mm: number;
  /** Total length to trim, half from each end (mm); 0 when not shortening. */
  shortening_mm: number;
  /** A side view in text, top of the bar up and the undercut from below, with the cut marked under it. */
  sketch: string[];
}

/** Smallest depth (mm) listed as a cut: below a sanding pass. */
export const smallestListedDepthMm = 0.01;

const sketchColumns = 64;
const sketchRows = 6;


/**
 * The cut from `now` to `after` (bar files, mm, same stations or not) as a table of stations with
 * the thickness to reach and the depth to remove, the spans being cut, and a text sketch of the
 * bar (top flat, undercut from below; `#` wood that stays, `x` wood to remove, `^` under the
 * deepest part of the cut, `-` where a little comes off). `after` may be shorter: trimmed equally
 * from both ends.
 */
export function cutInstructions(now: BarFile, after: BarFile): CutInstructions {
  const shortening = Math.max(0, now.length_mm - after.length_mm);
  const offset = shortening / 2;
  const positions = new Set<number>();
  for (const [x] of after.profile_mm ?? []) positions.add(x + offset);
  const stations: CutInstructionStation[] = [];
  const rect = now.section.shape === 'rect';
  if (rect) {
    for (const x of [...positions].sort((a, b) => a - b)) {
      const before = fileThicknessMm(now, x);
      const later = fileThicknessMm(after, x - offset);
      const remove = before - later;
      if (remove >= smallestListedDepthMm - 1e-9) stations.push({ position_mm: round(x, 2), thickness_now_mm: round(before, 2), thickness_after_mm: round(later, 2), remove_mm: round(remove, 2) });
    }
  }
  const regions: [number, number][] = [];
  const sorted = [...positions].sort((a, b) => a - b);
  let open: number | null = null;
  let previous = 0;
  for (const x of sorted) {
    const cutHere = rect && fileThicknessMm(now, x) - fileThicknessMm(after, x - offset) >= smallestListedDepthMm - 1e-9;
    if (cutHere && open === null) open = previous;
    if (!cutHere && open !== null) {
      regions.push([round(open, 1), round(x, 1)]);
      open = null;
    }
    previous = x;
  }
  if (open !== null) regions.push([round(open, 1), round(previous, 1)]);
  const maxDepth = stations.reduce((m, s) => Math.max(m, s.remove_mm), 0);
  return { stations, regions_mm: regions, max_depth_mm: round(maxDepth, 2), shortening_mm: round(shortening, 2), sketch: sketchOf(now, after, offset, maxDepth) };
}

function sketchOf(now: BarFile, after: BarFile, offset: number, maxDepth: number): string[] {
  // A tube or rod hangs from one end and is trimmed at its free end (the same pitch as half from each end on a uniform piece).
  if (now.section.shape !== 'rect') return [`${now.section.shape} section: no undercut${offset > 0 ? `; trim ${round(2 * offset, 2)} mm off the free end (or ${round(offset, 2)} mm from each end on cords)` : ''}`];
  const blank = now.section.thickness_mm;
  const lines: string[] = [];
  const columnX = (c: number): number => ((c + 0.5) / sketchColumns) * now.length_mm;
  for (let r = 0; r < sketchRows; r++) {
    const depth = ((r + 0.5) / sketchRows) * blank;
    let line = '|';
    for (let c = 0; c < sketchColumns; c++) {
      const x = columnX(c);
      const inside = x >= offset && x <= now.length_mm - offset;
      const before = fileThicknessMm(now, x);
      const later = inside ? fileThicknessMm(after, x - offset) : 0;
      line += depth < later ? '#' : depth < before ? 'x' : ' ';
    }
    lines.push(`${line}|`);
  }
  let marks = ' ';
  for (let c = 0; c < sketchColumns; c++) {
    const x = columnX(c);
    const inside = x >= offset && x <= now.length_mm - offset;
    const removed = inside ? fileThicknessMm(now, x) - fileThicknessMm(after, x - offset) : fileThicknessMm(now, x);
    marks += !inside ? '>' : maxDepth > 0 && removed >= 0.5 * maxDepth ? '^' : removed >= smallestListedDepthMm ? '-' : ' ';
  }
  lines.push(marks.trimEnd());
  const left = '0';
  const right = `${round(now.length_mm, 1)} mm`;
  lines.push(`${left}${' '.repeat(Math.max(1, sketchColumns + 2 - left.length - right.length))}${right}`);
  return lines;
}
