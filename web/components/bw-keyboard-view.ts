// The keyboard overview: the instrument's settings (range, A4, timber, target ratios per
// register) and every bar's state at a glance with its partials' errors in cents — as last
// heard when measured, otherwise as predicted for its present shape (solved in a worker, with
// progress and cancel).
import { LitElement, html, css, nothing } from 'lit';
import { customElement, property, state } from 'lit/decorators.js';
import { barTargetHz, checkA4, parseNote, comparePartials, lastMeasuredHz, parseRatioText, parseToleranceText, registerOf, stableHash, updateInstrument, updateRegister, type ProjectBar, type ProjectFile, type Register } from '../../src/index.ts';
import { TaskController, workerJob } from '../controllers/TaskController.ts';
import { solver } from '../worker/SolverClient.ts';
import type { AnalyzeManyEntry } from '../worker/solverProtocol.ts';
import { sharedStyles } from '../styles/sharedStyles.ts';
import { NavigateEvent, sendEdit } from '../events.ts';
import { formatCents, formatMm, formatWhen, partialName, stateName, verdictClass, verdictMark } from '../format.ts';
import type { ValueCommitDetail } from './bw-number-field.ts';
import './bw-number-field.ts';
import './bw-keyboard-plan.ts';

const stateMarks: Record<ProjectBar['state'], string> = { 'not-started': '○', rough: '◔', tuning: '◑', done: '✔' };

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
      table.bars {
        width: 100%;
      }
      table.bars td.note {
        font-size: 1.3rem;
        font-weight: 800;
      }
      .cents {
        display: inline-block;
        min-width: 5.4rem;
        font-weight: 700;
        font-variant-numeric: tabular-nums;
      }
      .source {
        font-size: 0.8rem;
        color: var(--bw-ink-muted);
        display: block;
      }
      .state {
        white-space: nowrap;
        font-weight: 600;
      }
      .actions div {
        display: flex;
        gap: 0.4rem;
        flex-wrap: wrap;
      }
      .field-error {
        color: var(--bw-problem-ink);
        font-size: 0.85rem;
        display: block;
      }
      progress {
        width: 10rem;
      }
    `,
  ];

  @property({ attribute: false }) project: ProjectFile | null = null;

  @state() private predictions = new Map<string, AnalyzeManyEntry>();
  @state() private registerErrors: Record<string, string> = {};
  @state() private a4Error = '';
  /** Predictions for every bar's present shape (new shapes restart it; kept until new ones arrive). */
  private readonly prediction = new TaskController<AnalyzeManyEntry[]>(this, { onResult: (entries) => void (this.predictions = new Map(entries.map((entry) => [entry.id, entry]))) });
  private lastKey = '';

  protected override willUpdate(changed: Map<string, unknown>): void {
    if (changed.has('project') && this.project) {
      const key = JSON.stringify(this.project.bars.map((bar) => [bar.id, bar.current]));
      if (key !== this.lastKey) {
        this.lastKey = key;
        void this.predict();
      }
    }
  }

  private predict(): void {
    const project = this.project;
    if (!project) return;
    const payload = { bars: project.bars.map((bar) => ({ id: bar.id, bar: bar.current })), modes: 3 };
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

  private go(view: 'shape' | 'tuning', barId: string): void {
    this.dispatchEvent(new NavigateEvent(view, barId));
  }

  private renderErrors(bar: ProjectBar) {
    const project = this.project!;
    const register = registerOf(project, bar);
    const targets = barTargetHz(project, bar);
    const measured = lastMeasuredHz(bar);
    const prediction = this.predictions.get(bar.id);
    const hz = measured ?? prediction?.analysis?.bending.map((mode) => mode.hz) ?? null;
    if (!hz) return html`<span class="muted">${prediction?.error ?? (this.prediction.state('bars').running ? 'predicting…' : '–')}</span>`;
    const standings = comparePartials(hz, targets, register.tolerance_cents);
    const when = measured ? `heard ${formatWhen(bar.session.steps[bar.session.steps.length - 1]?.recorded_at)}` : 'predicted';
    return html`${standings.map(
        (standing, index) =>
          html`<span class="cents ${verdictClass(standing.verdict)}" title=${`${partialName(index)}: ${standing.verdict ?? 'no reading'}`}
            >${verdictMark(standing.verdict)} ${formatCents(standing.cents)}<span class="visually-hidden"> cents ${standing.verdict ?? ''}</span></span
          >`,
      )}<span class="source">${when}</span>`;
  }

  /** The bar's planned undercut in words: in tolerance, out of tolerance, or cannot be made (with the reason on hover). */
  private planText(bar: ProjectBar) {
    const design = bar.design;
    if (!design) return html`<span class="muted">–</span>`;
    const midi = parseNote(bar.note).midi;
    const planned = Object.values(this.project!.keyboard_plan?.plan.bars ?? {}).find((entry) => entry.midi === midi && registerOf(this.project!, bar).family === 'keyboard');
    const tolerance = registerOf(this.project!, bar).tolerance_cents;
    const within = design.cents_error.every((c, k) => Math.abs(c) <= (tolerance[k] ?? tolerance[tolerance.length - 1] ?? 0));
    const status = planned?.status ?? (design.feasible ? 'in-tolerance' : within ? 'infeasible' : 'out-of-tolerance');
    const [mark, words] = status === 'infeasible' ? ['✕', 'cannot be made'] : status === 'in-tolerance' ? ['✔', 'in tolerance'] : ['!', 'out of tolerance'];
    return html`<span class="state" data-plan-status=${status} title=${design.reason ?? ''}>${mark} ${words}</span>`;
  }

  private blankText(bar: ProjectBar): string {
    const section = bar.blank.section;
    if (section.shape === 'rect') return `${formatMm(bar.blank.length_mm, 0)} × ${formatMm(section.width_mm, 0)} × ${formatMm(section.thickness_mm, 0)}`;
    if (section.shape === 'tube') return `${formatMm(bar.blank.length_mm, 1)}, tube ⌀${formatMm(section.outer_diameter_mm, 1)} × ${formatMm(section.wall_mm, 1)}`;
    return `${formatMm(bar.blank.length_mm, 1)}, rod ⌀${formatMm(section.diameter_mm, 1)}`;
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
          <div class="fact"><span class="muted">Range</span><strong>${instrument.lowest_note} to ${instrument.highest_note}</strong></div>
          <bw-number-field label="A4 reference" unit="Hz" name="a4" .value=${instrument.a4_hz} .min=${300} .max=${600} step="0.5" error=${this.a4Error} @value-commit=${(event: CustomEvent<ValueCommitDetail>) => this.editA4(event.detail.value)}></bw-number-field>
          <div class="fact"><span class="muted">Timber (starting guess)</span><strong>${'label' in material && material.label ? material.label : 'preset' in material ? material.preset : 'custom'}</strong></div>
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
                    ${this.registerErrors[`${register.id}.ratios`] ? html`<span class="field-error" role="alert">✕ ${this.registerErrors[`${register.id}.ratios`]}</span>` : nothing}
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
      <section class="panel" aria-labelledby="bars-heading">
        <div class="row" style="justify-content: space-between">
          <h2 id="bars-heading">Bars</h2>
          <div class="row" aria-live="polite">
            ${predicting.running
              ? html`<progress max=${progress.total} value=${progress.done} aria-label="Predicting partials"></progress><span>Predicting ${progress.done} of ${progress.total}</span><button @click=${() => this.prediction.cancel('bars')}>Cancel</button>`
              : html`<span class="muted">${this.predictionNote()}</span>`}
          </div>
        </div>
        <p class="muted">${project.bars.length} bars set up. Cents from target per partial (fundamental first): ▲ sharp · ▼ flat · ● in tune.</p>
        <div class="table-wrap">
          <table class="bars" data-testid="bar-list">
            <thead>
              <tr><th scope="col">Note</th><th scope="col">State</th><th scope="col">Blank (mm)</th><th scope="col">Partials (cents)</th><th scope="col">Plan</th><th scope="col" class="number">Rounds</th><th scope="col">Open</th></tr>
            </thead>
            <tbody>
              ${project.bars.map(
                (bar) => html`<tr data-bar=${bar.id}>
                  <td class="note">${bar.note}<span class="source">${registerOf(project, bar).label}</span></td>
                  <td class="state">${stateMarks[bar.state]} ${stateName(bar.state)}</td>
                  <td>${this.blankText(bar)}</td>
                  <td>${this.renderErrors(bar)}</td>
                  <td>${this.planText(bar)}</td>
                  <td class="number">${bar.session.steps.length}</td>
                  <td class="actions"><div>
                    <button @click=${() => this.go('shape', bar.id)} aria-label=${`Shape of ${bar.note}`}>Shape</button>
                    <button class="primary" @click=${() => this.go('tuning', bar.id)} aria-label=${`Tune ${bar.note}`}>Tune</button>
                  </div></td>
                </tr>`,
              )}
            </tbody>
          </table>
        </div>
      </section>
    </div>`;
  }
}

declare global {
  interface HTMLElementTagNameMap {
    'bw-keyboard-view': BwKeyboardView;
  }
}
