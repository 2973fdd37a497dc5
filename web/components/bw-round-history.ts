// The rounds so far: each partial's error at the playing temperature (what the reading means on
// the stage), with the reading as taken and the air temperature beside it, plotted against what
// was predicted before striking; warm readings marked; the last round can be removed.
import { LitElement, html, css, nothing } from 'lit';
import { customElement, property, state } from 'lit/decorators.js';
import { barTargetHz, barTemperature, barWarmReadings, comparePartials, registerOf, removeLastStep, type ProjectBar, type ProjectFile, type WarmReading } from '../../src/index.ts';
import { sharedStyles } from '../styles/sharedStyles.ts';
import { sendEdit } from '../events.ts';
import { formatCents, formatHz, formatNumber, formatWhen, partialName } from '../format.ts';
import type { RoundErrors } from './bw-round-chart.ts';
import './bw-round-chart.ts';

/** "warm" beside a round read soon after its cut, and whether a later reading governs. */
function warmNote(warm: WarmReading | undefined) {
  if (!warm) return nothing;
  return html` <span class="read">(warm: ${Math.round(warm.minutes_after_cut)} min after the cut${warm.superseded_by !== null ? `; round ${warm.superseded_by} governs` : ''})</span>`;
}

/** `<bw-round-history .project .bar>` */
@customElement('bw-round-history')
export class BwRoundHistory extends LitElement {
  static override styles = [
    sharedStyles,
    css`
      :host {
        display: block;
      }
      table.rounds {
        width: 100%;
      }
      .read {
        color: var(--bw-ink-muted);
        font-size: 0.85rem;
      }
    `,
  ];

  @property({ attribute: false }) project: ProjectFile | null = null;
  @property({ attribute: false }) bar: ProjectBar | null = null;
  @state() private actionError = '';

  private undoRound(): void {
    const outcome = sendEdit(this, (project) => removeLastStep(project, this.bar!.id, new Date().toISOString()));
    this.actionError = outcome.ok ? '' : outcome.error.message;
  }

  protected override render() {
    const project = this.project;
    const bar = this.bar;
    if (!project || !bar) return nothing;
    const register = registerOf(project, bar);
    const targets = barTargetHz(project, bar);
    const temperature = barTemperature(project, bar);
    const shift = (index: number): number => temperature?.shiftCents[index] ?? 0;
    const projected = (hz: readonly number[], index: number): number[] => hz.map((value) => value * 2 ** (shift(index) / 1200));
    const warm = barWarmReadings(project, bar);
    const rounds: RoundErrors[] = bar.session.steps.map((step, index) => ({
      measured: comparePartials(projected(step.measured_hz, index), targets, register.tolerance_cents).map((standing) => (standing.hz === null ? null : standing.cents)),
      predicted: comparePartials(step.predicted_hz ?? [], targets, register.tolerance_cents).map((standing) => (standing.hz === null ? null : standing.cents)),
    }));
    return html`<h3 id="history-heading">Rounds so far</h3>
      ${rounds.length === 0
        ? html`<p class="muted">No rounds yet.</p>`
        : html`<bw-round-chart .rounds=${rounds}></bw-round-chart>
            <p class="muted">Cents at the playing temperature, ${project.instrument.air_temperature_c} °C${temperature ? ` (${formatNumber(temperature.centsPerC, 2)} cents per °C, ${temperature.from === 'learnt' ? 'learnt from this bar' : temperature.from})` : ''}; each reading as taken beneath.</p>
            <table class="rounds" data-testid="rounds">
              <caption class="visually-hidden">Each round's partials</caption>
              <thead>
                <tr>
                  <th scope="col">Round</th>
                  <th scope="col">When</th>
                  <th scope="col" class="number">Air (°C)</th>
                  ${targets.map((_, index) => html`<th scope="col" class="number">${partialName(index)} (cents · Hz read)</th>`)}
                </tr>
              </thead>
              <tbody>
                ${bar.session.steps.map(
                  (step, index) => html`<tr>
                    <td>${index + 1}</td>
                    <td>${formatWhen(step.recorded_at)}${warmNote(warm.find((w) => w.step === index + 1))}</td>
                    <td class="number">${step.air_temperature_c ?? '–'}</td>
                    ${targets.map((_, partial) => html`<td class="number">${formatCents(rounds[index]!.measured[partial])} <span class="read">· ${formatHz(step.measured_hz[partial])}</span></td>`)}
                  </tr>`,
                )}
              </tbody>
            </table>
            <p class="row" style="margin-top: 0.6rem"><button @click=${this.undoRound}>Remove the last round (mistyped)</button></p>`}
      ${this.actionError ? html`<p class="problem" role="alert">${this.actionError}</p>` : nothing}`;
  }
}

declare global {
  interface HTMLElementTagNameMap {
    'bw-round-history': BwRoundHistory;
  }
}
