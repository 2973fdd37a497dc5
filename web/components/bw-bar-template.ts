// One bar's printed template, the same for a single bar and for every bar of a plan: the side
// profile at 1:1 (one user unit is one millimetre, the SVG sized in mm), on the chosen paper and
// orientation, tiled with alignment marks when the bar is longer than a sheet, the thickness at
// each station in upright figures under the bar, cord holes (or a tube's nodes), a 100 mm scale
// bar on every sheet, and the station table after the drawing. The paper plan (orientation,
// tiles, overlap, the table's pages) is the library's templatePages.
import { LitElement, html, svg, css, nothing } from 'lit';
import { customElement, property } from 'lit/decorators.js';
import { templateDepth, templatePages, templateSheet, type BarFile, type CutInstructions, type TemplatePages, type TemplatePaper, type TemplateTile } from '../../src/index.ts';
import { sharedStyles } from '../styles/sharedStyles.ts';
import { formatMm } from '../format.ts';
import { templatePageName, writeTemplatePageRules } from '../templatePaper.ts';
import './bw-station-table.ts';

/** Smallest gap between two thickness figures under the bar, mm (the figures are 3 mm type turned upright). */
const figureSpacingMm = 3.6;
const ink = '#000000';

/** The 100 mm scale bar at (x, y) mm: an outline with five black 10 mm blocks, to check the print with a rule. */
function scaleBar(x: number, y: number) {
  return svg`<g transform=${`translate(${x} ${y})`} data-testid="scale-bar">
    <rect x="0" y="0" width="100" height="3" fill="none" stroke=${ink} stroke-width="0.3"></rect>
    ${[0, 2, 4, 6, 8].map((block) => svg`<rect x=${block * 10} y="0" width="10" height="3" fill=${ink}></rect>`)}
    <text x="0" y="7.5" font-size="3">0</text>
    <text x="50" y="7.5" font-size="3" text-anchor="middle">check with a rule</text>
    <text x="100" y="7.5" font-size="3" text-anchor="end">100 mm</text>
  </g>`;
}

/** `<bw-bar-template .bar .nodesMm .table heading paper final>` */
@customElement('bw-bar-template')
export class BwBarTemplate extends LitElement {
  static override styles = [
    sharedStyles,
    css`
      :host {
        display: block;
      }
      .sheet {
        background: #ffffff;
        color: #000000;
        border: 1px solid var(--bw-line-soft);
        padding: 0.5rem;
        margin-bottom: 1rem;
        overflow-x: auto;
      }
      .sheet.break {
        break-after: page;
      }
      svg {
        display: block;
        max-width: none;
      }
      svg text {
        font-family: var(--bw-font);
        fill: #000000;
      }
      .table-part h3 {
        margin: 0 0 0.3rem;
        font-size: 1.05rem;
      }
      @media print {
        .sheet {
          border: none;
          padding: 0;
          margin: 0;
          overflow: visible;
          break-inside: avoid;
        }
        .table-part.under {
          margin-top: ${templateSheet.gap_mm}mm;
        }
        .table-part h3 {
          height: 6mm;
          margin: 0;
          font-size: 10pt;
          white-space: nowrap;
          line-height: 6mm;
          overflow: hidden;
        }
      }
    `,
  ];

  /** The shape to draw (mm). */
  @property({ attribute: false }) bar: BarFile | null = null;
  /** The fundamental's nodes, mm from the left end: cord holes on a bar, supports on a tube. */
  @property({ attribute: false }) nodesMm: readonly number[] = [];
  /** The cut from the blank (or the bar now) to this shape; its stations make the printed table. */
  @property({ attribute: false }) table: CutInstructions | null = null;
  /** First heading line on every sheet (the note and what is printed). */
  @property() heading = '';
  /** Heading over the station table. */
  @property({ attribute: 'table-heading' }) tableHeading = '';
  @property() paper: TemplatePaper = 'a4';
  /** The last thing printed: no page break after it. */
  @property({ type: Boolean }) final = false;

  /** The paper plan of what is drawn now (the print test reads it to know the pages to expect). */
  layout(): TemplatePages | null {
    const bar = this.bar;
    if (!bar) return null;
    return templatePages({ length_mm: bar.length_mm, depth_mm: templateDepth(bar), paper: this.paper, table_rows: this.table?.stations.length ?? 0 });
  }

