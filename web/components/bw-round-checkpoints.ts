// The advised cut for the bench: the depth to take at round positions (every 5 or 10 mm) measured
// from the end or the centre the maker chooses, or, for a cut too shallow to set with a caliper,
// a few passes with fine paper over a named span with what it does in cents. The choice is kept
// on this device. The numbers come from the library (roundCheckpoints, fineSanding).
import { LitElement, html, css, nothing } from 'lit';
import { customElement, property, state } from 'lit/decorators.js';
import { checkpointSteps, fineSanding, fineSandingDepthMm, roundCheckpoints, type BarFile, type CutInstructions, type MeasureOrigin } from '../../src/index.ts';
import { sharedStyles } from '../styles/sharedStyles.ts';
import { formatCents, formatMm, partialName } from '../format.ts';

const choiceKey = 'barwright.checkpoint-grid';

/** The maker's last choice of spacing and origin on this device. */
function storedChoice(): { step: number; origin: MeasureOrigin } {
  try {
    const stored = JSON.parse(localStorage.getItem(choiceKey) ?? 'null') as { step?: unknown; origin?: unknown } | null;
    const step = checkpointSteps.find((candidate) => candidate === stored?.step) ?? 10;
    const origin = stored?.origin === 'right' || stored?.origin === 'centre' ? stored.origin : 'left';
    return { step, origin };
  } catch {
    return { step: 10, origin: 'left' };
  }
}

const originWords: Record<MeasureOrigin, string> = { left: 'the left end', right: 'the right end', centre: 'the centre' };

/** A distance from the origin as the maker reads it on the rule. */
function place(distance: number, origin: MeasureOrigin): string {
  if (origin !== 'centre') return `${formatMm(distance, 0)} mm`;
  if (Math.abs(distance) < 1e-9) return 'centre';
  return `${formatMm(Math.abs(distance), 0)} mm ${distance < 0 ? 'left' : 'right'}`;
}

/** `<bw-round-checkpoints .now .cutTo .plan .effectCents>` */
@customElement('bw-round-checkpoints')
export class BwRoundCheckpoints extends LitElement {
  static override styles = [
    sharedStyles,
    css`
      :host {
        display: block;
      }
      .choices {
        display: flex;
        flex-wrap: wrap;
        gap: 0.6rem 1.2rem;
        align-items: end;
        margin-bottom: 0.5rem;
      }
      .choices label {
        display: grid;
        gap: 0.2rem;
      }
      .wrap {
        max-height: 26rem;
        overflow: auto;
        border: 1px solid var(--bw-line-soft);
        border-radius: 8px;
      }
      table {
        width: 100%;
      }
      thead th {
        position: sticky;
        top: 0;
        background: var(--bw-panel);
      }
      td.remove {
        font-size: 1.25rem;
        font-weight: 800;
      }
      .paper {
        font-size: 1.2rem;
        font-weight: 700;
      }
      @media print {
        .wrap {
          max-height: none;
          overflow: visible;
        }
      }
    `,
  ];

  /** The bar now and after the advised cut. */
  @property({ attribute: false }) now: BarFile | null = null;
  @property({ attribute: false }) cutTo: BarFile | null = null;
  /** The cut's instructions (stations, depths, shortening). */
  @property({ attribute: false }) plan: CutInstructions | null = null;
  /** What the cut does to each partial, cents (expected after − now). */
  @property({ attribute: false }) effectCents: number[] = [];

  @state() private step = storedChoice().step;
  @state() private origin: MeasureOrigin = storedChoice().origin;

  private choose(step: number, origin: MeasureOrigin): void {
    this.step = step;
    this.origin = origin;
    try {
      localStorage.setItem(choiceKey, JSON.stringify({ step, origin }));
    } catch {
      // Private browsing: the choice lasts for this page only.
    }
  }

  private renderChoices() {
    return html`<div class="choices" data-testid="checkpoint-choice">
      <label>Checkpoints every
        <select name="checkpoint-step" @change=${(event: Event) => this.choose(Number((event.target as HTMLSelectElement).value), this.origin)}>
          ${checkpointSteps.map((step) => html`<option value=${step} ?selected=${step === this.step}>${step} mm</option>`)}
        </select>
      </label>
      <label>Measured from
        <select name="checkpoint-origin" @change=${(event: Event) => this.choose(this.step, (event.target as HTMLSelectElement).value as MeasureOrigin)}>
          ${(['left', 'right', 'centre'] as const).map((origin) => html`<option value=${origin} ?selected=${origin === this.origin}>${originWords[origin]}</option>`)}
        </select>
      </label>
    </div>`;
  }

  private renderEffect() {
    const effects = this.effectCents.map((cents, index) => `${partialName(index).toLowerCase()} ${formatCents(cents)} cents`);
    return effects.length ? html`<p class="muted">Expected effect: ${effects.join(', ')}.</p>` : nothing;
  }

  protected override render() {
    const { now, cutTo: after, plan } = this;
    if (!now || !after || !plan) return nothing;
    const paper = fineSanding(plan, now.length_mm, this.origin);
    if (paper) {
      const [from, to] = paper.from_origin_mm;
      return html`${this.renderChoices()}
        <p class="paper" data-testid="fine-paper">A few passes with fine paper over ${place(from, this.origin)} … ${place(to, this.origin)}${this.origin === 'centre' ? ' of the centre' : ` from ${originWords[this.origin]}`}.</p>
        <p class="muted">Under ${formatMm(fineSandingDepthMm, 2)} mm anywhere (at most ${formatMm(paper.max_depth_mm, 2)} mm): too little to set with a caliper, which reads to 0.01–0.02 mm and repeats to about ±0.02 mm on wood; 240–320 grit paper on a block takes off a few hundredths in a few strokes (common practice). Feather the edges, then strike the bar.</p>
        ${this.renderEffect()}`;
    }
    const points = roundCheckpoints(now, after, this.step, this.origin);
    return html`${this.renderChoices()}
      ${plan.shortening_mm > 0.005 ? html`<p class="paper">First shorten: take ${formatMm(plan.shortening_mm / 2, 1)} mm off each end (${formatMm(plan.shortening_mm, 1)} mm in all); the positions below are on the bar before shortening.</p>` : nothing}
      <div class="wrap">
        <table data-testid="round-checkpoints">
          <caption class="visually-hidden">The depth to take at every ${this.step} mm from ${originWords[this.origin]}</caption>
          <thead>
            <tr><th scope="col" class="number">From ${originWords[this.origin]}</th><th scope="col" class="number">Thick now (mm)</th><th scope="col" class="number">Thick after (mm)</th><th scope="col" class="number">Take off (mm)</th></tr>
          </thead>
          <tbody>
            ${points.map(
              (point) => html`<tr data-from-origin=${point.from_origin_mm}>
                <td class="number">${place(point.from_origin_mm, this.origin)}</td>
                <td class="number">${formatMm(point.thickness_now_mm, 2)}</td>
                <td class="number">${formatMm(point.thickness_after_mm, 2)}</td>
                <td class="number remove">${formatMm(point.remove_mm, 2)}</td>
              </tr>`,
            )}
          </tbody>
        </table>
      </div>
      ${this.renderEffect()}`;
  }
}

declare global {
  interface HTMLElementTagNameMap {
    'bw-round-checkpoints': BwRoundCheckpoints;
  }
}
