// The printable template: the bar's side profile at true scale (1:1 in both directions), split
// over as many landscape pages as its length needs with join marks, cord holes marked, a 100 mm
// scale bar to check the printer, and the station table. Sizes are written in millimetres on
// the SVG, so the printout measures what the bar measures.
import { LitElement, html, svg, css, nothing } from 'lit';
import { customElement, property, state } from 'lit/decorators.js';
import { cutInstructions, type BarFile, type ProjectBar, type ProjectFile } from '../../src/index.ts';
import { TaskController, workerJob } from '../controllers/TaskController.ts';
import { solver } from '../worker/SolverClient.ts';
import type { AnalyzeResult } from '../worker/solverProtocol.ts';
import { sharedStyles } from '../styles/sharedStyles.ts';
import { formatMm, formatWhen } from '../format.ts';
import './bw-bar-picker.ts';
import './bw-station-table.ts';
import './bw-cautions.ts';

/** Printable area of the supported papers in landscape (10 mm margins), mm. */
const papers = {
  'a4-landscape': { label: 'A4 landscape', width: 277, height: 190 },
  'letter-landscape': { label: 'US Letter landscape', width: 259, height: 195 },
} as const;

type PaperName = keyof typeof papers;

/** Space inside a tile around the bar: left/right for the join marks, top for the ruler. */
const inset = { left: 12, right: 12, top: 24 };

/** `<bw-template-view .project bar-id>` */
@customElement('bw-template-view')
export class BwTemplateView extends LitElement {
  static override styles = [
    sharedStyles,
    css`
      :host {
        display: block;
      }
      .controls {
        display: flex;
        flex-wrap: wrap;
        gap: 0.8rem 1.4rem;
        align-items: end;
        margin-bottom: 1rem;
      }
      .select-field {
        display: grid;
        gap: 0.2rem;
      }
      .sheet-scroll {
        overflow-x: auto;
        background: #ffffff;
        border: 1px solid var(--bw-line-soft);
        padding: 0.5rem;
        margin-bottom: 1rem;
      }
      .tile {
        display: block;
        max-width: none;
        background: #ffffff;
      }
      .tile text {
        font-family: var(--bw-font);
        fill: #000000;
      }
      .print-only {
        display: none;
      }
      .page-break {
        break-after: page;
      }
      @media print {
        .controls,
        .screen-only {
          display: none !important;
        }
        .print-only {
          display: block;
        }
        .sheet-scroll {
          overflow: visible;
          border: none;
          padding: 0;
          margin: 0;
        }
        .tile {
          break-inside: avoid;
        }
      }
    `,
  ];

  @property({ attribute: false }) project: ProjectFile | null = null;
  @property({ attribute: 'bar-id' }) barId = '';
  @state() private paper: PaperName = 'a4-landscape';
  @state() private which: 'current' | 'advice' | 'design' = 'current';

  /** The fundamental's nodes of the shape printed, per bar (for the cord holes). */
  private readonly analysis = new TaskController<AnalyzeResult>(this, { policy: 'latest' });
  private lastShape = '';

  private get bar(): ProjectBar | null {
    return this.project?.bars.find((bar) => bar.id === this.barId) ?? null;
  }

  private shapeToPrint(bar: ProjectBar): BarFile {
    if (this.which === 'advice' && bar.advice && bar.advice.status === 'cut') return bar.advice.bar_after;
    if (this.which === 'design' && bar.design) return bar.design.bar;
    return bar.current;
  }

  protected override willUpdate(): void {
    const bar = this.bar;
    if (!bar) return;
    const shape = this.shapeToPrint(bar);
    const key = JSON.stringify(shape);
    if (key !== this.lastShape) {
      this.lastShape = key;
      this.analysis.run({ subject: bar.id, key }, workerJob(solver, 'analyze', { bar: shape, modes: 1, withShapes: false, withSensitivities: false }));
    }
  }

