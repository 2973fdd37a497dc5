import type { BarFile } from '../fileFormats/barFile.ts';
import { InputError } from '../fileFormats/InputError.ts';

/** Options of profileTemplateSvg (mm). */
export interface TemplateOptions {
  /** Heading printed above the drawing (default the bar's label). */
  readonly title?: string;
  /** A second line, e.g. the note and target partials. */
  readonly subtitle?: string;
  /** Cord-hole positions from the left end, mm, drawn as crosses at mid-height where the bar has no holes of its own (its `holes` are drawn to size). */
  readonly cord_holes_mm?: readonly number[];
  /** Length of the scale bar, mm (default 100, or less on a short bar). */
  readonly scale_bar_mm?: number;
}

const margin = 10;
const titleHeight = 18;
const footHeight = 30;
const stroke = 0.3;

function escapeXml(text: string): string {
  return text.replace(/[<>&"']/g, (c) => ({ '<': '&lt;', '>': '&gt;', '&': '&amp;', '"': '&quot;', "'": '&apos;' })[c]!);
}

const n = (value: number): string => {
  if (!Number.isFinite(value)) throw new Error('internal: non-finite coordinate in template');
  return String(Math.round(value * 1000) / 1000);
};

/** The printed size (mm) of profileTemplateSvg for a bar of this length and blank thickness (mm): the bar plus margins, title and foot. */
export function profileTemplateSize(length_mm: number, thickness_mm: number): { width_mm: number; height_mm: number } {
  return { width_mm: length_mm + 2 * margin, height_mm: margin + titleHeight + thickness_mm + footHeight + margin };
}

/**
 * A 1:1 side-profile template of a bar for printing and tracing: SVG whose width/height
 * attributes are in millimetres and whose viewBox is in millimetres, so one user unit is one mm
 * at 100 % print scale. Shows the bar (flat top, undercut profile), the blank's outline dashed,
 * the centre line, ticks every 10 mm (labelled every 50 mm) from the left end, the cord holes (the
 * bar's own drawn to size where they are drilled, with a centre line to mark from), a scale bar
 * to check the print, and a caution line.
 */
export function profileTemplateSvg(bar: BarFile, options: TemplateOptions = {}, source = 'template'): string {
  if (bar.section.shape !== 'rect') throw new InputError(source, 'section.shape', `only rect bars have a side profile (this bar is a ${bar.section.shape})`);
  const length = bar.length_mm;
  const blank = bar.section.thickness_mm;
  const pairs = bar.profile_mm ?? [
    [0, blank],
    [length, blank],
  ];
  const scaleBar = Math.min(options.scale_bar_mm ?? 100, Math.floor(length / 10) * 10 || 10);
  if (!(scaleBar > 0)) throw new InputError(source, 'scale_bar_mm', 'must be greater than 0 mm');
  const { width_mm: width, height_mm: height } = profileTemplateSize(length, blank);
  const left = margin;
  const top = margin + titleHeight;
  const parts: string[] = [];
  parts.push(`<?xml version="1.0" encoding="UTF-8"?>`);
  parts.push(`<svg xmlns="http://www.w3.org/2000/svg" width="${n(width)}mm" height="${n(height)}mm" viewBox="0 0 ${n(width)} ${n(height)}">`);
  parts.push(`<title>${escapeXml(options.title ?? bar.label ?? 'bar profile')} — 1:1 side profile</title>`);
  parts.push(`<g font-family="sans-serif" fill="black">`);
  parts.push(`<text x="${n(left)}" y="${n(margin + 4)}" font-size="4">${escapeXml(options.title ?? bar.label ?? 'Bar profile')}</text>`);
  parts.push(
    `<text x="${n(left)}" y="${n(margin + 9)}" font-size="3">${escapeXml(options.subtitle ?? `${length} mm long, blank ${blank} mm thick`)} · print at 100 % (no fit-to-page), cut on the underside</text>`,
  );
  parts.push(`</g>`);
  // Blank outline (dashed) and the bar: flat top, profile underneath.
  parts.push(`<rect x="${n(left)}" y="${n(top)}" width="${n(length)}" height="${n(blank)}" fill="none" stroke="#888" stroke-width="${stroke}" stroke-dasharray="2 1.5"/>`);
  const outline = [`M ${n(left)} ${n(top)}`, `L ${n(left + length)} ${n(top)}`];
  for (let i = pairs.length - 1; i >= 0; i--) outline.push(`L ${n(left + pairs[i]![0])} ${n(top + pairs[i]![1])}`);
  outline.push('Z');
  parts.push(`<path d="${outline.join(' ')}" fill="#f3e6d0" stroke="black" stroke-width="${stroke}"/>`);
  // Centre line.
  const centre = left + length / 2;
  parts.push(`<line x1="${n(centre)}" y1="${n(top - 4)}" x2="${n(centre)}" y2="${n(top + blank + 4)}" stroke="#06c" stroke-width="0.2" stroke-dasharray="4 1 1 1"/>`);
  parts.push(`<text x="${n(centre + 1)}" y="${n(top - 1.5)}" font-family="sans-serif" font-size="2.5" fill="#06c">centre</text>`);
  // Ticks along the top edge every 10 mm from the left end.
  for (let x = 0; x <= length + 1e-9; x += 10) {
    const major = Math.round(x) % 50 === 0;
    parts.push(`<line x1="${n(left + x)}" y1="${n(top)}" x2="${n(left + x)}" y2="${n(top - (major ? 3 : 1.5))}" stroke="black" stroke-width="0.2"/>`);
    if (major) parts.push(`<text x="${n(left + x)}" y="${n(top - 4)}" font-family="sans-serif" font-size="2.5" text-anchor="middle">${Math.round(x)}</text>`);
  }
  // Cord holes: the bar's own to size (centred in the thickness unless z_mm says), else markers.
  const thicknessAtMm = (x: number): number => {
    for (let i = 1; i < pairs.length; i++) if (x <= pairs[i]![0]) return pairs[i - 1]![1] + ((pairs[i]![1] - pairs[i - 1]![1]) * (x - pairs[i - 1]![0])) / (pairs[i]![0] - pairs[i - 1]![0]);
    return pairs[pairs.length - 1]![1];
  };
  if (bar.holes && bar.holes.length) {
    for (const hole of bar.holes) {
      const x = left + hole.x_mm;
      const local = thicknessAtMm(hole.x_mm);
      const y = top + local - (hole.z_mm ?? local / 2);
      parts.push(`<g stroke="#c00" stroke-width="0.25" fill="none"><circle cx="${n(x)}" cy="${n(y)}" r="${n(hole.diameter_mm / 2)}"/><line x1="${n(x)}" y1="${n(top - 2)}" x2="${n(x)}" y2="${n(top + blank + 2)}"/></g>`);
      parts.push(`<text x="${n(x)}" y="${n(top + blank + 4)}" font-family="sans-serif" font-size="2.5" fill="#c00" text-anchor="middle">cord hole ${n(hole.diameter_mm)} mm at ${n(hole.x_mm)}</text>`);
    }
  } else {
    for (const hole of options.cord_holes_mm ?? []) {
      const x = left + hole;
      const y = top + blank / 2;
      parts.push(`<g stroke="#c00" stroke-width="0.25" fill="none"><circle cx="${n(x)}" cy="${n(y)}" r="1.5"/><line x1="${n(x - 3)}" y1="${n(y)}" x2="${n(x + 3)}" y2="${n(y)}"/><line x1="${n(x)}" y1="${n(top)}" x2="${n(x)}" y2="${n(top + blank)}"/></g>`);
      parts.push(`<text x="${n(x)}" y="${n(top + blank + 4)}" font-family="sans-serif" font-size="2.5" fill="#c00" text-anchor="middle">cord hole ${n(hole)}</text>`);
    }
  }
  // Scale bar.
  const barY = top + blank + 12;
  parts.push(`<g stroke="black" stroke-width="0.3"><line x1="${n(left)}" y1="${n(barY)}" x2="${n(left + scaleBar)}" y2="${n(barY)}"/>`);
  for (let x = 0; x <= scaleBar + 1e-9; x += 10) parts.push(`<line x1="${n(left + x)}" y1="${n(barY - (x % 50 === 0 ? 2 : 1))}" x2="${n(left + x)}" y2="${n(barY + (x % 50 === 0 ? 2 : 1))}"/>`);
  parts.push(`</g>`);
  parts.push(`<text x="${n(left + scaleBar + 3)}" y="${n(barY + 1)}" font-family="sans-serif" font-size="3">${scaleBar} mm — measure this on the print before tracing</text>`);
  parts.push(
    `<text x="${n(left)}" y="${n(barY + 9)}" font-family="sans-serif" font-size="2.5">Estimate only: cut less than shown, measure, creep down. Power tools: guards, eye and hearing protection. Dust: extraction and a respirator. Follow local rules.</text>`,
  );
  parts.push(`</svg>`);
  return `${parts.join('\n')}\n`;
}
