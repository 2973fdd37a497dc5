// The tuning round, all on one screen: strike the bar and read its partials (listening or
// typing), see each partial's error in large signed cents, get the next cut as a station table
// and on the drawing (from the session's calibrated model), mark it done, and follow predicted
// against measured across the rounds.
import { LitElement, html, css, nothing } from 'lit';
import { customElement, property, state } from 'lit/decorators.js';
import {
  barLot,
  barLotPrior,
  barSession,
  barTargetHz,
  comparePartials,
  labelPartials,
  markCutDone,
  undoMarkedCut,
  type CutMade,
  type MarkedCut,
  recordLotLearning,
  recordStep,
  registerOf,
  readingRangesHz,
  setAdvice,
  setMinimumThickness,
  stableHash,
  tunedByLength,
  type NextCutResult,
  type ProjectBar,
  type ProjectFile,
} from '../../src/index.ts';
import { TaskController, workerJob } from '../controllers/TaskController.ts';
import { solidSolver, solver } from '../worker/SolverClient.ts';
import type { AnalyzeResult, NextCutAdvice } from '../worker/solverProtocol.ts';
import { rememberedAdviceTheory, type AdviceTheory } from '../adviceTheory.ts';
import { adviceFor, adviceProblemText, cutSinceLastRound, lastAirC, restingSince } from '../tuningRound.ts';
import { sharedStyles } from '../styles/sharedStyles.ts';
import { NavigateEvent, sendEdit } from '../events.ts';
import { formatHz, formatNumber, formatRatios, formatWhen, partialName } from '../format.ts';
import type { RoundSubmitDetail } from './bw-partial-entry.ts';
import type { ValueCommitDetail } from './bw-number-field.ts';
import type { RoundConditions } from './bw-round-conditions.ts';
import type { CutMadeDetail } from './bw-cut-made.ts';
import './bw-bar-picker.ts';
import './bw-partial-entry.ts';
import './bw-cents-readout.ts';
import './bw-profile-drawing.ts';
import './bw-round-history.ts';
import './bw-last-round.ts';
import './bw-caliper-verdict.ts';
import './bw-round-conditions.ts';
import './bw-cautions.ts';
import './bw-number-field.ts';
import './bw-cut-advice.ts';
import './bw-length-trim.ts';
import './bw-shortening-switch.ts';
import './bw-advice-theory.ts';
import './bw-solid-advice-summary.ts';

/** The listening element, when its module is part of this build. */
const listenModules = import.meta.glob('./bw-listen.ts');

/** How long "I made this cut" can be taken back, minutes (or until the next round is recorded). */
const undoMinutes = 10;

/** Detail of the listening element's `partials-measured` event. */
interface PartialsMeasuredDetail {
  partials: { hz: number; level_db?: number; decay_s?: number }[];
  source?: string;
}

/** `<bw-tuning-view .project bar-id>` */
@customElement('bw-tuning-view')
export class BwTuningView extends LitElement {
  static override styles = [
    sharedStyles,
    css`
      :host {
        display: block;
      }
      .top {
        display: flex;
        flex-wrap: wrap;
        gap: 0.8rem 1.6rem;
        align-items: end;
        margin-bottom: 0.8rem;
      }
      .target {
        font-size: 1.05rem;
      }
      .target strong {
        font-size: 1.3rem;
      }
      .layout {
        display: grid;
        gap: 1rem;
        grid-template-columns: minmax(0, 1fr);
      }
      @media (min-width: 1100px) {
        .layout {
          grid-template-columns: minmax(0, 1fr) minmax(0, 1fr);
        }
        .wide {
          grid-column: 1 / -1;
        }
      }
      .readouts {
        display: grid;
        grid-template-columns: repeat(auto-fit, minmax(10.5rem, 1fr));
        gap: 0.6rem;
      }
      .stack {
        display: grid;
        gap: 1rem;
        align-content: start;
      }
      .advice-status {
        font-size: 1.25rem;
        font-weight: 800;
      }
      .after {
        display: grid;
        grid-template-columns: repeat(auto-fit, minmax(9rem, 1fr));
        gap: 0.5rem;
      }
      .heading-row {
        display: flex;
        justify-content: space-between;
        align-items: start;
        gap: 0.6rem;
        flex-wrap: wrap;
        margin-bottom: 0.4rem;
      }
      .listen-slot {
        margin-bottom: 0.8rem;
      }
      progress {
        width: 10rem;
      }
    `,
  ];

