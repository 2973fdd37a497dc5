// The planned keyboard at a glance: one row per planned note with its blank, centre thickness,
// cord holes, resonator, the partials' errors on the check and its status in words and a shape
// (in tolerance ✔, out of tolerance !, cannot be made ✕ with the reason). Engineering detail
// (the designer's own prediction, the check mesh, the blank advice) behind a disclosure.
import { LitElement, html, css, nothing } from 'lit';
import { customElement, property } from 'lit/decorators.js';
import type { KeyboardBarStatus, KeyboardPlan, StoredKeyboardBar } from '../../src/index.ts';
import { sharedStyles } from '../styles/sharedStyles.ts';
import { formatCents, formatMm, formatRatios } from '../format.ts';

const statusWords: Record<KeyboardBarStatus, { mark: string; words: string; css: string }> = {
  'in-tolerance': { mark: '✔', words: 'in tolerance', css: 'in-tune' },
  'out-of-tolerance': { mark: '!', words: 'out of tolerance', css: 'sharp' },
  infeasible: { mark: '✕', words: 'cannot be made on this blank', css: 'problem-ink' },
};

/** `<bw-plan-table .plan>` */
@customElement('bw-plan-table')
export class BwPlanTable extends LitElement {
  static override styles = [
    sharedStyles,
    css`
      :host {
        display: block;
        min-width: 0;
      }
      table {
        width: 100%;
      }
      .status {
        font-weight: 700;
      }
      .reason {
        min-width: 16rem;
      }
      .problem-ink {
        color: var(--bw-problem-ink);
      }
      .reason {
        display: block;
        font-size: 0.85rem;
        color: var(--bw-ink-muted);
        max-width: 34rem;
      }
      .pending {
        color: var(--bw-ink-muted);
        font-style: italic;
      }
      .cents {
        display: inline-block;
        min-width: 4.2rem;
        font-variant-numeric: tabular-nums;
      }
      .nowrap {
        white-space: nowrap;
      }
      details.why summary {
        font-size: 0.9rem;
      }
    `,
  ];

  /** The stored plan (maybe cut short). */
  @property({ attribute: false }) plan: KeyboardPlan | null = null;

  private renderStatus(bar: StoredKeyboardBar) {
    const status = statusWords[bar.status];
    return html`<span class="status ${status.css}" data-status=${bar.status}>${status.mark} ${status.words}</span>${bar.reason
        ? html`<details class="why"><summary>Why, and what would help</summary><span class="reason">${bar.reason}</span></details>`
        : nothing}`;
  }

  private renderCents(bar: StoredKeyboardBar) {
    return bar.check.cents_error.map((value, index) => {
      const tolerance = bar.tolerance_cents[index] ?? 0;
      const mark = Math.abs(value) <= tolerance ? '●' : value > 0 ? '▲' : '▼';
      return html`<span class="cents" title=${`partial ${index + 1}: tolerance ±${tolerance} cents`}>${mark} ${formatCents(value)}</span>`;
    });
  }

  protected override render() {
    const plan = this.plan;
    if (!plan) return nothing;
    return html`<div class="table-wrap">
        <table data-testid="plan-table">
          <thead>
            <tr>
              <th scope="col">Note</th>
              <th scope="col">Status</th>
              <th scope="col">Blank L × W × T (mm)</th>
              <th scope="col" class="number">Centre (mm)</th>
              <th scope="col">Undercut from–to (mm)</th>
              <th scope="col">Cord holes (mm from left)</th>
              <th scope="col" class="number">Resonator (mm)</th>
              <th scope="col">Partials (cents)</th>
            </tr>
          </thead>
          <tbody>
            ${plan.notes.map((note) => {
              const bar = plan.bars[note];
              if (!bar) return html`<tr data-note=${note}><td class="note">${note}</td><td colspan="7" class="pending">not planned yet</td></tr>`;
              return html`<tr data-note=${note}>
                <td class="note">${note}</td>
                <td>${this.renderStatus(bar)}</td>
                <td class="nowrap">${formatMm(bar.blank.length_mm, 0)} × ${formatMm(bar.blank.width_mm, 0)} × ${formatMm(bar.blank.thickness_mm, 0)}</td>
                <td class="number">${formatMm(bar.centre_thickness_mm)}</td>
                <td class="nowrap">${bar.arch ? `${formatMm(bar.arch.start_mm, 0)}–${formatMm(bar.arch.end_mm, 0)}` : 'uncut'}</td>
                <td class="nowrap">${formatMm(bar.cord_holes_mm[0])}, ${formatMm(bar.cord_holes_mm[1])}</td>
                <td class="number">${bar.resonator ? formatMm(bar.resonator.length_mm, 0) : '–'}</td>
                <td class="nowrap">${this.renderCents(bar)}</td>
              </tr>`;
            })}
          </tbody>
        </table>
      </div>
      <details>
        <summary>Engineering detail</summary>
        <p class="muted">
          Partials above are re-analysed on a fine check mesh of the planned shape (Timoshenko beam, finite elements); the designer's own prediction is listed here beside it. Blank lengths come from
          a blank advisor run on ${Object.keys(plan.advice).length} notes, interpolated between them and smoothed so no blank is longer than the one below.
        </p>
        <div class="table-wrap">
          <table>
            <thead><tr><th scope="col">Note</th><th scope="col">Ratios</th><th scope="col">Designer's prediction (cents)</th><th scope="col" class="number">Check mesh elements</th><th scope="col">Bending modes 1–4 (Hz)</th><th scope="col">Mode collisions</th></tr></thead>
            <tbody>
              ${plan.notes.map((note) => {
                const bar = plan.bars[note];
                if (!bar) return nothing;
                return html`<tr>
                  <td>${note}</td>
                  <td>${formatRatios(bar.ratios)}</td>
                  <td>${bar.cents_error.map((c) => formatCents(c)).join('  ')}</td>
                  <td class="number">${bar.check.elements}</td>
                  <td>${bar.check.bending_hz.map((hz) => hz.toFixed(1)).join(', ')}</td>
                  <td>${bar.warnings.join('; ') || '–'}</td>
                </tr>`;
              })}
            </tbody>
          </table>
        </div>
      </details>`;
  }
}

declare global {
  interface HTMLElementTagNameMap {
    'bw-plan-table': BwPlanTable;
  }
}