  private renderTile(bar: BarFile, layout: TemplatePages, tile: TemplateTile) {
    const depth = templateDepth(bar);
    const pages = layout.pages;
    const width = layout.printable_width_mm;
    const height = layout.tile_height_mm;
    const edge = templateSheet.edge_mm;
    const top = templateSheet.above_mm;
    const bottom = top + depth;
    const { from_mm: from, to_mm: to } = tile;
    const x = (position: number) => edge + position - from;
    const rect = bar.section.shape === 'rect';
    const profile: [number, number][] = rect && bar.profile_mm ? bar.profile_mm : [];
    const outline: [number, number][] = profile.length
      ? profile
      : [
          [0, depth],
          [bar.length_mm, depth],
        ];
    const piece = `${x(0)},${top} ${x(bar.length_mm)},${top} ${[...outline].reverse().map(([position, t]) => `${x(position)},${top + t}`).join(' ')}`;
    const clipId = `tile-${tile.page}`;
    const ticks: number[] = [];
    for (let mark = Math.ceil(from / 10) * 10; mark <= to + 1e-9; mark += 10) ticks.push(mark);
    // Thickness figures: every station on this tile, skipping one closer than the type allows to the last one shown.
    const figures: [number, number][] = [];
    for (const station of profile) if (station[0] >= from - 1e-9 && station[0] <= to + 1e-9 && (figures.length === 0 || station[0] - figures.at(-1)![0] >= figureSpacingMm)) figures.push(station);
    const skipped = profile.filter(([position]) => position >= from - 1e-9 && position <= to + 1e-9).length - figures.length;
    const holes = rect && bar.holes?.length ? bar.holes.map((hole) => hole.x_mm) : [...this.nodesMm];
    const holesHere = holes.filter((hole) => hole >= from && hole <= to);
    const previous = tile.page > 1 ? from + layout.overlap_mm / 2 : null;
    const next = tile.page < layout.tiles.length ? to - layout.overlap_mm / 2 : null;
    // Ruler figures give way to the ⊕ marks of a join.
    const joins = [previous, next].filter((join): join is number => join !== null);
    const target = (at: number, y: number) => svg`<circle cx=${x(at)} cy=${y} r="2.5" fill="none" stroke=${ink} stroke-width="0.3"></circle><line x1=${x(at) - 3.5} y1=${y} x2=${x(at) + 3.5} y2=${y} stroke=${ink} stroke-width="0.3"></line><line x1=${x(at)} y1=${y - 3.5} x2=${x(at)} y2=${y + 3.5} stroke=${ink} stroke-width="0.3"></line>`;
    const scaleTop = bottom + 25;
    const legend = rect
      ? profile.length
        ? `Figures under the bar: thickness in mm at each station${skipped > 0 ? ` (${skipped} close ones only in the table)` : ''}.`
        : `No undercut: ${formatMm(depth)} mm thick throughout.`
      : `Outer diameter ${formatMm(depth)} mm.`;
    const holeWords = holesHere.map((hole) => (rect ? `Cord hole at ${formatMm(hole)} mm.` : `Node at ${formatMm(hole)} mm: hang or support here.`)).join(' ');
    return svg`<svg xmlns="http://www.w3.org/2000/svg" width="${width}mm" height="${height}mm" viewBox="0 0 ${width} ${height}" data-testid="template-tile" data-page=${tile.page} role="img" aria-label=${`${this.heading}: sheet ${tile.page} of ${pages}, ${formatMm(from, 0)} to ${formatMm(to, 0)} mm from the left end, 1:1`}>
      <defs><clipPath id=${clipId}><rect x=${x(from)} y="0" width=${to - from} height=${height}></rect></clipPath></defs>
      <text x=${edge} y="5" font-size="4.2" font-weight="700">${this.heading} · page ${tile.page} of ${pages}</text>
      <text x=${edge} y="10" font-size="3">${layout.tiles.length > 1 ? `This sheet: ${formatMm(from, 0)}–${formatMm(to, 0)} mm from the left end; sheets overlap ${formatMm(layout.overlap_mm, 0)} mm. ` : ''}1:1 — print at 100 % (no “fit to page”), check the 100 mm bar.</text>
      ${ticks.map((mark) => svg`<line x1=${x(mark)} y1=${top - (mark % 50 === 0 ? 5 : 2.5)} x2=${x(mark)} y2=${top} stroke=${ink} stroke-width="0.25"></line>${mark % 50 === 0 && !joins.some((join) => Math.abs(join - mark) < 6) ? svg`<text x=${x(mark)} y=${top - 6} font-size="3" text-anchor="middle">${mark}</text>` : nothing}`)}
      ${previous !== null ? svg`<rect x=${x(from)} y=${top - 12} width=${previous - from} height=${depth + 26} fill="#e4e4e4" data-testid="trim-strip"></rect>` : nothing}
      <g clip-path=${`url(#${clipId})`}>
        ${profile.length ? svg`<rect x=${x(0)} y=${top} width=${bar.length_mm} height=${depth} fill="none" stroke="#666666" stroke-width="0.25" stroke-dasharray="2 1.5"></rect>` : nothing}
        <polygon points=${piece} fill=${rect ? '#f1e6cf' : '#dde0e4'} stroke=${ink} stroke-width="0.35"></polygon>
        ${holes.map((hole) => {
          const radius = rect ? (bar.holes?.find((drilled) => drilled.x_mm === hole)?.diameter_mm ?? 3) / 2 : 1.5;
          return svg`<line x1=${x(hole)} y1=${top - 2} x2=${x(hole)} y2=${bottom + 2} stroke=${ink} stroke-width="0.3" stroke-dasharray="1.5 1"></line><circle cx=${x(hole)} cy=${top + depth / 2} r=${radius} fill="#ffffff" stroke=${ink} stroke-width="0.3"></circle><text x=${x(hole) + radius + 0.8} y=${top + depth / 2 - radius + 0.4} font-size="3" data-testid="hole-figure">${formatMm(hole)}</text>`;
        })}
      </g>
      ${figures.map(
        ([position, t]) =>
          svg`<line x1=${x(position)} y1=${top + t} x2=${x(position)} y2=${bottom + 1.5} stroke=${ink} stroke-width="0.15"></line><text transform=${`translate(${x(position) + 1.05} ${bottom + 2.2}) rotate(-90)`} font-size="3" text-anchor="end" data-testid="thickness-figure">${formatMm(t)}</text>`,
      )}
      ${previous !== null ? svg`<g data-testid="join-mark"><line x1=${x(previous)} y1=${top - 12} x2=${x(previous)} y2=${bottom + 14} stroke=${ink} stroke-width="0.4" stroke-dasharray="2 1"></line>${target(previous, top - 8)}${target(previous, bottom + 12)}<text x=${x(from) + 0.5} y=${bottom + 19} font-size="2.8">✂ cut along the dashed line, lay the cut edge on page ${tile.page - 1}'s solid line, ⊕ on ⊕</text></g>` : nothing}
      ${next !== null ? svg`<g data-testid="join-mark"><line x1=${x(next)} y1=${top - 12} x2=${x(next)} y2=${bottom + 14} stroke=${ink} stroke-width="0.4"></line>${target(next, top - 8)}${target(next, bottom + 12)}<text x=${x(to) - 0.5} y=${bottom + 19} font-size="2.8" text-anchor="end">page ${tile.page + 1}'s cut edge goes on this line ▶</text></g>` : nothing}
      <text x=${edge} y=${bottom + (previous !== null || next !== null ? 23 : 17)} font-size="3">${legend} ${holeWords}</text>
      ${scaleBar(edge, scaleTop)}
      <text x=${edge} y=${height - 2} font-size="2.8">Cut less than predicted, then strike and measure again · guards on, eye and hearing protection · dust extraction and a respirator.</text>
    </svg>`;
  }

  private renderTable(layout: TemplatePages, table: CutInstructions, part: number, first: number, count: number) {
    const parts = layout.table_rows.length;
    const shortening = table.shortening_mm > 0.005 && part === 0 ? ` First shorten: ${formatMm(table.shortening_mm / 2, 1)} mm off each end.` : '';
    return html`<section class="table-part ${layout.table_under_drawing ? 'under' : ''}" data-testid="table-part">
      <h3>${this.tableHeading}${parts > 1 ? ` (${part + 1} of ${parts})` : ''}.${shortening}</h3>
      <bw-station-table printed .plan=${{ ...table, stations: table.stations.slice(first, first + count) }}></bw-station-table>
    </section>`;
  }

  protected override updated(): void {
    writeTemplatePageRules(this.paper);
  }

  protected override render() {
    const bar = this.bar;
    const layout = this.layout();
    if (!bar || !layout) return nothing;
    const page = `page: ${templatePageName(layout.orientation)}`;
    const table = this.table && this.table.stations.length ? this.table : null;
    const sheets: unknown[] = [];
    const lastPage = layout.pages;
    layout.tiles.forEach((tile, index) => {
      const last = index === layout.tiles.length - 1;
      const withTable = last && table && layout.table_under_drawing;
      const breaks = !(this.final && tile.page === lastPage);
      sheets.push(html`<div class="sheet ${breaks ? 'break' : ''}" style=${page}>${this.renderTile(bar, layout, tile)}${withTable ? this.renderTable(layout, table, 0, 0, table.stations.length) : nothing}</div>`);
    });
    if (table && !layout.table_under_drawing) {
      let first = 0;
      layout.table_rows.forEach((count, part) => {
        const breaks = !(this.final && part === layout.table_rows.length - 1);
        const scale = templateSheet.table_scale_mm;
        sheets.push(
          html`<div class="sheet ${breaks ? 'break' : ''}" style=${page}>
            <svg xmlns="http://www.w3.org/2000/svg" width="110mm" height="${scale}mm" viewBox="0 0 110 ${scale}" role="img" aria-label="100 mm scale bar">${scaleBar(templateSheet.edge_mm, 1)}</svg>${this.renderTable(layout, table, part, first, count)}
          </div>`,
        );
        first += count;
      });
    }
    return sheets;
  }
}

declare global {
  interface HTMLElementTagNameMap {
    'bw-bar-template': BwBarTemplate;
  }
}
