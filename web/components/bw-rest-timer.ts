// The bar rests after a cut: a bar warm from the sander reads flat, so wait about 10 minutes
// before striking it (common practice). Counts down from when the cut was finished; large, calm.
import { LitElement, html, css, nothing } from 'lit';
import { customElement, property, state } from 'lit/decorators.js';
import { warmBarMinutes } from '../../src/index.ts';
import { sharedStyles } from '../styles/sharedStyles.ts';

/** How long after the cut the timer stays on screen once the bar has rested, minutes. */
const shownForMinutes = 60;

/** Minutes and seconds, "7:05". */
function clock(seconds: number): string {
  const whole = Math.max(0, Math.ceil(seconds));
  return `${Math.floor(whole / 60)}:${String(whole % 60).padStart(2, '0')}`;
}

/** `<bw-rest-timer finished-at>` */
@customElement('bw-rest-timer')
export class BwRestTimer extends LitElement {
  static override styles = [
    sharedStyles,
    css`
      :host {
        display: block;
      }
      .timer {
        display: flex;
        flex-wrap: wrap;
        gap: 0.3rem 1rem;
        align-items: baseline;
        padding: 0.5rem 0.7rem;
        border-radius: 8px;
        border: 2px solid var(--bw-line-soft);
      }
      .resting {
        border-color: var(--bw-caution-ink);
      }
      .count {
        font-size: 2rem;
        font-weight: 800;
        font-variant-numeric: tabular-nums;
      }
    `,
  ];

  /** When the last cut was finished (ISO 8601), or empty. */
  @property({ attribute: 'finished-at' }) finishedAt = '';
  @state() private now = Date.now();
  private ticker: ReturnType<typeof setInterval> | undefined;

  override connectedCallback(): void {
    super.connectedCallback();
    this.ticker = setInterval(() => (this.now = Date.now()), 1000);
  }

  override disconnectedCallback(): void {
    super.disconnectedCallback();
    clearInterval(this.ticker);
  }

  /** Seconds the bar still has to rest (0 when rested), or null with no cut to time. */
  remainingSeconds(): number | null {
    const finished = Date.parse(this.finishedAt);
    if (!this.finishedAt || Number.isNaN(finished)) return null;
    return Math.max(0, warmBarMinutes * 60 - (this.now - finished) / 1000);
  }

  protected override render() {
    const finished = Date.parse(this.finishedAt);
    const remaining = this.remainingSeconds();
    if (remaining === null || (this.now - finished) / 60_000 > shownForMinutes) return nothing;
    const since = Math.max(0, Math.floor((this.now - finished) / 60_000));
    return remaining > 0
      ? html`<div class="timer resting" role="timer" aria-live="off" data-testid="rest-timer">
          <span>Cut finished ${since} min ago. Let the bar cool before striking it: a warm bar reads flat.</span>
          <span class="count" aria-label="time left to rest">${clock(remaining)}</span>
        </div>`
      : html`<div class="timer" role="status" data-testid="rest-timer"><span class="count">✓</span><span>The bar has rested ${since} min since the cut: strike it now.</span></div>`;
  }
}

declare global {
  interface HTMLElementTagNameMap {
    'bw-rest-timer': BwRestTimer;
  }
}
