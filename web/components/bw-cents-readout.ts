// One partial's standing in large numerals: signed cents, "sharp"/"flat"/"in tune" in words and
// a shape (▲ ▼ ●), so it reads from a metre away and without colour.
import { LitElement, html, css } from 'lit';
import { customElement, property } from 'lit/decorators.js';
import { sharedStyles } from '../styles/sharedStyles.ts';
import { formatCents, formatHz, verdictClass, verdictMark } from '../format.ts';

/** `<bw-cents-readout label cents verdict hz target-hz tolerance>` */
@customElement('bw-cents-readout')
export class BwCentsReadout extends LitElement {
  static override styles = [
    sharedStyles,
    css`
      :host {
        display: block;
      }
      .card {
        border: 2px solid var(--bw-line-soft);
        border-radius: 10px;
        padding: 0.6rem 0.8rem;
        background: var(--bw-panel);
        min-width: 10rem;
      }
      .card.sharp {
        border-color: var(--bw-sharp);
      }
      .card.flat {
        border-color: var(--bw-flat);
      }
      .card.in-tune {
        border-color: var(--bw-in-tune);
      }
      .label {
        font-weight: 700;
        font-size: 0.95rem;
        color: var(--bw-ink-muted);
      }
      .value {
        font-size: var(--bw-readout-size, 2.9rem);
        font-weight: 800;
        line-height: 1.05;
        font-variant-numeric: tabular-nums;
        letter-spacing: -0.01em;
      }
      .unit {
        font-size: 1rem;
        font-weight: 600;
        margin-left: 0.25rem;
      }
      .verdict {
        font-size: 1.35rem;
        font-weight: 800;
        text-transform: uppercase;
        letter-spacing: 0.04em;
      }
      .detail {
        font-size: 0.9rem;
        color: var(--bw-ink-muted);
        font-variant-numeric: tabular-nums;
      }
      :host([compact]) .value {
        font-size: 1.6rem;
      }
      :host([compact]) .verdict {
        font-size: 0.95rem;
      }
    `,
  ];

  /** What partial this is ("Fundamental", "Partial 2"). */
  @property() label = '';
  /** Signed cents from the target (positive = sharp), or null. */
  @property({ type: Number }) cents: number | null = null;
  @property() verdict: 'sharp' | 'flat' | 'in tune' | null = null;
  /** The frequency heard or predicted, Hz. */
  @property({ type: Number }) hz: number | null = null;
  @property({ type: Number, attribute: 'target-hz' }) targetHz: number | null = null;
  @property({ type: Number }) tolerance: number | null = null;
  /** What to say while there is no value (a prediction still being worked out is not a missing reading). */
  @property({ attribute: 'empty-words' }) emptyWords = 'no reading';
  /** Smaller numerals for lists. */
  @property({ type: Boolean, reflect: true }) compact = false;
  /** The reading as taken, when the figures shown were projected to the playing temperature (e.g. "read 189.13 Hz at 21.5 °C"). */
  @property({ attribute: 'as-read' }) asRead = '';

  protected override render() {
    const kind = verdictClass(this.verdict);
    const words = this.verdict ?? this.emptyWords;
    return html`<div class="card ${kind}" role="group" aria-label="${this.label}: ${formatCents(this.cents)} cents, ${words}">
      <div class="label">${this.label}</div>
      <div class="value ${kind}">${formatCents(this.cents)}<span class="unit">cents</span></div>
      <div class="verdict ${kind}">${verdictMark(this.verdict)} ${words}</div>
      <div class="detail">${formatHz(this.hz)} Hz · target ${formatHz(this.targetHz)} Hz${this.tolerance !== null ? html` · ±${this.tolerance}` : ''}</div>
      ${this.asRead ? html`<div class="detail as-read">${this.asRead}</div>` : ''}
    </div>`;
  }
}

declare global {
  interface HTMLElementTagNameMap {
    'bw-cents-readout': BwCentsReadout;
  }
}