  @property({ attribute: false }) project: ProjectFile | null = null;
  @property({ attribute: 'bar-id' }) barId = '';

  @state() private heard: (number | null)[] | null = null;
  @state() private heardFrom: 'microphone' | 'file' = 'microphone';
  @state() private roundError = '';
  @state() private listenReady = false;
  @state() private actionError = '';
  /** The air temperature and caliper readings to go with the next round. */
  @state() private conditions: RoundConditions = { airC: null, readings: [] };
  /** The model the advice is worked out on (the maker's choice, remembered in this browser). */
  @state() private theory: AdviceTheory = rememberedAdviceTheory();

  /** Prediction for the present shape from the starting-guess material (before calibration), per bar. */
  private readonly prediction = new TaskController<AnalyzeResult>(this, { policy: 'latest' });
  /**
   * Next-cut advice, per bar: stored on the bar whose session it was worked out from, and dropped
   * if that session or the model asked for changed meanwhile (a round recorded or removed, the 3D
   * model switched on or off).
   */
  private readonly advice = new TaskController<NextCutAdvice>(this, {
    isCurrent: (binding) => {
      const bar = this.project?.bars.find((candidate) => candidate.id === binding.subject);
      return bar !== undefined && this.project !== null && this.adviceKey(this.project, bar) === binding.key;
    },
    onResult: (result, binding) => {
      const sent = sendEdit(this, (project) => setAdvice(project, binding.subject, result, new Date().toISOString()));
      return sent.ok ? undefined : sent.error.message;
    },
  });
  /** The last "I made this cut" (or "done"), takeable back for a while: the bar and lots before it, and until when (ms, page clock). */
  @state() private marked: { before: MarkedCut; at: string; until: number } | null = null;
  private markedTimer: ReturnType<typeof setTimeout> | undefined;

  override connectedCallback(): void {
    super.connectedCallback();
    const load = listenModules['./bw-listen.ts'];
    if (load) void load().then(() => (this.listenReady = true)).catch(() => (this.listenReady = false));
  }

  private get bar(): ProjectBar | null {
    return this.project?.bars.find((bar) => bar.id === this.barId) ?? null;
  }

  protected override willUpdate(changed: Map<string, unknown>): void {
    const bar = this.bar;
    if (changed.has('barId')) {
      // Advice and predictions are worked out for the bar on screen: the previous bar's stop.
      const previous = changed.get('barId');
      if (typeof previous === 'string' && previous) {
        this.advice.forget(previous);
        this.prediction.forget(previous);
      }
      this.heard = null;
      this.roundError = '';
      this.marked = null;
    }
    if (!bar || !this.project) return;
    // Both pieces of work are asked for by what the bar is now (its shape and session), never by
    // what the view asked for last: a removed and re-entered round is a new session to work from.
    // What the present shape should sound: from the calibrated model once the bar has rounds (one truth with the shape view).
    const key = this.predictionKey(this.project, bar);
    if (this.prediction.state(bar.id).binding?.key !== key) {
      const measuredBar = bar.session.steps.length > 0;
      const payload = { bar: bar.current, modes: Math.max(3, registerOf(this.project, bar).ratios.length), withShapes: false, withSensitivities: false, ...(measuredBar ? this.advicePayload(this.project, bar) : {}) };
      this.prediction.run({ subject: bar.id, key }, workerJob(solver, 'analyze', payload));
    }
    const steps = bar.session.steps.length;
    // Advice is for the bar as last measured: once it has been cut again, the next thing is a round.
    if (steps > 0 && bar.state !== 'done' && !cutSinceLastRound(bar) && !adviceFor(bar, this.theory)) {
      const working = this.advice.state(bar.id);
      const asked = working.binding?.key === this.adviceKey(this.project, bar);
      // Asked for these very rounds: wait for it, or show its problem (with "Try again").
      if (!asked || (!working.running && !working.problem)) this.requestAdvice(bar);
    }
    if (this.marked && (this.marked.before.bar.id !== bar.id || this.marked.before.bar.session.steps.length !== steps)) this.marked = null;
  }

