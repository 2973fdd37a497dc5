// Reads what a browser test needs from a PDF that Chromium printed: each page's size and the
// rectangles drawn on it, in millimetres from the page's top-left corner. A small reader of
// PDF 1.7 (ISO 32000-1): page objects and their MediaBox (§7.7.3.3), FlateDecode content
// streams (§7.4.4, inflated with node:zlib), and in them the graphics state operators q, Q, cm,
// the path operator re and the painting operators f/f*/B/S/n with the fill colour rg
// (§8.4.4, §8.5.2, §8.5.3, §8.6.8). Enough for Chromium's own output; not a general reader.
import { inflateSync } from 'node:zlib';

/** Points per millimetre (1 pt = 1/72 in). */
const ptPerMm = 72 / 25.4;

/** A rectangle drawn on a page, mm, y from the top of the page. */
export interface PdfRect {
  x: number;
  y: number;
  width: number;
  height: number;
  painted: 'fill' | 'stroke' | 'both';
  /** Fill colour (r, g, b in 0–1) when filled. */
  fill: [number, number, number];
}

/** One printed page: its size in mm and what is drawn on it. */
export interface PdfPage {
  widthMm: number;
  heightMm: number;
  rects: PdfRect[];
}

type Matrix = [number, number, number, number, number, number];
const multiply = (m: Matrix, n: Matrix): Matrix => [m[0] * n[0] + m[1] * n[2], m[0] * n[1] + m[1] * n[3], m[2] * n[0] + m[3] * n[2], m[2] * n[1] + m[3] * n[3], m[4] * n[0] + m[5] * n[2] + n[4], m[4] * n[1] + m[5] * n[3] + n[5]];
const apply = (m: Matrix, x: number, y: number): [number, number] => [m[0] * x + m[2] * y + m[4], m[1] * x + m[3] * y + m[5]];

