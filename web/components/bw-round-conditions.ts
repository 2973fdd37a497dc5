// What goes with a round beside the partials: the air temperature now (the reading is projected
// from it to the playing temperature), the rest since the cut (a warm bar reads flat), and the
// caliper at the advised checkpoints (the session then uses the bar as measured). Fires
// `conditions-change` with what is filled in; empty fields are simply left out of the round.
import { LitElement, html, css, nothing } from 'lit';
import { customElement, property, state } from 'lit/decorators.js';
import type { CaliperCheckpoint } from '../../src/index.ts';
import { sharedStyles } from '../styles/sharedStyles.ts';
import { formatMm } from '../format.ts';
import type { ValueCommitDetail } from './bw-number-field.ts';
import './bw-number-field.ts';
import './bw-rest-timer.ts';

/** Detail of `conditions-change`. */
export interface RoundConditions {
  /** Air temperature now, °C (null: not given). */
  airC: number | null;
  /** Caliper readings `[x_mm, thickness_mm]` filled in. */
  readings: [number, number][];
}

/** `<bw-round-conditions .checkpoints finished-at air-c playing-c blank-mm>` */
@customElement('bw-round-conditions')
export class BwRoundConditions extends LitElement {
  static override styles = [
    sharedStyles,
    css`
      :host {
        display: grid;
        gap: 0.7rem;
      }
      .caliper {
        display: grid;
        grid-template-columns: repeat(auto-fit, minmax(9.5rem, 1fr));
        gap: 0.5rem 0.8rem;
      }
      fieldset {
        border: 1px solid var(--bw-line-soft);
        border-radius: 8px;
        margin: 0;
        padding: 0.5rem 0.8rem 0.7rem;
      }
      legend {
        font-weight: 700;
      }
    `,
  ];

  /** The advised cut's checkpoints (positions from the left end, thickness to expect), or null. */
  @property({ attribute: false }) checkpoints: CaliperCheckpoint[] | null = null;
  /** When the last cut was finished (ISO 8601), or empty. */
  @property({ attribute: 'finished-at' }) finishedAt = '';
  /** The air temperature to start from (the last one given for this bar), °C; null leaves the field empty. */
  @property({ type: Number, attribute: 'air-c' }) airC: number | null = null;
  /** The playing temperature, °C (for the hint). */
  @property({ type: Number, attribute: 'playing-c' }) playingC = 20;
  /** The blank's thickness, mm: no reading above it. */
  @property({ type: Number, attribute: 'blank-mm' }) blankMm = 0;

  @state() private air: number | null = null;
  @state() private readings: (number | null)[] = [];

  /** Set when what goes with the next round changed without the maker typing (another bar, new checkpoints). */
  private changedUnasked = false;
  private checkpointsKey = '[]';

  protected override willUpdate(changed: Map<string, unknown>): void {
    if (changed.has('airC') && this.air === null && this.airC !== null) {
      this.air = this.airC;
      this.changedUnasked = true;
    }
    // New checkpoints (not merely a new copy of the same ones after a save) start empty fields.
    const checkpointsKey = JSON.stringify(this.checkpoints ?? []);
    if (changed.has('checkpoints') && checkpointsKey !== this.checkpointsKey) {
      this.checkpointsKey = checkpointsKey;
      this.readings = (this.checkpoints ?? []).map(() => null);
      this.changedUnasked = true;
    }
  }

  protected override updated(): void {
    // The round takes what the fields show: tell the view whenever they changed by themselves.
    if (!this.changedUnasked) return;
    this.changedUnasked = false;
    this.announce();
  }

  /** Forgets the caliper readings once a round has recorded them (the air temperature stays). */
  clearReadings(): void {
    this.readings = (this.checkpoints ?? []).map(() => null);
    this.announce();
  }

  private announce(): void {
    const readings = (this.checkpoints ?? []).flatMap((point, index) => {
      const value = this.readings[index];
      return value === null || value === undefined ? [] : [[point.x_mm, value] as [number, number]];
    });
    this.dispatchEvent(new CustomEvent<RoundConditions>('conditions-change', { detail: { airC: this.air, readings }, bubbles: true, composed: true }));
  }

  protected override render() {
    const points = this.checkpoints ?? [];
    return html`<bw-rest-timer finished-at=${this.finishedAt}></bw-rest-timer>
      <bw-number-field
        label="Air temperature now"
        unit="°C"
        name="air-now"
        .value=${this.air}
        .min=${-30}
        .max=${60}
        step="0.5"
        optional
        hint=${`Readings are shown at the playing temperature, ${this.playingC} °C; left empty, a reading is taken as read at it.`}
        @value-commit=${(event: CustomEvent<ValueCommitDetail>) => {
          this.air = event.detail.value;
          this.announce();
        }}
        @value-clear=${() => {
          this.air = null;
          this.announce();
        }}
      ></bw-number-field>
      ${points.length > 0
        ? html`<fieldset data-testid="caliper">
            <legend>Caliper after the cut (optional)</legend>
            <div class="caliper">
              ${points.map(
                (point, index) => html`<bw-number-field
                  label=${`At ${formatMm(point.x_mm, 0)} mm`}
                  unit="mm"
                  name=${`caliper-${index}`}
                  .value=${this.readings[index] ?? null}
                  .min=${0}
                  exclusive-min
                  .max=${this.blankMm || null}
                  hint=${`expect ${formatMm(point.thickness_mm, 2)} mm`}
                  @value-commit=${(event: CustomEvent<ValueCommitDetail>) => {
                    const readings = [...this.readings];
                    readings[index] = event.detail.value;
                    this.readings = readings;
                    this.announce();
                  }}
                ></bw-number-field>`,
              )}
            </div>
          </fieldset>`
        : nothing}`;
  }
}

declare global {
  interface HTMLElementTagNameMap {
    'bw-round-conditions': BwRoundConditions;
  }
}