  override disconnectedCallback(): void {
    super.disconnectedCallback();
    clearTimeout(this.markedTimer);
  }

  /** The fingerprint of what a prediction of `bar` is worked out from: its shape and, once struck, its session and lot. */
  private predictionKey(project: ProjectFile, bar: ProjectBar): string {
    return `${JSON.stringify(bar.current)}:${bar.session.steps.length > 0 ? stableHash(this.advicePayload(project, bar)) : ''}`;
  }

  /** The session as the advice uses it (at the playing temperature) and what the bar's lot taught. */
  private advicePayload(project: ProjectFile, bar: ProjectBar) {
    return { session: barSession(project, bar), lot: barLotPrior(project, bar) };
  }

  /** The fingerprint of the advice asked for `bar`: its session, its lot and the model chosen (a line-model answer never stands for a 3D one). */
  private adviceKey(project: ProjectFile, bar: ProjectBar): string {
    return stableHash({ ...this.advicePayload(project, bar), theory: this.theory });
  }

  /** Works out the next cut from `bar`'s session on the chosen model (stored on that bar when done). */
  private requestAdvice(bar: ProjectBar): void {
    // A done verdict comes with what the bar teaches its lot (kept when it is marked done).
    const payload = { ...this.advicePayload(this.project!, bar), learn: { bar: bar.id, note: bar.note } };
    const binding = { subject: bar.id, key: this.adviceKey(this.project!, bar) };
    if (this.theory === 'solid') this.advice.run(binding, workerJob(solidSolver, 'nextCutSolid', payload));
    else this.advice.run(binding, workerJob(solver, 'nextCut', payload));
  }

  /** The latest prediction for the bar on screen (perhaps for its shape or rounds before the last change: for labels and drawings). */
  private get predicted(): AnalyzeResult | null {
    return this.prediction.state(this.barId).value;
  }

  /** The prediction worked out for the bar exactly as it is now (shape and rounds), or null while it is worked out. */
  private predictedNow(bar: ProjectBar): AnalyzeResult | null {
    const state = this.prediction.state(bar.id);
    return this.project && state.valueBinding?.key === this.predictionKey(this.project, bar) ? state.value : null;
  }

  private expectedHz(): number[] {
    const bar = this.bar!;
    return bar.expected_hz ?? this.predicted?.analysis.bending.map((mode) => mode.hz) ?? barTargetHz(this.project!, bar);
  }

  /** The modes the listening element labels heard partials against (predicted for this shape). */
  private expectedModes(): { bending: number[]; other: { family: string; mode: number; hz: number }[] } {
    const analysis = this.predicted?.analysis;
    return {
      bending: this.expectedHz(),
      other: analysis ? [...analysis.torsion.map((mode) => ({ family: 'torsion', mode: mode.mode, hz: mode.hz })), ...analysis.lateral.map((mode) => ({ family: 'lateral', mode: mode.mode, hz: mode.hz }))] : [],
    };
  }

  /** Fills the partial fields from what was heard: each bending mode's partial, by the library's labelling. */
  private onHeard(event: CustomEvent<PartialsMeasuredDetail>): void {
    const detail = event.detail;
    const heardHz = detail.partials.map((partial) => partial.hz);
    const count = registerOf(this.project!, this.bar!).ratios.length;
    const labels = labelPartials(heardHz, this.expectedModes());
    this.heardFrom = detail.source === 'file' ? 'file' : 'microphone';
    this.heard = Array.from({ length: count }, (_, index) => {
      const found = labels.findIndex((label) => label.mode === index + 1);
      return found >= 0 ? heardHz[found]! : null;
    });
  }

