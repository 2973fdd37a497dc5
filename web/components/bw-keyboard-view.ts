// The keyboard overview: the instrument's settings (range, A4, timber or metal, target ratios per
// register), the whole-keyboard plan, and the bar list (bw-bar-list) with every bar's partials'
// errors in cents — as last heard when measured, otherwise as predicted for its present shape
// (solved in a worker here, with progress and cancel).
import { LitElement, html, css, nothing } from 'lit';
import { customElement, property, state } from 'lit/decorators.js';
import { checkA4, materialFileFamily, parseRatioText, parseToleranceText, setInstrumentRange, stableHash, updateInstrument, updateRegister, type ProjectFile, type Register } from '../../src/index.ts';
import { TaskController, workerJob } from '../controllers/TaskController.ts';
import { solver } from '../worker/SolverClient.ts';
import type { AnalyzeManyEntry } from '../worker/solverProtocol.ts';
import { sharedStyles } from '../styles/sharedStyles.ts';
import { sendEdit } from '../events.ts';
import type { ValueCommitDetail } from './bw-number-field.ts';
import './bw-number-field.ts';
import './bw-keyboard-plan.ts';
import './bw-bar-list.ts';
import './bw-lot-panel.ts';

/** `<bw-keyboard-view .project>` */
@customElement('bw-keyboard-view')
export class BwKeyboardView extends LitElement {
  static override styles = [
    sharedStyles,
    css`
      :host {
        display: block;
      }
      .grid {
        display: grid;
        gap: 1rem;
      }
      .settings {
        display: flex;
        flex-wrap: wrap;
        gap: 0.8rem 1.6rem;
        align-items: start;
      }
      .fact {
        display: grid;
        gap: 0.2rem;
      }
      .fact strong {
        font-size: 1.05rem;
      }
      .registers input {
        width: 8rem;
      }
      .field-error {
        color: var(--bw-problem-ink);
        font-size: 0.85rem;
        display: block;
      }
      .range input {
        width: 5.5rem;
      }
      .settings + h3 {
        margin-top: 1rem;
      }
      .hint {
        display: block;
        font-size: 0.85rem;
        color: var(--bw-ink-muted);
      }
      .range .pair {
        display: flex;
        gap: 0.4rem;
        align-items: center;
      }
    `,
  ];

  @property({ attribute: false }) project: ProjectFile | null = null;

  @state() private predictions = new Map<string, AnalyzeManyEntry>();
  @state() private registerErrors: Record<string, string> = {};
  @state() private a4Error = '';
  @state() private temperatureError = '';
  @state() private rangeError = '';
  /** Predictions for every bar's present shape (new shapes restart it; kept until new ones arrive). */
  private readonly prediction = new TaskController<AnalyzeManyEntry[]>(this, { onResult: (entries) => void (this.predictions = new Map(entries.map((entry) => [entry.id, entry]))) });
  private lastKey = '';

  protected override willUpdate(changed: Map<string, unknown>): void {
    if (changed.has('project') && this.project) {
      // Order-free: moving a bar in the list does not ask for new predictions.
      const key = JSON.stringify([...this.project.bars].sort((a, b) => a.id.localeCompare(b.id)).map((bar) => [bar.id, bar.current]));
      if (key !== this.lastKey) {
        this.lastKey = key;
        void this.predict();
      }
    }
  }

  private predict(): void {
    const project = this.project;
    if (!project) return;
    const payload = { bars: [...project.bars].sort((a, b) => a.id.localeCompare(b.id)).map((bar) => ({ id: bar.id, bar: bar.current })), modes: 3 };
    this.prediction.run({ subject: 'bars', key: stableHash(payload) }, workerJob(solver, 'analyzeMany', payload));
  }

  /** What the bar list says about its predictions when none are running. */
  private predictionNote(): string {
    const problem = this.prediction.state('bars').problem;
    if (!problem) return '';
    switch (problem.status) {
      case 'cancelled':
        return 'Predictions cancelled; measured values are still shown.';
      case 'unavailable':
        return `${problem.what} is not available yet.`;
      case 'stale':
        return '';
      default:
        return problem.message;
    }
  }

  private editRatios(register: Register, text: string): void {
    const key = `${register.id}.ratios`;
    const outcome = sendEdit(this, (project) => updateRegister(project, register.id, { ratios: parseRatioText(text) }));
    this.registerErrors = { ...this.registerErrors, [key]: outcome.ok ? '' : outcome.error.rule };
  }

  private editTolerances(register: Register, text: string): void {
    const key = `${register.id}.tolerance`;
    const outcome = sendEdit(this, (project) => updateRegister(project, register.id, { tolerance_cents: parseToleranceText(text, register.ratios.length) }));
    this.registerErrors = { ...this.registerErrors, [key]: outcome.ok ? '' : outcome.error.rule };
  }

  private editA4(value: number): void {
    const outcome = sendEdit(this, (project) => updateInstrument(project, { a4_hz: checkA4(value, 'instrument', 'a4_hz') }));
    this.a4Error = outcome.ok ? '' : outcome.error.rule;
  }

  private editPlayingTemperature(value: number): void {
    const outcome = sendEdit(this, (project) => updateInstrument(project, { air_temperature_c: value }));
    this.temperatureError = outcome.ok ? '' : outcome.error.rule;
  }

