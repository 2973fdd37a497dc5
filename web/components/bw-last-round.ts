// The last round at a glance: each partial's error in large signed cents at the playing
// temperature, the reading as taken (and its air temperature) beside it.
import { LitElement, html, css, nothing } from 'lit';
import { customElement, property } from 'lit/decorators.js';
import { barTargetHz, barTemperature, barWarmReadings, comparePartials, lastMeasuredHz, registerOf, type ProjectBar, type ProjectFile } from '../../src/index.ts';
import { sharedStyles } from '../styles/sharedStyles.ts';
import { formatHz, formatNumber, formatWhen, partialName } from '../format.ts';
import './bw-cents-readout.ts';

/** `<bw-last-round .project .bar>` */
@customElement('bw-last-round')
export class BwLastRound extends LitElement {
  static override styles = [
    sharedStyles,
    css`
      :host {
        display: block;
      }
      .readouts {
        display: grid;
        grid-template-columns: repeat(auto-fit, minmax(10.5rem, 1fr));
        gap: 0.6rem;
      }
    `,
  ];

  @property({ attribute: false }) project: ProjectFile | null = null;
  @property({ attribute: false }) bar: ProjectBar | null = null;

  protected override render() {
    const project = this.project;
    const bar = this.bar;
    if (!project || !bar) return nothing;
    const register = registerOf(project, bar);
    const targets = barTargetHz(project, bar);
    const measured = lastMeasuredHz(bar);
    const last = bar.session.steps[bar.session.steps.length - 1];
    if (!measured) {
      return html`<section class="panel"><h3>Last round</h3><p class="muted">No round yet. Strike the bar as it is now (uncut blanks too: the first round teaches barwright this piece of wood).</p></section>`;
    }
    // At the playing temperature, the reading as taken beside it.
    const temperature = barTemperature(project, bar);
    const index = bar.session.steps.length - 1;
    const shift = temperature?.shiftCents[index] ?? 0;
    const readC = temperature?.readingC[index] ?? null;
    const warm = barWarmReadings(project, bar).find((reading) => reading.step === bar.session.steps.length);
    const standings = comparePartials(measured.map((hz) => hz * 2 ** (shift / 1200)), targets, register.tolerance_cents);
    return html`<section class="panel" aria-labelledby="last-heading">
      <h3 id="last-heading">Last round · ${formatWhen(last?.recorded_at)}${last?.source ? html` <span class="muted">(${last.source})</span>` : nothing}</h3>
      <div class="readouts" data-testid="last-round">
        ${standings.map(
          (standing, partial) =>
            html`<bw-cents-readout
              label=${partialName(partial)}
              .cents=${standing.cents}
              .verdict=${standing.verdict}
              .hz=${standing.hz}
              .targetHz=${standing.targetHz}
              .tolerance=${standing.toleranceCents}
              as-read=${readC !== null && measured[partial] !== undefined ? `read ${formatHz(measured[partial])} Hz at ${readC} °C` : ''}
            ></bw-cents-readout>`,
        )}
      </div>
      <p class="muted" data-testid="playing-note">
        ${readC !== null && temperature
          ? `At the playing temperature, ${temperature.playingC} °C: read at ${readC} °C and moved ${formatNumber(shift, 1)} cents (${formatNumber(temperature.centsPerC, 2)} cents per °C, ${temperature.from === 'learnt' ? 'learnt from this bar' : temperature.source}).`
          : `No air temperature recorded with this round: taken as read at the playing temperature, ${project.instrument.air_temperature_c} °C.`}
      </p>
      ${warm
        ? html`<p class="problem" role="status" data-testid="last-round-warm">
            Struck ${Math.round(warm.minutes_after_cut)} min after the cut: a bar still warm from the cut reads flat. Let it rest about 10 minutes and strike it again; that round will count instead.
          </p>`
        : nothing}
    </section>`;
  }
}

declare global {
  interface HTMLElementTagNameMap {
    'bw-last-round': BwLastRound;
  }
}