  private onRound(event: CustomEvent<RoundSubmitDetail>): void {
    const bar = this.bar!;
    // What the model expected of this shape before it was struck: only a prediction made for the bar as it is now.
    const predicted = this.predictedNow(bar)?.analysis.bending.map((mode) => mode.hz).slice(0, event.detail.hz.length);
    const options: Parameters<typeof recordStep>[3] = { at: new Date().toISOString(), source: event.detail.source };
    if (predicted) options.predictedHz = predicted;
    if (this.conditions.airC !== null) options.airTemperatureC = this.conditions.airC;
    if (this.conditions.readings.length > 0) options.measuredThicknessMm = this.conditions.readings;
    if (event.detail.torsionHz !== undefined) options.torsionHz = event.detail.torsionHz;
    if (event.detail.lateralHz !== undefined) options.lateralHz = event.detail.lateralHz;
    const outcome = sendEdit(this, (project) => recordStep(project, bar.id, event.detail.hz, options));
    this.roundError = outcome.ok ? '' : outcome.error.message;
    if (outcome.ok) {
      this.heard = null;
      this.renderRoot.querySelector('bw-round-conditions')?.clearReadings();
    }
  }

  /**
   * The advised cut is made (or the bar is done). A finished bar cut from a named lot teaches it:
   * what its rounds learnt (carried by the done advice) becomes the next bar's starting point.
   */
  private markDone(made: CutMade = {}): void {
    const at = new Date().toISOString();
    const bar = this.bar;
    if (!bar || !this.project) return;
    const lot = barLot(bar);
    const record = bar.advice?.status === 'done' ? bar.advice.lot_record : undefined;
    const before: MarkedCut = { bar: structuredClone(bar), lots: structuredClone(this.project.lots) };
    const outcome = sendEdit(this, (project) => {
      const marked = markCutDone(project, this.barId, at, made);
      return lot && record ? recordLotLearning(marked, lot, { ...record, learnt_at: at }) : marked;
    });
    this.actionError = outcome.ok ? '' : outcome.error.message;
    if (outcome.ok) {
      this.marked = { before, at, until: Date.now() + undoMinutes * 60_000 };
      clearTimeout(this.markedTimer);
      this.markedTimer = setTimeout(() => (this.marked = null), undoMinutes * 60_000);
    }
  }

  /** Takes back the last mark (the bar's shape, advice and state, and what its lot learnt). */
  private undoMark(): void {
    const marked = this.marked;
    if (!marked) return;
    const outcome = sendEdit(this, (project) => undoMarkedCut(project, marked.before, new Date().toISOString()));
    this.actionError = outcome.ok ? '' : outcome.error.message;
    if (outcome.ok) this.marked = null;
  }

  private renderUndo() {
    const marked = this.marked;
    if (!marked || Date.now() > marked.until) return nothing;
    const what = marked.before.bar.advice?.status === 'done' ? 'The bar was marked done' : 'The cut was marked as made';
    return html`<p class="undo row" role="status" data-testid="undo-cut">${what} at ${formatWhen(marked.at)}. <button @click=${this.undoMark} data-testid="undo-cut-button">Undo</button>
      <span class="muted">(for ${undoMinutes} minutes, until the next round)</span></p>`;
  }

  private setLimit(value: number): void {
    const outcome = sendEdit(this, (project) => setMinimumThickness(project, this.barId, value, new Date().toISOString()));
    this.actionError = outcome.ok ? '' : outcome.error.message;
  }

  private renderLastRound() {
    return html`<bw-last-round .project=${this.project} .bar=${this.bar}></bw-last-round>`;
  }