  /** One page-wide tile showing [from, to] mm of the bar at 1:1. */
  private renderTile(shape: BarFile, bar: ProjectBar, from: number, to: number, page: number, pages: number, nodes: number[]) {
    const paper = papers[this.paper];
    const thickness = shape.section.shape === 'rect' ? shape.section.thickness_mm : shape.section.shape === 'tube' ? shape.section.outer_diameter_mm : shape.section.diameter_mm;
    const profile: [number, number][] =
      shape.section.shape === 'rect' && shape.profile_mm
        ? shape.profile_mm
        : [
            [0, thickness],
            [shape.length_mm, thickness],
          ];
    const height = Math.min(paper.height, Math.max(80, inset.top + thickness + 52));
    const x = (position: number) => inset.left + position - from;
    const inside = profile.filter(([position]) => position >= from - 1e-9 && position <= to + 1e-9);
    const clipId = `clip-${page}`;
    const woodPoints = `${x(0)},${inset.top} ${x(shape.length_mm)},${inset.top} ${[...profile].reverse().map(([position, t]) => `${x(position)},${inset.top + t}`).join(' ')}`;
    const ticks: number[] = [];
    for (let mark = Math.ceil(from / 10) * 10; mark <= to + 1e-9; mark += 10) ticks.push(mark);
    const labelStep = Math.max(1, Math.ceil(inside.length / 24));
    const barBottom = inset.top + thickness;
    return html`<svg class="tile" xmlns="http://www.w3.org/2000/svg" width="${paper.width}mm" height="${height}mm" viewBox="0 0 ${paper.width} ${height}" data-testid="template-tile" role="img" aria-label=${`Template page ${page} of ${pages}: ${formatMm(from)} to ${formatMm(to)} mm`}>
      <defs><clipPath id=${clipId}><rect x=${inset.left} y="0" width=${to - from} height=${height}></rect></clipPath></defs>
      <text x=${inset.left} y="6" font-size="4.2" font-weight="700">barwright template · ${bar.note}${shape.label && shape.label !== bar.note ? ` · ${shape.label}` : ''} · page ${page} of ${pages} · ${formatMm(from, 0)}–${formatMm(to, 0)} mm from the left end · 1:1</text>
      <text x=${inset.left} y="11.5" font-size="3.2">Printed ${formatWhen(new Date().toISOString())}. Print at 100 % (no “fit to page”); check the 100 mm bar below with a ruler before cutting.</text>
      ${ticks.map((mark) => svg`<line x1=${x(mark)} y1=${inset.top - (mark % 50 === 0 ? 6 : 3)} x2=${x(mark)} y2=${inset.top} stroke="#000" stroke-width="0.25"></line>${mark % 50 === 0 ? svg`<text x=${x(mark)} y=${inset.top - 7} font-size="3" text-anchor="middle">${mark}</text>` : nothing}`)}
      <g clip-path=${`url(#${clipId})`}>
        <polygon points=${woodPoints} fill="#efe6d2" stroke="#000" stroke-width="0.35"></polygon>
        ${nodes.map((node) => svg`<line x1=${x(node)} y1=${inset.top - 2} x2=${x(node)} y2=${barBottom + 4} stroke="#000" stroke-width="0.3" stroke-dasharray="1.5 1"></line><circle cx=${x(node)} cy=${inset.top + thickness / 2} r="1.5" fill="none" stroke="#000" stroke-width="0.3"></circle><line x1=${x(node) - 2.5} y1=${inset.top + thickness / 2} x2=${x(node) + 2.5} y2=${inset.top + thickness / 2} stroke="#000" stroke-width="0.2"></line>`)}
      </g>
      ${inside.map(([position, t], index) => (index % labelStep === 0 ? svg`<line x1=${x(position)} y1=${inset.top + t} x2=${x(position)} y2=${barBottom + 2.5} stroke="#000" stroke-width="0.15"></line><text x=${x(position)} y=${barBottom + 6.5} font-size="2.6" text-anchor="middle">${formatMm(t)}</text>` : nothing))}
      <text x=${inset.left} y=${barBottom + 11} font-size="3">${shape.section.shape === 'rect' ? 'Numbers under the bar: thickness (mm) at each station.' : 'Numbers under the piece: its outer diameter (mm).'} ${nodes.filter((node) => node >= from && node <= to).map((node) => (shape.section.shape === 'rect' ? `Cord hole at ${formatMm(node)} mm. ` : `Node at ${formatMm(node)} mm: hang or support here. `)).join('')}</text>
      ${page > 1 ? svg`<line x1=${inset.left} y1=${inset.top - 10} x2=${inset.left} y2=${barBottom + 8} stroke="#000" stroke-width="0.4"></line><text x=${inset.left + 1} y=${barBottom + 15} font-size="2.8">◀ join to page ${page - 1}</text>` : nothing}
      ${page < pages ? svg`<line x1=${inset.left + to - from} y1=${inset.top - 10} x2=${inset.left + to - from} y2=${barBottom + 8} stroke="#000" stroke-width="0.4"></line><text x=${inset.left + to - from - 1} y=${barBottom + 15} font-size="2.8" text-anchor="end">join to page ${page + 1} ▶</text>` : nothing}
      <g transform=${`translate(${inset.left} ${height - 14})`} data-testid="scale-bar">
        <rect x="0" y="0" width="100" height="3" fill="none" stroke="#000" stroke-width="0.3"></rect>
        ${[0, 1, 2, 3, 4, 5, 6, 7, 8, 9].map((i) => (i % 2 === 0 ? svg`<rect x=${i * 10} y="0" width="10" height="3" fill="#000"></rect>` : nothing))}
        <text x="0" y="8" font-size="3">0</text>
        <text x="100" y="8" font-size="3" text-anchor="end">100 mm — measure this bar to check the printer's scale</text>
      </g>
      <text x=${paper.width - inset.right} y=${height - 3} font-size="2.8" text-anchor="end">Cut less than predicted · guards on, eye and hearing protection · dust extraction and respirator</text>
    </svg>`;
  }

  protected override render() {
    const project = this.project;
    const bar = this.bar;
    if (!project || !bar) return html`<p>Choose a bar in the keyboard list.</p>`;
    const shape = this.shapeToPrint(bar);
    const paper = papers[this.paper];
    const span = paper.width - inset.left - inset.right;
    const pages = Math.max(1, Math.ceil(shape.length_mm / span));
    const segment = shape.length_mm / pages;
    // Cord holes only from the analysis of the very shape printed (never a previous shape's nodes).
    const analysed = this.analysis.state(bar.id);
    const nodes = analysed.valueBinding?.key === this.lastShape ? (analysed.value?.analysis.bending[0]?.nodes_mm ?? []) : [];
    const tiles = Array.from({ length: pages }, (_, index) => [index * segment, index === pages - 1 ? shape.length_mm : (index + 1) * segment] as const);
    const from = this.which === 'advice' ? bar.current : bar.blank;
    const table = shape.section.shape === 'rect' && shape.profile_mm ? cutInstructions(from, shape) : null;
    return html`<div class="controls">
        <bw-bar-picker .bars=${project.bars} bar-id=${bar.id}></bw-bar-picker>
        <div class="select-field">
          <label for="which">Shape to print</label>
          <select id="which" @change=${(event: Event) => (this.which = (event.target as HTMLSelectElement).value as typeof this.which)}>
            <option value="current" ?selected=${this.which === 'current'}>The bar as it is now</option>
            <option value="advice" ?disabled=${!(bar.advice && bar.advice.status === 'cut')} ?selected=${this.which === 'advice'}>After the advised next cut</option>
            <option value="design" ?disabled=${!bar.design} ?selected=${this.which === 'design'}>The planned undercut</option>
          </select>
        </div>
        <div class="select-field">
          <label for="paper">Paper</label>
          <select id="paper" @change=${(event: Event) => (this.paper = (event.target as HTMLSelectElement).value as PaperName)}>
            ${Object.entries(papers).map(([name, value]) => html`<option value=${name} ?selected=${name === this.paper}>${value.label}</option>`)}
          </select>
        </div>
        <button class="primary" @click=${() => window.print()}>Print this template</button>
      </div>
      <p class="screen-only muted">${pages} page${pages === 1 ? '' : 's'} at true scale (1:1). In the print dialog choose ${paper.label}, scale 100 %, and check the 100 mm bar with a ruler.</p>
      <bw-cautions class="screen-only"></bw-cautions>
      ${tiles.map(([from, to], index) => html`<div class="sheet-scroll ${index < tiles.length - 1 || table ? 'page-break' : ''}">${this.renderTile(shape, bar, from, to, index + 1, pages, nodes)}</div>`)}
      ${table
        ? html`<section>
            <h3>${bar.note}: stations, thickness in mm${nodes.length ? html`; cord holes at ${nodes.map((node) => formatMm(node)).join(' mm and ')} mm from the left end` : nothing}</h3>
            <p>${this.which === 'advice' ? '“Now” is the bar as it is now; take off the difference.' : '“Now” is the uncut blank; “after” is the shape printed above.'}</p>
            <bw-station-table .plan=${table}></bw-station-table>
          </section>`
        : nothing}`;
  }
}

declare global {
  interface HTMLElementTagNameMap {
    'bw-template-view': BwTemplateView;
  }
}
