// How a 1:1 template goes onto paper: which sheet and orientation, how many tiles a long bar
// needs, where each tile starts and how far neighbours overlap, and where the station table
// goes. Pure arithmetic in millimetres; the workbench draws what this plans.
import type { BarFile } from '../fileFormats/barFile.ts';
import { InputError } from '../fileFormats/InputError.ts';

/** The papers a template prints on, portrait size in mm (ISO 216 A4; US Letter 8.5 × 11 in). */
export const templatePapers = {
  a4: { label: 'A4', width_mm: 210, height_mm: 297 },
  letter: { label: 'US Letter', width_mm: 215.9, height_mm: 279.4 },
} as const;

/** A paper a template prints on. */
export type TemplatePaper = keyof typeof templatePapers;

/** Fixed dimensions of a template sheet, mm (the drawing is 1:1, so these are paper sizes). */
export const templateSheet = {
  /** Paper margin on every side (most printers cannot print closer to the edge). */
  margin_mm: 10,
  /** Room left and right of the bar on a tile, for the end ticks and the join marks. */
  edge_mm: 6,
  /** How far neighbouring tiles repeat the same stretch of bar, for the alignment marks. */
  overlap_mm: 20,
  /** Above the bar: two heading lines and the ruler with its figures. */
  above_mm: 26,
  /** Below the bar: thickness figures (upright, turned a quarter), legend, 100 mm scale bar, caution line. */
  below_mm: 44,
  /** Room kept between the drawing and a station table on the same sheet. */
  gap_mm: 6,
  /** A station table's heading line plus its column headings. */
  table_heading_mm: 16,
  /** The 100 mm scale bar at the head of a sheet that carries only the station table. */
  table_scale_mm: 12,
  /** One station table row as printed. */
  table_row_mm: 6,
} as const;

/** The depth a template draws of a piece, mm: a bar's blank thickness, a tube's outer diameter, a rod's diameter. */
export function templateDepth(bar: Pick<BarFile, 'section'>): number {
  const section = bar.section;
  return section.shape === 'rect' ? section.thickness_mm : section.shape === 'tube' ? section.outer_diameter_mm : section.diameter_mm;
}

/** Height of one template tile on paper, mm: the bar's depth (blank thickness or tube diameter) plus the fixed bands above and below. */
export function templateTileHeight(depth_mm: number): number {
  return templateSheet.above_mm + depth_mm + templateSheet.below_mm;
}

/** One tile: the stretch of bar it shows, mm from the left end, and its page number (1-based). */
export interface TemplateTile {
  page: number;
  from_mm: number;
  to_mm: number;
}

/** The printout of one template: sheet, orientation, tiles and the station table's pages. */
export interface TemplatePages {
  paper: TemplatePaper;
  orientation: 'portrait' | 'landscape';
  /** The sheet as it lies (landscape swaps width and height), mm. */
  sheet_width_mm: number;
  sheet_height_mm: number;
  /** The sheet less its margins, mm. */
  printable_width_mm: number;
  printable_height_mm: number;
  /** Most bar one tile can show, mm. */
  span_mm: number;
  /** How much neighbouring tiles share, mm (0 for one tile). */
  overlap_mm: number;
  tile_height_mm: number;
  tiles: TemplateTile[];
  /** Station table rows on each page that carries some; the first entry may share the last tile's page. */
  table_rows: number[];
  /** Whether the table starts on the last tile's page (below the drawing). */
  table_under_drawing: boolean;
  /** Pages printed in all. */
  pages: number;
}

/** What to lay out: the bar's length and depth (mm), the paper, and how many station table rows follow (0 for none). */
export interface TemplatePagesRequest {
  length_mm: number;
  depth_mm: number;
  paper: TemplatePaper;
  table_rows?: number;
}

/**
 * Plans the printout of a 1:1 template. Portrait when the bar (with its edges) fits across the
 * portrait sheet, else landscape; when it is longer than a landscape sheet it is tiled: each
 * tile shows `span` mm of bar and starts `span − overlap` after the one before (the last one
 * shorter), so n = ⌈(L − overlap) / (span − overlap)⌉ tiles. The station table follows, under
 * the last tile when it all fits there, else from a new page (a scale bar at its head), as many rows per page as fit.
 */
export function templatePages(request: TemplatePagesRequest, source = 'template'): TemplatePages {
  const { length_mm: length, depth_mm: depth, paper } = request;
  const rows = request.table_rows ?? 0;
  if (!(Number.isFinite(length) && length > 0)) throw new InputError(source, 'length_mm', 'must be a length greater than 0 mm');
  if (!(Number.isFinite(depth) && depth > 0)) throw new InputError(source, 'depth_mm', 'must be a depth greater than 0 mm');
  if (!Number.isInteger(rows) || rows < 0) throw new InputError(source, 'table_rows', 'must be a whole number of rows, 0 or more');
  const size = templatePapers[paper];
  if (!size) throw new InputError(source, 'paper', `must be one of ${Object.keys(templatePapers).join(', ')}`);
  const { margin_mm: margin, edge_mm: edge, overlap_mm: overlap } = templateSheet;
  const portraitSpan = size.width_mm - 2 * margin - 2 * edge;
  const orientation = length <= portraitSpan ? 'portrait' : 'landscape';
  const sheetWidth = orientation === 'portrait' ? size.width_mm : size.height_mm;
  const sheetHeight = orientation === 'portrait' ? size.height_mm : size.width_mm;
  const printableWidth = sheetWidth - 2 * margin;
  const printableHeight = sheetHeight - 2 * margin;
  const span = printableWidth - 2 * edge;
  const tileHeight = templateTileHeight(depth);
  if (tileHeight > printableHeight) throw new InputError(source, 'depth_mm', `a piece ${depth} mm deep does not fit on ${size.label} at 1:1 (at most ${Math.floor(printableHeight - templateTileHeight(0))} mm)`);
  const count = length <= span ? 1 : Math.ceil((length - overlap) / (span - overlap));
  const step = span - overlap;
  const tiles: TemplateTile[] = Array.from({ length: count }, (_, index) => ({
    page: index + 1,
    from_mm: index * step,
    to_mm: Math.min(length, index * step + span),
  }));
  // The station table: under the last tile if every row fits there, else on pages of its own.
  const rowsPerPage = Math.floor((printableHeight - templateSheet.table_scale_mm - templateSheet.table_heading_mm) / templateSheet.table_row_mm);
  const roomUnder = printableHeight - tileHeight - templateSheet.gap_mm - templateSheet.table_heading_mm;
  const underDrawing = rows > 0 && rows * templateSheet.table_row_mm <= roomUnder;
  const tableRows: number[] = [];
  if (underDrawing) tableRows.push(rows);
  else for (let left = rows; left > 0; left -= rowsPerPage) tableRows.push(Math.min(left, rowsPerPage));
  return {
    paper,
    orientation,
    sheet_width_mm: sheetWidth,
    sheet_height_mm: sheetHeight,
    printable_width_mm: printableWidth,
    printable_height_mm: printableHeight,
    span_mm: span,
    overlap_mm: count > 1 ? overlap : 0,
    tile_height_mm: tileHeight,
    tiles,
    table_rows: tableRows,
    table_under_drawing: underDrawing,
    pages: count + tableRows.length - (underDrawing ? 1 : 0),
  };
}