  private renderAdvice() {
    const bar = this.bar!;
    const advice = adviceFor(bar, this.theory);
    const project = this.project!;
    const register = registerOf(project, bar);
    const targets = barTargetHz(project, bar);
    if (tunedByLength(bar)) return html`<bw-length-trim .project=${project} .bar=${bar}></bw-length-trim>`;
    if (bar.session.steps.length === 0) return html`<section class="panel"><h3>Next cut</h3><p class="muted">Record a round first: advice is based on what the bar sounds like.</p></section>`;
    if (bar.state === 'done' && !advice) return html`<section class="panel"><h3>Next cut</h3><p class="advice-status in-tune">● This bar is marked done.</p></section>`;
    if (cutSinceLastRound(bar)) {
      const expected = bar.expected_hz ? comparePartials(bar.expected_hz, targets, register.tolerance_cents) : null;
      return html`<section class="panel" aria-labelledby="advice-heading">
        <div class="heading-row"><h3 id="advice-heading">Next cut</h3>${this.renderLimit()}</div>
        <p class="advice-status" data-testid="strike-now">The bar has been cut since the last round: strike it and record the round.</p>
        <p class="muted">The next advice is worked out from what it sounds like now.</p>
        ${expected
          ? html`<h4>Expected now</h4>
              <div class="after">
                ${expected.map((standing, index) => html`<bw-cents-readout compact label=${partialName(index)} .cents=${standing.cents} .verdict=${standing.verdict} .hz=${standing.hz} .targetHz=${standing.targetHz}></bw-cents-readout>`)}
              </div>`
          : nothing}
        <bw-profile-drawing .bar=${bar.current} .nodesMm=${this.predicted?.analysis.bending[0]?.nodes_mm ?? []}></bw-profile-drawing>
      </section>`;
    }
    if (!advice) {
      const working = this.advice.state(bar.id);
      const problem = working.problem;
      return html`<section class="panel" aria-labelledby="advice-heading">
        <div class="heading-row"><h3 id="advice-heading">Next cut</h3>${this.renderLimit()}</div>
        ${working.running
          ? html`<div class="row" role="status" data-testid="advice-working"><progress aria-label="Working out the next cut"></progress> ${this.theory === 'solid' ? 'Working out the next cut on the 3D model (about 20 seconds; a minute or more when the grain is fitted at an angle)…' : 'Working out the next cut…'} <button @click=${() => this.advice.cancel(bar.id)} data-testid="advice-cancel">Cancel</button></div>`
          : problem
            ? html`<p class=${problem.status === 'unavailable' ? 'unavailable' : 'problem'} role="status">${adviceProblemText(problem)}</p>
                <p class="muted">You can still record rounds, and enter a cut you made by hand in the <button @click=${() => this.dispatchEvent(new NavigateEvent('shape', bar.id))}>Shape view</button>.</p>
                ${problem.status !== 'unavailable' ? html`<button @click=${() => this.requestAdvice(bar)}>Try again</button>` : nothing}`
            : nothing}
      </section>`;
    }
    const extras = advice as { wait_minutes?: number; temperature?: NextCutResult['temperature']; calibration?: NextCutResult['calibration'] };
    const calibrated = advice.calibrated_material && !('preset' in advice.calibrated_material) ? advice.calibrated_material : null;
    return html`<section class="panel" aria-labelledby="advice-heading">
      <div class="heading-row"><h3 id="advice-heading">Next cut</h3>${this.renderLimit()}</div>
      <bw-caliper-verdict .checked=${extras.calibration?.cut_from_plan.find((entry) => entry.step === bar.session.steps.length) ?? null}></bw-caliper-verdict>
      ${advice.status === 'done'
        ? html`<p class="advice-status in-tune">● All partials are within tolerance: no cut needed.</p>
            ${extras.wait_minutes && extras.wait_minutes > 0 ? html`<p class="problem" role="status" data-testid="still-warm">The last round was struck while the bar was still warm from the cut (it reads flat): strike it again in ${extras.wait_minutes} min before marking it done.</p>` : nothing}
            <button class="primary" @click=${() => this.markDone()}>Mark the bar done</button>`
        : html`<bw-cut-advice .project=${project} .bar=${bar} .advice=${advice} .nodesMm=${this.predicted?.analysis.bending[0]?.nodes_mm ?? []}
            @cut-made=${(event: CustomEvent<CutMadeDetail>) => this.markDone(event.detail.percent < 100 ? { percent: event.detail.percent } : {})}></bw-cut-advice>`}
      ${advice.theory === 'solid' ? html`<bw-solid-advice-summary .report=${advice.solid ?? null}></bw-solid-advice-summary>` : nothing}
      ${calibrated
        ? html`<details>
            <summary>What the rounds taught about this blank</summary>
            <p>Calibrated from ${bar.session.steps.length} round${bar.session.steps.length === 1 ? '' : 's'}: stiffness along the grain ${formatNumber(calibrated.E_GPa, 2)} GPa${calibrated.G_GPa !== undefined ? `, shear stiffness ${formatNumber(calibrated.G_GPa, 3)} GPa` : ''}, density ${formatNumber(calibrated.density_kg_m3, 0)} kg/m³.</p>
            ${extras.temperature ? html`<p>Pitch moves ${formatNumber(extras.temperature.pitch_cents_per_c, 2)} cents per °C (${extras.temperature.pitch_from === 'learnt' ? 'learnt from this bar' : extras.temperature.pitch_source}).</p>` : nothing}
            ${extras.calibration?.lot ? html`<p data-testid="advice-lot">Started from lot ${extras.calibration.lot.name}, learnt from ${extras.calibration.lot.bars.map((id) => project.bars.find((b) => b.id === id)?.note ?? id).join(', ')}.</p>` : nothing}
          </details>`
        : nothing}
    </section>`;
  }

