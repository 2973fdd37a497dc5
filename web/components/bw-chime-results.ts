// A planned chime set on screen and on paper: for every chime its length, where to hang it, the
// strike note, the partials' ratios, the cutting plan from stock lengths, warnings and the metal
// workshop cautions. Engineering detail (partials in Hz, nearest intervals, model) behind a
// disclosure.
import { LitElement, html, css, nothing } from 'lit';
import { customElement, property } from 'lit/decorators.js';
import type { ChimeSetPieceRow, ChimeSetPlan } from '../../src/index.ts';
import { sharedStyles } from '../styles/sharedStyles.ts';
import { formatCents, formatHz, formatMm, formatNumber } from '../format.ts';
import './bw-cautions.ts';

/** `<bw-chime-results .plan>` */
@customElement('bw-chime-results')
export class BwChimeResults extends LitElement {
  static override styles = [
    sharedStyles,
    css`
      :host {
        display: block;
      }
      table {
        width: 100%;
      }
      td.length {
        font-size: 1.25rem;
        font-weight: 700;
      }
      @media print {
        details {
          display: none;
        }
        td.note,
        td.length {
          font-size: 11pt;
        }
      }
    `,
  ];

  @property({ attribute: false }) plan: ChimeSetPlan | null = null;
  /** Each note of the set beside the project's chime piece of that note (no column when null). */
  @property({ attribute: false }) pieces: readonly ChimeSetPieceRow[] | null = null;

  private renderPiece(note: string) {
    const row = this.pieces?.find((candidate) => candidate.note === note);
    if (!row?.piece) return html`<td class="muted" data-testid="chime-piece">not a piece yet</td>`;
    const state = row.piece.state.replace('-', ' ');
    return row.agrees
      ? html`<td data-testid="chime-piece">✓ ${formatMm(row.piece.length_mm)} mm, ${state}</td>`
      : html`<td class="problem" data-testid="chime-piece">≠ cut at ${formatMm(row.piece.length_mm)} mm (other stock or an older set), ${state}</td>`;
  }

  protected override render() {
    const plan = this.plan;
    if (!plan) return nothing;
    const tuned = plan.tune === 'strike' ? 'strike note' : 'fundamental';
    return html`<h3>${plan.name || 'Chime set'}: cut list</h3>
      <p>${plan.chimes.length} chimes tuned on the ${tuned} at A4 = ${formatNumber(plan.a4_hz, 1)} Hz. Lengths, hanging points and nodes in mm from the top end. Total stock ${formatNumber(plan.total_length_mm / 1000, 2)} m.</p>
      <div class="table-wrap">
        <table data-testid="chime-table">
          <thead>
            <tr>
              <th scope="col">Note</th>
              <th scope="col" class="number">Target (Hz)</th>
              <th scope="col" class="number">Length (mm)</th>
              <th scope="col" class="number">Hang at (mm)</th>
              <th scope="col" class="number">Lower node (mm)</th>
              <th scope="col">Strike note</th>
              <th scope="col">Partial ratios 2–6</th>
              ${this.pieces ? html`<th scope="col">Piece in the project</th>` : nothing}
            </tr>
          </thead>
          <tbody>
            ${plan.chimes.map(
              (chime) => html`<tr data-note=${chime.note}>
                <td class="note">${chime.note}</td>
                <td class="number">${formatHz(chime.target_hz)}</td>
                <td class="number length" data-testid="chime-length">${formatMm(chime.length_mm)}</td>
                <td class="number">${formatMm(chime.hanging_point_mm)}${chime.hanging_point_shift_mm !== undefined ? html`<span class="muted"> (plug moves it ${chime.hanging_point_shift_mm >= 0 ? '+' : '−'}${formatMm(Math.abs(chime.hanging_point_shift_mm))} mm)</span>` : nothing}</td>
                <td class="number">${formatMm(chime.lower_node_mm)}</td>
                <td>${chime.strike_note} ${formatCents(chime.strike_cents)} cents</td>
                <td>${chime.partials.slice(1).map((p) => formatNumber(p.ratio, 2)).join(' · ')}</td>
                ${this.pieces ? this.renderPiece(chime.note) : nothing}
              </tr>`,
            )}
          </tbody>
        </table>
      </div>
      ${plan.cutting
        ? html`<h3>Cutting plan: one line per stock length, longest piece first</h3>
            <ol data-testid="chime-cutting">
              ${plan.cutting.bars.map((bar) => html`<li>${bar.pieces.join(', ')} — offcut ${formatMm(bar.offcut_mm, 0)} mm</li>`)}
            </ol>
            ${plan.cutting.too_long.length ? html`<p class="problem">Longer than the stock: ${plan.cutting.too_long.join(', ')}</p>` : nothing}`
        : nothing}
      ${plan.chimes.some((c) => c.warnings.length)
        ? html`<h3>Possible buzzing or beating</h3>
            <p class="muted">Another way the piece can vibrate (twisting) lies close to a partial:</p>
            <ul>
              ${plan.chimes.flatMap((c) => c.warnings.map((w) => html`<li>${c.note}: ${w}</li>`))}
            </ul>`
        : nothing}
      <bw-cautions .items=${plan.cautions}></bw-cautions>
      <details>
        <summary>Engineering detail</summary>
        <p class="muted">
          Lengths from a Timoshenko beam model with Cowper's shear coefficient for the section, searched until the tuned pitch is within a ten-thousandth of a cent; the strike note is the
          pitch fitted to bending modes 4–6 as harmonics 2, 3, 4; the hanging point is mode 1's node nearest the top; plugs are rigid end masses.
        </p>
        <div class="table-wrap">
          <table>
            <thead><tr><th scope="col">Note</th><th scope="col">Hang at (fraction of length)</th><th scope="col">Partials (Hz, nearest interval)</th><th scope="col">Tuned pitch error (cents)</th></tr></thead>
            <tbody>
              ${plan.chimes.map(
                (chime) => html`<tr>
                  <td>${chime.note}</td>
                  <td>${formatNumber(chime.hanging_point_fraction, 4)}</td>
                  <td>${chime.partials.map((p) => `${formatHz(p.hz)} (${p.interval.name} ${formatCents(p.interval.cents)})`).join('; ')}</td>
                  <td>${formatNumber(chime.cents_error, 4)}</td>
                </tr>`,
              )}
            </tbody>
          </table>
        </div>
      </details>`;
  }
}

declare global {
  interface HTMLElementTagNameMap {
    'bw-chime-results': BwChimeResults;
  }
}
