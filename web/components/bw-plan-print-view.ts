// The print view of a keyboard plan: every planned bar's 1:1 template in the same style as a
// single bar's (bw-bar-template: the planned undercut with its thickness figures, cord holes at
// the planned bar's nodes, a 100 mm scale bar on every sheet, tiled with alignment marks when a
// bar is longer than the sheet), lowest bar first, each bar starting on a new sheet of the paper
// the maker chose (A4 or US Letter, remembered).
import { LitElement, html, css } from 'lit';
import { customElement, property, state } from 'lit/decorators.js';
import { templateDepth, templatePages, templatePapers, type ProjectFile, type StoredKeyboardBar, type TemplatePaper } from '../../src/index.ts';
import { sharedStyles } from '../styles/sharedStyles.ts';
import { NavigateEvent } from '../events.ts';
import { formatMm } from '../format.ts';
import { rememberedPaper, rememberPaper } from '../templatePaper.ts';
import './bw-bar-template.ts';
import './bw-cautions.ts';

/** `<bw-plan-print-view .project>` */
@customElement('bw-plan-print-view')
export class BwPlanPrintView extends LitElement {
  static override styles = [
    sharedStyles,
    css`
      :host {
        display: block;
      }
      .controls {
        display: flex;
        flex-wrap: wrap;
        gap: 0.6rem 1.2rem;
        align-items: end;
        margin-bottom: 0.8rem;
      }
      .select-field {
        display: grid;
        gap: 0.2rem;
      }
      @media print {
        .screen-only {
          display: none !important;
        }
      }
    `,
  ];

  @property({ attribute: false }) project: ProjectFile | null = null;
  @state() private paper: TemplatePaper = rememberedPaper();

  /** The planned bars, lowest first. */
  private bars(): StoredKeyboardBar[] {
    const plan = this.project?.keyboard_plan?.plan;
    if (!plan) return [];
    return plan.notes
      .map((note) => plan.bars[note])
      .filter((bar): bar is StoredKeyboardBar => bar !== undefined)
      .sort((a, b) => a.midi - b.midi);
  }

  private choosePaper(paper: TemplatePaper): void {
    this.paper = paper;
    rememberPaper(paper);
  }

  protected override render() {
    const record = this.project?.keyboard_plan;
    const bars = this.bars();
    const back = html`<button class="screen-only" @click=${() => this.dispatchEvent(new NavigateEvent('keyboard'))}>Back to the keyboard</button>`;
    if (!record || bars.length === 0) return html`<p>No planned bars yet: use “Plan every bar” on the keyboard overview first.</p>${back}`;
    const layouts = bars.map((bar) => templatePages({ length_mm: bar.bar.length_mm, depth_mm: templateDepth(bar.bar), paper: this.paper }));
    const sheets = layouts.reduce((sum, layout) => sum + layout.pages, 0);
    const tiled = bars.filter((_, index) => layouts[index]!.tiles.length > 1).map((bar) => bar.note);
    const label = templatePapers[this.paper].label;
    return html`<div class="controls screen-only">
        ${back}
        <div class="select-field">
          <label for="paper">Paper</label>
          <select id="paper" @change=${(event: Event) => this.choosePaper((event.target as HTMLSelectElement).value as TemplatePaper)}>
            ${(Object.keys(templatePapers) as TemplatePaper[]).map((name) => html`<option value=${name} ?selected=${name === this.paper}>${templatePapers[name].label}</option>`)}
          </select>
        </div>
        <button class="primary" @click=${() => window.print()}>Print every template</button>
      </div>
      <p class="screen-only muted" data-testid="plan-print-summary">
        ${bars.length} template${bars.length === 1 ? '' : 's'} on ${sheets} sheet${sheets === 1 ? '' : 's'} of ${label} at true scale (1:1), each bar starting a new sheet${tiled.length
          ? `; ${tiled.join(', ')} ${tiled.length === 1 ? 'is' : 'are'} longer than a sheet and printed in overlapping parts: cut each later sheet along its dashed line and lay it on the solid line of the sheet before`
          : ''}.
        Print at 100 % (no “fit to page”) and check the 100 mm bar on each sheet with a rule before marking or cutting.${record.plan.summary.complete ? '' : ' The plan is not finished: only the bars planned so far are here.'}
      </p>
      <bw-cautions class="screen-only"></bw-cautions>
      ${bars.map(
        (bar, index) => html`<bw-bar-template
          data-testid="print-sheet"
          data-note=${bar.note}
          data-blank-length-mm=${bar.blank.length_mm}
          .bar=${bar.bar}
          .nodesMm=${bar.cord_holes_mm}
          heading=${`${bar.note} · planned undercut · blank ${formatMm(bar.blank.length_mm, 0)} × ${formatMm(bar.blank.width_mm, 0)} × ${formatMm(bar.blank.thickness_mm, 0)} mm${bar.status === 'in-tolerance' ? '' : bar.status === 'infeasible' ? ' · cannot be made on this blank (closest shape shown)' : ' · out of tolerance'}`}
          paper=${this.paper}
          ?final=${index === bars.length - 1}
        ></bw-bar-template>`,
      )}`;
  }
}

declare global {
  interface HTMLElementTagNameMap {
    'bw-plan-print-view': BwPlanPrintView;
  }
}