  private renderLimit() {
    const bar = this.bar!;
    return html`<div class="limit"><bw-advice-theory theory=${this.theory} @advice-theory-change=${(event: CustomEvent<AdviceTheory>) => (this.theory = event.detail)}></bw-advice-theory><bw-number-field label="Thinnest allowed" unit="mm" name="min-thickness" .value=${bar.session.limits.min_thickness_mm} .min=${0} exclusive-min hint="Advice never cuts below this." @value-commit=${(event: CustomEvent<ValueCommitDetail>) => this.setLimit(event.detail.value)}></bw-number-field><bw-shortening-switch .bar=${bar}></bw-shortening-switch></div>`;
  }

  private renderHistory() {
    return html`<section class="panel wide" aria-labelledby="history-heading">
      <bw-round-history .project=${this.project} .bar=${this.bar}></bw-round-history>
      ${this.actionError ? html`<p class="problem" role="alert">${this.actionError}</p>` : nothing}
    </section>`;
  }

  protected override render() {
    const project = this.project;
    const bar = this.bar;
    if (!project || !bar) return html`<p>Choose a bar in the keyboard list.</p>`;
    const register = registerOf(project, bar);
    const targets = barTargetHz(project, bar);
    return html`<div class="top">
        <bw-bar-picker .bars=${project.bars} bar-id=${bar.id}></bw-bar-picker>
        <p class="target">Target <strong>${bar.note}</strong> · ${targets.map((hz, index) => html`${index > 0 ? ' · ' : ''}${formatHz(hz)} Hz`)} · ratios ${formatRatios(register.ratios)} · tolerance ±${register.tolerance_cents.join(' / ')} cents · at <strong>${project.instrument.air_temperature_c} °C</strong> (playing)${barLot(bar) ? ` · lot ${barLot(bar)}` : ''}</p>
      </div>
      <div class="layout">
        <div class="stack">
          ${this.renderLastRound()}
          <section class="panel" aria-labelledby="strike-heading">
            <h3 id="strike-heading">Strike and read</h3>
            <div class="listen-slot">
              ${this.listenReady
                ? html`<bw-listen .targetHz=${targets} .expected=${this.expectedModes()} .toleranceCents=${register.tolerance_cents} a4-hz=${project.instrument.a4_hz} @partials-measured=${this.onHeard}></bw-listen>`
                : html`<p class="unavailable">Listening (microphone or recording) is not available yet: type the partials below.</p>`}
            </div>
            <bw-partial-entry .count=${register.ratios.length} .targets=${targets} .ranges=${readingRangesHz(this.expectedHz().slice(0, register.ratios.length))} .filled=${this.heard} .filledFrom=${this.heardFrom} @round-submit=${this.onRound}></bw-partial-entry>
            <bw-round-conditions
              .checkpoints=${cutSinceLastRound(bar) ? (bar.checkpoints ?? null) : null}
              finished-at=${restingSince(bar)}
              .airC=${lastAirC(bar)}
              playing-c=${project.instrument.air_temperature_c}
              blank-mm=${bar.blank.section.shape === 'rect' ? bar.blank.section.thickness_mm : 0}
              @conditions-change=${(event: CustomEvent<RoundConditions>) => (this.conditions = event.detail)}
            ></bw-round-conditions>
            ${this.roundError ? html`<p class="problem" role="alert">${this.roundError}</p>` : nothing}
          </section>
        </div>
        <div class="stack">${this.renderUndo()}${this.renderAdvice()}</div>
        ${this.renderHistory()}
      </div>`;
  }
}

declare global {
  interface HTMLElementTagNameMap {
    'bw-tuning-view': BwTuningView;
  }
}
