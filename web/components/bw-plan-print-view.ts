// The print view of a keyboard plan: every planned bar's 1:1 template (the library's SVG, sized
// in millimetres, with the note, blank size, cord holes and a scale bar), one bar per printed
// page. Each bar gets a named CSS page (@page) as wide as its template, so a bar is never split
// or scaled; long bars need paper (or a roll) that long.
import { LitElement, html, css, nothing } from 'lit';
import { customElement, property } from 'lit/decorators.js';
import { unsafeSVG } from 'lit/directives/unsafe-svg.js';
import { keyboardBarTemplates, type ProjectFile, type StoredKeyboardBar } from '../../src/index.ts';
import { sharedStyles } from '../styles/sharedStyles.ts';
import { NavigateEvent } from '../events.ts';
import { formatMm } from '../format.ts';
import './bw-cautions.ts';

/** Paper margin around each template, mm. */
const marginMm = 8;
/** Height of the caption line above each template, mm. */
const captionMm = 12;

/** One sheet to print: the bar, its SVG text and the template's size in mm. */
interface Sheet {
  bar: StoredKeyboardBar;
  page: string;
  svg: string;
  widthMm: number;
  heightMm: number;
}


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
        align-items: center;
        margin-bottom: 0.8rem;
      }
      .sheet {
        background: #ffffff;
        border: 1px solid var(--bw-line-soft);
        padding: 0.6rem;
        margin-bottom: 1rem;
        overflow-x: auto;
        break-after: page;
        break-inside: avoid;
      }
      .sheet:last-of-type {
        break-after: auto;
      }
      .caption {
        margin: 0 0 0.3rem;
        font-size: 1rem;
        color: #000000;
      }
      .sheet svg {
        display: block;
        max-width: none;
      }
      @media print {
        .screen-only {
          display: none !important;
        }
        .sheet {
          border: none;
          padding: 0;
          margin: 0;
          overflow: visible;
        }
        .caption {
          font-size: 10pt;
        }
      }
    `,
  ];

  @property({ attribute: false }) project: ProjectFile | null = null;

  private pageStyle: HTMLStyleElement | null = null;

  private sheets(): Sheet[] {
    const plan = this.project?.keyboard_plan?.plan;
    if (!plan) return [];
    const bars = plan.notes.map((note) => plan.bars[note]).filter((bar): bar is StoredKeyboardBar => bar !== undefined);
    return keyboardBarTemplates(bars).map((template, index) => ({
      bar: plan.bars[template.note]!,
      page: `bw-bar-${index + 1}`,
      svg: template.svg.replace(/^<\?xml[^>]*>\s*/, ''),
      widthMm: template.width_mm,
      heightMm: template.height_mm,
    }));
  }

  /** Named pages live in the document's own style sheet (@page rules do not apply inside shadow roots). */
  private writePageRules(sheets: readonly Sheet[]): void {
    if (!this.pageStyle) {
      this.pageStyle = document.createElement('style');
      this.pageStyle.dataset.barwright = 'plan-pages';
      document.head.append(this.pageStyle);
    }
    this.pageStyle.textContent = sheets
      .map((sheet) => `@page ${sheet.page} { size: ${(sheet.widthMm + 2 * marginMm).toFixed(1)}mm ${(sheet.heightMm + captionMm + 2 * marginMm).toFixed(1)}mm; margin: ${marginMm}mm; }`)
      .join('\n');
  }

  override disconnectedCallback(): void {
    super.disconnectedCallback();
    this.pageStyle?.remove();
    this.pageStyle = null;
  }

  protected override render() {
    const record = this.project?.keyboard_plan;
    const sheets = this.sheets();
    this.writePageRules(sheets);
    const back = html`<button class="screen-only" @click=${() => this.dispatchEvent(new NavigateEvent('keyboard'))}>Back to the keyboard</button>`;
    if (!record || sheets.length === 0) return html`<p>No planned bars yet: use “Plan every bar” on the keyboard overview first.</p>${back}`;
    const longest = Math.max(...sheets.map((sheet) => sheet.widthMm + 2 * marginMm));
    return html`<div class="controls screen-only">
        ${back}
        <button class="primary" @click=${() => window.print()}>Print every template</button>
        <span>${sheets.length} template${sheets.length === 1 ? '' : 's'}, one bar per page, at true scale (1:1).</span>
      </div>
      <p class="screen-only muted">
        Each page is as wide as its bar (the longest needs ${formatMm(longest, 0)} mm of paper). Print at 100 % (no “fit to page”) and check the scale bar on each template with a ruler before
        marking or cutting.${record.plan.summary.complete ? '' : ' The plan is not finished: only the bars planned so far are here.'}
      </p>
      <bw-cautions class="screen-only"></bw-cautions>
      ${sheets.map(
        (sheet) => html`<div class="sheet" style=${`page: ${sheet.page}`} data-testid="print-sheet" data-note=${sheet.bar.note} data-blank-length-mm=${sheet.bar.blank.length_mm}>
          <p class="caption">
            <strong>${sheet.bar.note}</strong> · blank ${formatMm(sheet.bar.blank.length_mm, 0)} × ${formatMm(sheet.bar.blank.width_mm, 0)} × ${formatMm(sheet.bar.blank.thickness_mm, 0)} mm · cord holes at
            ${formatMm(sheet.bar.cord_holes_mm[0])} and ${formatMm(sheet.bar.cord_holes_mm[1])} mm from the left end${sheet.bar.status === 'in-tolerance' ? '' : ` · ${sheet.bar.status === 'infeasible' ? 'cannot be made on this blank (closest shape shown)' : 'out of tolerance'}`}
          </p>
          ${unsafeSVG(sheet.svg)}
        </div>`,
      )}
      ${nothing}`;
  }
}

declare global {
  interface HTMLElementTagNameMap {
    'bw-plan-print-view': BwPlanPrintView;
  }
}
