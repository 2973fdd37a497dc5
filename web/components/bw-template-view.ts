// The printable template of one bar: the shared 1:1 template (bw-bar-template: the paper's
// orientation, tiles with alignment marks for a long bar, thickness figures, cord holes or a
// tube's nodes, a 100 mm scale bar on every sheet) and the station table after it, on A4 or US
// Letter as the maker chose last. Sizes are written in millimetres on the SVG, so the printout
// measures what the bar measures.
import { LitElement, html, css, nothing } from 'lit';
import { customElement, property, state } from 'lit/decorators.js';
import { cutInstructions, templateDepth, templatePages, templatePapers, type BarFile, type ProjectBar, type ProjectFile, type TemplatePaper } from '../../src/index.ts';
import { TaskController, workerJob } from '../controllers/TaskController.ts';
import { solver } from '../worker/SolverClient.ts';
import type { AnalyzeResult } from '../worker/solverProtocol.ts';
import { sharedStyles } from '../styles/sharedStyles.ts';
import { formatMm } from '../format.ts';
import { rememberedPaper, rememberPaper } from '../templatePaper.ts';
import './bw-bar-picker.ts';
import './bw-bar-template.ts';
import './bw-cautions.ts';

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
      @media print {
        .controls,
        .screen-only {
          display: none !important;
        }
      }
    `,
  ];

  @property({ attribute: false }) project: ProjectFile | null = null;
  @property({ attribute: 'bar-id' }) barId = '';
  @state() private paper: TemplatePaper = rememberedPaper();
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

  protected override render() {
    const project = this.project;
    const bar = this.bar;
    if (!project || !bar) return html`<p>Choose a bar in the keyboard list.</p>`;
    const shape = this.shapeToPrint(bar);
    // Cord holes only from the analysis of the very shape printed (never a previous shape's nodes).
    const analysed = this.analysis.state(bar.id);
    const nodes = analysed.valueBinding?.key === this.lastShape ? (analysed.value?.analysis.bending[0]?.nodes_mm ?? []) : [];
    const from = this.which === 'advice' ? bar.current : bar.blank;
    const table = shape.section.shape === 'rect' && shape.profile_mm ? cutInstructions(from, shape) : null;
    const what = this.which === 'advice' ? 'after the advised cut' : this.which === 'design' ? 'planned undercut' : 'as it is now';
    const heading = `${bar.note}${shape.label && shape.label !== bar.note ? ` · ${shape.label}` : ''} · ${what} · ${formatMm(shape.length_mm)} mm long`;
    const tableHeading = `${bar.note}: stations, mm from the left end${nodes.length && shape.section.shape === 'rect' ? ` · cord holes ${nodes.map((node) => formatMm(node)).join(' and ')}` : ''} · ${this.which === 'advice' ? '“now” = the bar as it is' : '“now” = the uncut blank'}`;
    const paper = templatePapers[this.paper];
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
          <select id="paper" @change=${(event: Event) => this.choosePaper((event.target as HTMLSelectElement).value as TemplatePaper)}>
            ${(Object.keys(templatePapers) as TemplatePaper[]).map((name) => html`<option value=${name} ?selected=${name === this.paper}>${templatePapers[name].label}</option>`)}
          </select>
        </div>
        <button class="primary" @click=${() => window.print()}>Print this template</button>
      </div>
      <p class="screen-only muted" data-testid="template-summary">${this.summary(shape, table?.stations.length ?? 0)} In the print dialog keep ${paper.label}, scale 100 % (no “fit to page”), and check the 100 mm bar with a rule.</p>
      <bw-cautions class="screen-only"></bw-cautions>
      <bw-bar-template final .bar=${shape} .nodesMm=${nodes} .table=${table} heading=${heading} table-heading=${tableHeading} paper=${this.paper}></bw-bar-template>
      ${nothing}`;
  }

  private choosePaper(paper: TemplatePaper): void {
    this.paper = paper;
    rememberPaper(paper);
  }

  /** "3 landscape sheets of A4 (2 for the drawing, overlapping 20 mm; 1 for the station table)." */
  private summary(shape: BarFile, rows: number): string {
    const layout = templatePages({ length_mm: shape.length_mm, depth_mm: templateDepth(shape), paper: this.paper, table_rows: rows });
    const tableSheets = layout.table_rows.length - (layout.table_under_drawing ? 1 : 0);
    return `${layout.pages} ${layout.orientation} sheet${layout.pages === 1 ? '' : 's'} of ${templatePapers[this.paper].label} at true scale (1:1): ${layout.tiles.length} for the drawing${layout.tiles.length > 1 ? `, overlapping ${formatMm(layout.overlap_mm, 0)} mm — cut each later sheet along its dashed line and lay it on the solid line of the sheet before` : ''}${tableSheets > 0 ? `, ${tableSheets} for the station table` : layout.table_under_drawing ? ', the station table under it' : ''}.`;
  }
}

declare global {
  interface HTMLElementTagNameMap {
    'bw-template-view': BwTemplateView;
  }
}