/** The rectangles of one content stream, in pt with y up (PDF user space). */
function contentRects(text: string): { x0: number; y0: number; x1: number; y1: number; painted: PdfRect['painted']; fill: [number, number, number] }[] {
  const out: ReturnType<typeof contentRects> = [];
  let ctm: Matrix = [1, 0, 0, 1, 0, 0];
  const stack: Matrix[] = [];
  let fill: [number, number, number] = [0, 0, 0];
  let operands: number[] = [];
  let path: { x0: number; y0: number; x1: number; y1: number }[] = [];
  // Strings and hex strings hold no operators we need: drop them before splitting into tokens.
  const tokens = text.replace(/\((?:\\.|[^\\)])*\)/g, ' ').replace(/<[0-9A-Fa-f\s]*>/g, ' ').split(/\s+/);
  for (const token of tokens) {
    if (token === '') continue;
    if (/^[-+]?(\d+\.?\d*|\.\d+)$/.test(token)) {
      operands.push(Number(token));
      continue;
    }
    const last = (count: number) => operands.slice(-count);
    switch (token) {
      case 'q':
        stack.push(ctm);
        break;
      case 'Q':
        ctm = stack.pop() ?? [1, 0, 0, 1, 0, 0];
        break;
      case 'cm':
        ctm = multiply(last(6) as Matrix, ctm);
        break;
      case 'rg':
        fill = last(3) as [number, number, number];
        break;
      case 're': {
        const [x, y, width, height] = last(4) as [number, number, number, number];
        const corners = [apply(ctm, x, y), apply(ctm, x + width, y + height)];
        path.push({ x0: Math.min(corners[0]![0], corners[1]![0]), y0: Math.min(corners[0]![1], corners[1]![1]), x1: Math.max(corners[0]![0], corners[1]![0]), y1: Math.max(corners[0]![1], corners[1]![1]) });
        break;
      }
      case 'f':
      case 'f*':
      case 'S':
      case 'B':
      case 'B*': {
        const painted = token === 'S' ? 'stroke' : token.startsWith('B') ? 'both' : 'fill';
        for (const rect of path) out.push({ ...rect, painted, fill });
        path = [];
        break;
      }
      case 'n':
        path = [];
        break;
    }
    // Any operator (these and the ones not read: text, clipping, other path segments) ends its operands.
    if (/^[A-Za-z'"*]+$/.test(token)) operands = [];
  }
  return out;
}

/**
 * The pages of a PDF in order, each with its MediaBox size (mm) and the rectangles its content
 * streams draw (mm, y measured down from the top edge).
 */
export function readPdfPages(pdf: Buffer): PdfPage[] {
  const text = pdf.toString('latin1');
  const objects = new Map<number, string>();
  for (const match of text.matchAll(/(\d+) 0 obj\s*([\s\S]*?)endobj/g)) objects.set(Number(match[1]), match[2]!);
  const streamOf = (id: number): string => {
    const body = objects.get(id);
    if (!body) return '';
    const start = text.indexOf(body) + body.indexOf('stream') + 'stream'.length;
    const from = text[start] === '\r' ? start + 2 : start + 1;
    const length = Number(/\/Length (\d+)/.exec(body)?.[1] ?? '0');
    const raw = pdf.subarray(from, from + length);
    return /\/FlateDecode/.test(body) ? inflateSync(raw).toString('latin1') : raw.toString('latin1');
  };
  // Pages in document order: walk the page tree from the catalog's /Pages.
  const rootId = Number(/\/Root (\d+) 0 R/.exec(text)?.[1]);
  const pagesId = Number(/\/Pages (\d+) 0 R/.exec(objects.get(rootId) ?? '')?.[1]);
  const leaves: number[] = [];
  const walk = (id: number) => {
    const body = objects.get(id) ?? '';
    if (/\/Type\s*\/Pages/.test(body)) for (const kid of /\/Kids\s*\[([^\]]*)\]/.exec(body)?.[1]?.matchAll(/(\d+) 0 R/g) ?? []) walk(Number(kid[1]));
    else if (/\/Type\s*\/Page\b/.test(body)) leaves.push(id);
  };
  walk(pagesId);
  return leaves.map((id) => {
    const body = objects.get(id)!;
    const box = /\/MediaBox\s*\[\s*([-\d.]+)\s+([-\d.]+)\s+([-\d.]+)\s+([-\d.]+)\s*\]/.exec(body)!.slice(1).map(Number);
    const heightPt = box[3]! - box[1]!;
    const contents = /\/Contents\s*(\[[^\]]*\]|\d+ 0 R)/.exec(body)?.[1] ?? '';
    const rects = [...contents.matchAll(/(\d+) 0 R/g)].flatMap((ref) => contentRects(streamOf(Number(ref[1]))));
    return {
      widthMm: (box[2]! - box[0]!) / ptPerMm,
      heightMm: heightPt / ptPerMm,
      rects: rects.map((rect) => ({
        x: rect.x0 / ptPerMm,
        y: (heightPt - rect.y1) / ptPerMm,
        width: (rect.x1 - rect.x0) / ptPerMm,
        height: (rect.y1 - rect.y0) / ptPerMm,
        painted: rect.painted,
        fill: rect.fill,
      })),
    };
  });
}

/**
 * Scale bars on a page, found by their make-up rather than their size: an outline (stroked
 * rectangle) whose left part holds five black blocks of equal width, side by side with a gap
 * of one block between them. Returns each outline's measured length, mm.
 */
export function scaleBarLengthsMm(page: PdfPage): number[] {
  const black = page.rects.filter((rect) => rect.painted !== 'stroke' && rect.fill.every((channel) => channel < 0.01));
  const outlines = page.rects.filter((rect) => rect.painted !== 'fill');
  const found: number[] = [];
  for (const outline of outlines) {
    const blocks = black
      .filter((rect) => Math.abs(rect.y - outline.y) < 0.2 && Math.abs(rect.height - outline.height) < 0.2 && rect.x >= outline.x - 0.2 && rect.x + rect.width <= outline.x + outline.width + 0.2)
      .sort((a, b) => a.x - b.x);
    if (blocks.length !== 5) continue;
    const width = blocks[0]!.width;
    const regular = blocks.every((block, index) => Math.abs(block.width - width) < 0.05 && Math.abs(block.x - (blocks[0]!.x + 2 * index * width)) < 0.05);
    if (regular && Math.abs(blocks[0]!.x - outline.x) < 0.2) found.push(outline.width);
  }
  return found;
}