  private editRange(lowest: string, highest: string): void {
    const outcome = sendEdit(this, (project) => setInstrumentRange(project, lowest, highest));
    this.rangeError = outcome.ok ? '' : outcome.error.rule;
  }

  protected override render() {
    const project = this.project;
    if (!project) return nothing;
    const instrument = project.instrument;
    const material = instrument.material;
    const predicting = this.prediction.state('bars');
    const progress = predicting.progress ?? { done: 0, total: project.bars.length };
    return html`<div class="grid">
      <section class="panel" aria-labelledby="instrument-heading">
        <h2 id="instrument-heading">${instrument.name}</h2>
        <div class="settings">
          <div class="fact range">
            <span class="muted" id="range-label">Range</span>
            <div class="pair" role="group" aria-labelledby="range-label">
              <label class="visually-hidden" for="range-lowest">Lowest note</label>
              <input id="range-lowest" autocomplete="off" .value=${instrument.lowest_note} aria-invalid=${this.rangeError ? 'true' : 'false'} @change=${(event: Event) => this.editRange((event.target as HTMLInputElement).value, instrument.highest_note)} />
              <span>to</span>
              <label class="visually-hidden" for="range-highest">Highest note</label>
              <input id="range-highest" autocomplete="off" .value=${instrument.highest_note} aria-invalid=${this.rangeError ? 'true' : 'false'} @change=${(event: Event) => this.editRange(instrument.lowest_note, (event.target as HTMLInputElement).value)} />
            </div>
            ${this.rangeError ? html`<span class="field-error" role="alert" data-testid="range-error">✕ ${this.rangeError}</span>` : nothing}
          </div>
          <bw-number-field label="A4 reference" unit="Hz" name="a4" .value=${instrument.a4_hz} .min=${300} .max=${600} step="0.5" error=${this.a4Error} @value-commit=${(event: CustomEvent<ValueCommitDetail>) => this.editA4(event.detail.value)}></bw-number-field>
          <bw-number-field
            label="Playing temperature"
            unit="°C"
            name="playing-temperature"
            .value=${instrument.air_temperature_c}
            .min=${-30}
            .max=${60}
            step="0.5"
            hint="Readings are shown at it; tubes are sized for it."
            error=${this.temperatureError}
            @value-commit=${(event: CustomEvent<ValueCommitDetail>) => this.editPlayingTemperature(event.detail.value)}
          ></bw-number-field>
          <div class="fact"><span class="muted">${materialFileFamily(material) === 'metal' ? 'Metal' : 'Timber'} (starting guess)</span><strong>${'label' in material && material.label ? material.label : 'preset' in material ? material.preset : 'custom'}</strong></div>
        </div>
        <h3>Registers</h3>
        <div class="table-wrap registers">
          <table>
            <thead><tr><th scope="col">Register</th><th scope="col">Target ratios</th><th scope="col">Tolerance (cents)</th><th scope="col" class="number">Resonator inner ⌀ (mm)</th></tr></thead>
            <tbody>
              ${instrument.registers.map(
                (register) => html`<tr>
                  <th scope="row">${register.label}</th>
                  <td>
                    <label class="visually-hidden" for=${`ratios-${register.id}`}>Target ratios of ${register.label}</label>
                    <input id=${`ratios-${register.id}`} .value=${register.ratios.join(' : ')} @change=${(event: Event) => this.editRatios(register, (event.target as HTMLInputElement).value)} aria-invalid=${this.registerErrors[`${register.id}.ratios`] ? 'true' : 'false'} />
                    ${this.registerErrors[`${register.id}.ratios`]
                      ? html`<span class="field-error" role="alert">✕ ${this.registerErrors[`${register.id}.ratios`]}</span>`
                      : register.ratios.length === 1
                        ? html`<span class="hint">fundamental only</span>`
                        : nothing}
                  </td>
                  <td>
                    <label class="visually-hidden" for=${`tolerance-${register.id}`}>Tolerances of ${register.label} in cents</label>
                    <input id=${`tolerance-${register.id}`} .value=${register.tolerance_cents.join(', ')} @change=${(event: Event) => this.editTolerances(register, (event.target as HTMLInputElement).value)} aria-invalid=${this.registerErrors[`${register.id}.tolerance`] ? 'true' : 'false'} />
                    ${this.registerErrors[`${register.id}.tolerance`] ? html`<span class="field-error" role="alert">✕ ${this.registerErrors[`${register.id}.tolerance`]}</span>` : nothing}
                  </td>
                  <td class="number">${register.resonator_inner_diameter_mm ?? '–'}</td>
                </tr>`,
              )}
            </tbody>
          </table>
        </div>
      </section>
      <bw-keyboard-plan .project=${project}></bw-keyboard-plan>
      <bw-bar-list
        .project=${project}
        .predictions=${this.predictions}
        .predicting=${{ running: predicting.running, progress, note: this.predictionNote() }}
        @predictions-cancel=${() => this.prediction.cancel('bars')}
      ></bw-bar-list>
      <bw-lot-panel .project=${project}></bw-lot-panel>
    </div>`;
  }
}

declare global {
  interface HTMLElementTagNameMap {
    'bw-keyboard-view': BwKeyboardView;
  }
}
