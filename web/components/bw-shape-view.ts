// The bar view: blank and timber, the side profile to scale (drag the stations' depths), the
// predicted partials against their targets in cents (updated while dragging, solved in a
// worker), mode shapes with node positions, the where-to-cut map, collision warnings and the
// undercut planner. Engineering figures sit behind a disclosure.
import { LitElement, html, css, nothing } from 'lit';
import { customElement, property, state } from 'lit/decorators.js';
import { adoptDesign, barCalibrationInputs, barMaterialFamily, barTargetHz, comparePartials, registerOf, setBarNotes, setBarShape, setBarState, setDesign, stableHash, withStations, type BarFile, type BarState, type CalibrationSummary, type CutEffectMap, type DesignResult, type ModeResult, type ProjectBar, type ProjectFile } from '../../src/index.ts';
import { TaskController, workerJob, type TaskBinding, type TaskProblem } from '../controllers/TaskController.ts';
import { solver } from '../worker/SolverClient.ts';
import type { AnalyzeResult, DesignPayload } from '../worker/solverProtocol.ts';
import { sharedStyles } from '../styles/sharedStyles.ts';
import { sendEdit } from '../events.ts';
import { formatCents, formatHz, formatMm, formatNumber, formatRatios, partialName, stateMeanings, stateName } from '../format.ts';
import type { ProfileChangeDetail } from './bw-profile-drawing.ts';
import './bw-bar-picker.ts';
import './bw-blank-form.ts';
import './bw-profile-drawing.ts';
import './bw-cents-readout.ts';
import './bw-mode-chart.ts';
import './bw-cut-map.ts';
import './bw-cautions.ts';
import './bw-solid-check.ts';

/** `<bw-shape-view .project bar-id>` */
@customElement('bw-shape-view')
export class BwShapeView extends LitElement {
  static override styles = [
    sharedStyles,
    css`
      :host {
        display: block;
      }
      .top {
        display: flex;
        flex-wrap: wrap;
        justify-content: space-between;
        gap: 0.8rem;
        align-items: end;
        margin-bottom: 0.8rem;
      }
      .layout {
        display: grid;
        grid-template-columns: minmax(0, 1fr);
        gap: 1rem;
      }
      @media (min-width: 1100px) {
        .layout {
          grid-template-columns: 22rem minmax(0, 1fr);
        }
      }
      .readouts {
        display: grid;
        grid-template-columns: repeat(auto-fit, minmax(11rem, 1fr));
        gap: 0.6rem;
        margin: 0.6rem 0;
      }
      .status {
        font-size: 0.9rem;
        color: var(--bw-ink-muted);
        min-height: 1.4rem;
      }
      .warnings li {
        margin-bottom: 0.3rem;
      }
      .stack {
        display: grid;
        gap: 1rem;
        align-content: start;
      }
      .notes {
        display: grid;
        gap: 0.3rem;
      }
      .notes textarea {
        width: 100%;
        resize: vertical;
      }
      .state-field {
        display: grid;
        gap: 0.2rem;
      }
      .spread {
        display: flex;
        gap: 0.3rem 0.6rem;
        align-items: center;
        flex-wrap: wrap;
      }
      progress {
        width: 12rem;
        height: 1rem;
      }
      ul.others {
        list-style: none;
        padding: 0;
        margin: 0.6rem 0 0;
      }
    `,
  ];

  @property({ attribute: false }) project: ProjectFile | null = null;
  @property({ attribute: 'bar-id' }) barId = '';

  @state() private preview: BarFile | null = null;
  @state() private shapeError = '';
  @state() private lastUpdateMs: number | null = null;
  @state() private spread = 30;
  /** Bending modes of the last result that carried mode shapes (kept while dragging). */
  @state() private shapedModes: ModeResult[] = [];
  /** The last where-to-cut map (kept while dragging; refreshed when the drag ends). */
  @state() private cutMap: CutEffectMap | null = null;

  /** The partials of the shape on screen, per bar; while dragging only the newest shape follows the one being solved. */
  private readonly analysis = new TaskController<AnalyzeResult>(this, { policy: 'latest', onResult: (value, binding, givenAt) => this.onAnalysis(value, binding, givenAt) });
  /**
   * Undercut plans, per bar: each stored on the bar that asked for it (whichever bar is on screen
   * when it finishes), and dropped if that bar's blank or targets changed meanwhile.
   */
  private readonly design = new TaskController<DesignResult>(this, {
    isCurrent: (binding) => this.designKey(binding.subject) === binding.key,
    onResult: (result, binding) => {
      const outcome = sendEdit(this, (project) => setDesign(project, binding.subject, result, new Date().toISOString()));
      return outcome.ok ? undefined : outcome.error.message;
    },
  });
  private lastGiven = '';

  private get bar() {
    return this.project?.bars.find((bar) => bar.id === this.barId) ?? null;
  }

  /** The shape being solved: the drag preview, or the bar as it is now. */
  private get shape(): BarFile | null {
    return this.preview ?? this.bar?.current ?? null;
  }

  protected override willUpdate(changed: Map<string, unknown>): void {
    if (changed.has('barId')) {
      const previous = changed.get('barId');
      if (typeof previous === 'string' && previous) this.analysis.forget(previous);
      this.preview = null;
      this.shapedModes = [];
      this.cutMap = null;
      this.lastGiven = '';
      this.shapeError = '';
    }
    // A drag preview ends when this bar's shape changes (a commit, an undo, another tab), not
    // when something else in the project does (a plan landing on another bar).
    if (changed.has('project') && this.preview) {
      const before = (changed.get('project') as ProjectFile | null | undefined)?.bars.find((bar) => bar.id === this.barId)?.current;
      if (JSON.stringify(before) !== JSON.stringify(this.bar?.current)) this.preview = null;
    }
    const shape = this.shape;
    if (shape) {
      const key = this.shapeKey(shape);
      if (key !== this.lastGiven) {
        this.lastGiven = key;
        this.analyse(shape, key, true);
      }
    }
  }

  /** The last calibration inputs built, with the project and bar they were built from. */
  private calibrationMemo: { project: ProjectFile | null; barId: string; inputs: ReturnType<typeof barCalibrationInputs> } | null = null;

  /**
   * What the bar's predictions are calibrated with (its rounds and lot), or null before the first
   * round. Built once per project revision and bar: a drag asks for it every frame, and the same
   * object keeps the 3D check from re-rendering.
   */
  private calibrationInputs() {
    const memo = this.calibrationMemo;
    if (memo && memo.project === this.project && memo.barId === this.barId) return memo.inputs;
    const bar = this.bar;
    const inputs = bar && this.project ? barCalibrationInputs(this.project, bar) : null;
    this.calibrationMemo = { project: this.project, barId: this.barId, inputs };
    return inputs;
  }

  /** Fingerprint of a shape's analysis: the shape and, once the bar has rounds, what calibrates it. */
  private shapeKey(shape: BarFile): string {
    const inputs = this.calibrationInputs();
    return `${JSON.stringify(shape)}${inputs ? `:${stableHash(inputs)}` : ''}`;
  }

  /**
   * Asks for the partials of `shape` on the bar shown (with shapes and the where-to-cut map unless
   * dragging): from the bar's calibrated model once it has rounds, as the tuning view predicts.
   */
  private analyse(shape: BarFile, key: string, full: boolean, givenAt?: number): void {
    const payload = { bar: shape, modes: this.modeCount(), withShapes: full, withSensitivities: full, ...this.calibrationInputs() };
    this.analysis.run({ subject: this.barId, key: `${full ? 'full' : 'partials'}:${key}` }, workerJob(solver, 'analyze', payload), givenAt);
  }

  /** The newest analysis of the bar shown. */
  private get analysed() {
    return this.analysis.state(this.barId);
  }

  /** What a plan for `bar` asks the designer: its present shape, note, targets, thinnest allowed and the project's workshop. */
  private designPayload(project: ProjectFile, bar: ProjectBar): DesignPayload {
    const register = registerOf(project, bar);
    const payload: DesignPayload = {
      bar: bar.current,
      target: { note: bar.note, a4: project.instrument.a4_hz, ratios: register.ratios, tolerance_cents: register.tolerance_cents },
      limits: { min_thickness_mm: bar.session.limits.min_thickness_mm },
      ...(project.workshop ? { workshop: project.workshop } : {}),
    };
    const inputs = barCalibrationInputs(project, bar);
    return inputs ? { ...payload, ...inputs } : payload;
  }

  /** Fingerprint of what a plan for bar `barId` would ask now (null when the bar is gone). */
  private designKey(barId: string): string | null {
    const project = this.project;
    const bar = project?.bars.find((candidate) => candidate.id === barId);
    return project && bar ? stableHash(this.designPayload(project, bar)) : null;
  }

  private modeCount(): number {
    const bar = this.bar;
    if (!bar || !this.project) return 3;
    return Math.max(3, registerOf(this.project, bar).ratios.length);
  }

  /**
   * Records how long a shape took to reach the screen as partials: `bw:shape-to-partials` when
   * the readouts have re-rendered, `bw:shape-to-frame` at the next animation frame.
   */
  private onAnalysis(value: AnalyzeResult, binding: TaskBinding, givenAt: number): void {
    if (binding.subject !== this.barId) return;
    if (value.analysis.bending.some((mode) => mode.shape)) this.shapedModes = value.analysis.bending;
    if (value.sensitivities) this.cutMap = value.sensitivities;
    void this.updateComplete
      .then(() => Promise.all([...this.renderRoot.querySelectorAll('bw-cents-readout')].map((readout) => readout.updateComplete)))
      .then(() => {
        const end = performance.now();
        this.lastUpdateMs = end - givenAt;
        performance.measure('bw:shape-to-partials', { start: givenAt, end });
        requestAnimationFrame(() => performance.measure('bw:shape-to-frame', { start: givenAt, end: performance.now() }));
      });
  }

  /** While dragging: partials only (mode shapes follow when the drag ends). */
  private onPreview(event: CustomEvent<ProfileChangeDetail>): void {
    this.preview = event.detail.bar;
    this.lastGiven = this.shapeKey(event.detail.bar);
    this.analyse(event.detail.bar, this.lastGiven, false, event.detail.at);
  }

  private onCommit(event: CustomEvent<ProfileChangeDetail>): void {
    const outcome = sendEdit(this, (project) => setBarShape(project, this.barId, event.detail.bar, new Date().toISOString()));
    this.shapeError = outcome.ok ? '' : outcome.error.message;
    this.preview = null;
  }

  private addStations(): void {
    const bar = this.bar;
    if (!bar) return;
    const outcome = sendEdit(this, (project) => setBarShape(project, this.barId, withStations(bar.current, 10), new Date().toISOString()));
    this.shapeError = outcome.ok ? '' : outcome.error.message;
  }

  private setState(event: Event): void {
    const value = (event.target as HTMLSelectElement).value as BarState;
    sendEdit(this, (project) => setBarState(project, this.barId, value, new Date().toISOString()));
  }

  /** Plans the undercut of the bar shown; the plan is stored on this bar, whatever is shown when it is done. */
  private plan(): void {
    const bar = this.bar;
    const project = this.project;
    if (!bar || !project) return;
    const payload = this.designPayload(project, bar);
    this.design.run({ subject: bar.id, key: stableHash(payload) }, workerJob(solver, 'design', payload));
  }

  private adoptPlan(): void {
    const outcome = sendEdit(this, (project) => adoptDesign(project, this.barId, new Date().toISOString()));
    this.shapeError = outcome.ok ? '' : outcome.error.message;
  }

  private renderPartials() {
    const project = this.project!;
    const bar = this.bar!;
    const register = registerOf(project, bar);
    const targets = barTargetHz(project, bar);
    const { value, problem, running: busy } = this.analysed;
    if (!value && problem) return this.renderProblem(problem, 'Predicted partials');
    const predicted = value?.analysis.bending.map((mode) => mode.hz) ?? [];
    const standings = comparePartials(predicted, targets, register.tolerance_cents);
    return html`<section class="panel" aria-labelledby="predicted-heading">
      <h3 id="predicted-heading">Predicted partials for this shape</h3>
      <p class="muted">Target ${formatRatios(register.ratios)} on ${bar.note} at A4 = ${project.instrument.a4_hz} Hz. A prediction: cut less than it suggests and measure.</p>
      ${this.renderModelSource(value?.calibration ?? null)}
      <div class="readouts" data-testid="predicted-partials">
        ${standings.map(
          (standing, index) => html`<bw-cents-readout
            label=${`${partialName(index)} · ratio ${value ? formatNumber(value.analysis.bending[index]?.ratio, 2) : '–'} (target ${register.ratios[index]})`}
            .cents=${standing.cents}
            .verdict=${standing.verdict}
            .hz=${standing.hz}
            .targetHz=${standing.targetHz}
            .tolerance=${standing.toleranceCents}
            empty-words=${busy ? 'working out…' : 'no prediction'}
          ></bw-cents-readout>`,
        )}
      </div>
      <p class="status" aria-live="polite">${busy ? 'Updating…' : this.lastUpdateMs !== null ? 'Up to date.' : ''}${problem ? html` <span class="problem">${this.problemText(problem)}</span>` : nothing}</p>
      ${value && value.analysis.warnings.length > 0
        ? html`<div class="problem" role="status"><strong>⚠ Other vibrations close to a partial</strong> (the bar may buzz or beat):
            <ul class="warnings">
              ${value.analysis.warnings.map((warning) => html`<li>${warning}</li>`)}
            </ul></div>`
        : value
          ? html`<p class="muted">No twisting or side-to-side vibration lies close to a tuned partial.</p>`
          : nothing}
    </section>`;
  }

  /** Which material the partials come from: the calibrated model once the bar has rounds, else the starting guess. */
  private renderModelSource(calibration: CalibrationSummary | null) {
    const bar = this.bar!;
    const rounds = bar.session.steps.length;
    if (rounds === 0) return html`<p class="muted" data-testid="model-source">From the starting-guess material: no rounds yet. Once the bar has been struck, its rounds calibrate these figures.</p>`;
    if (!calibration) return html`<p class="muted" data-testid="model-source">Calibrating from this bar's ${rounds} round${rounds === 1 ? '' : 's'}…</p>`;
    return html`<p data-testid="model-source">
      <strong>Calibrated from this bar's ${calibration.steps} round${calibration.steps === 1 ? '' : 's'}</strong>, as the tuning view predicts: ${barMaterialFamily(bar.current) === 'metal' ? 'stiffness' : 'stiffness along the grain'} ${formatNumber(calibration.E_GPa, 2)} GPa, shear stiffness ${formatNumber(calibration.G_GPa, 3)} GPa,
      density ${formatNumber(calibration.density_kg_m3, 0)} kg/m³${calibration.lot ? `, starting from lot ${calibration.lot}` : ''}; at the playing temperature, ${calibration.playing_temperature_c} °C.
    </p>`;
  }

  private problemText(problem: TaskProblem): string {
    switch (problem.status) {
      case 'stale':
        return 'The bar changed while this was worked out; the result was not kept.';
      case 'input-error':
        return `${problem.field}: ${problem.rule}`;
      case 'unavailable':
        return `${problem.what} is not available yet.`;
      case 'failed':
        return `The computation failed: ${problem.message}`;
      case 'cancelled':
        return 'Cancelled.';
    }
  }

  private renderProblem(problem: TaskProblem, title: string) {
    return html`<section class="panel"><h3>${title}</h3><p class=${problem.status === 'unavailable' ? 'unavailable' : 'problem'}>${this.problemText(problem)}</p></section>`;
  }

  private renderModes() {
    const value = this.analysed.value;
    if (!value) return nothing;
    const nodes = value.analysis.bending[0]?.nodes_mm ?? [];
    return html`<section class="panel">
      <h3>How the bar moves</h3>
      <p class="muted">${this.bar?.current.section.shape === 'rect' ? 'Cord holes go at' : 'Hang or support it at'} the fundamental's nodes: ${nodes.map((x) => `${formatMm(x)} mm`).join(' and ')} from the left end.</p>
      <bw-mode-chart .modes=${this.shapedModes} length=${this.shape?.length_mm ?? 0}></bw-mode-chart>
    </section>`;
  }

  /** Plans running for other bars (each is stored on its own bar when done). */
  private renderOtherPlans() {
    const others = this.design.active().filter((task) => task.binding && task.binding.subject !== this.barId);
    if (others.length === 0) return nothing;
    return html`<ul class="others" data-testid="other-plans">
      ${others.map((task) => {
        const subject = task.binding!.subject;
        const note = this.project?.bars.find((bar) => bar.id === subject)?.note ?? subject;
        return html`<li class="spread">
          <span role="status">Still planning ${note}${task.progress ? ` (${task.progress.done} of at most ${task.progress.total} solver runs)` : ''}; its plan will be kept with ${note}.</span>
          <button @click=${() => this.design.cancel(subject)}>Cancel the plan for ${note}</button>
        </li>`;
      })}
    </ul>`;
  }

  private renderPlan() {
    const bar = this.bar!;
    const project = this.project!;
    const design = bar.design;
    const planning = this.design.state(bar.id);
    const progress = planning.progress;
    return html`<section class="panel" aria-labelledby="plan-heading">
      <h3 id="plan-heading">Plan the undercut</h3>
      <p class="muted">Finds an arch that reaches the targets from this blank, removing wood only, keeping at least ${formatMm(bar.session.limits.min_thickness_mm)} mm and within what the tools of <a href="#/workshop">${project.workshop?.name ?? 'the default workshop'}</a> can cut.</p>
      <div class="spread">
        <button class="primary" ?disabled=${planning.running || bar.current.section.shape !== 'rect'} @click=${() => this.plan()}>Plan the undercut</button>
        ${planning.running
          ? html`<progress aria-label="Planning progress"></progress><span role="status">Planning…${progress ? ` ${progress.done} of at most ${progress.total} solver runs` : ''}</span><button @click=${() => this.design.cancel(bar.id)}>Cancel</button>`
          : nothing}
      </div>
      ${this.renderOtherPlans()}
      ${planning.problem ? html`<p class=${planning.problem.status === 'unavailable' ? 'unavailable' : 'problem'} role="status">${this.problemText(planning.problem)}</p>` : nothing}
      ${design
        ? html`<p><strong>${design.feasible ? 'A plan reaches the targets.' : 'No plan reaches all targets;'}</strong> ${design.reason ?? ''}</p>
            <p>Predicted: ${design.cents_error.map((value, index) => html`${partialName(index)} ${formatCents(value)} cents${index < design.cents_error.length - 1 ? ' · ' : ''}`)}</p>
            <bw-profile-drawing .bar=${design.bar}></bw-profile-drawing>
            <bw-cautions material=${barMaterialFamily(bar.current)}></bw-cautions>
            <button @click=${this.adoptPlan}>Use the plan as the present shape</button>`
        : nothing}
    </section>`;
  }

  private renderEngineering() {
    const { value, workerMs } = this.analysed;
    const shape = this.shape;
    const material = shape && !('preset' in shape.material) ? shape.material : null;
    return html`<details class="panel">
      <summary>Engineering detail</summary>
      ${value
        ? html`<p>Beam theory: ${value.analysis.theory}; ${value.analysis.mesh?.elements ?? '–'} finite elements; solver time ${formatNumber(workerMs, 1)} ms; last shape-to-partials update ${formatNumber(this.lastUpdateMs, 1)} ms.</p>
            ${material ? html`<p>Material model: E = ${formatNumber(material.E_GPa, 2)} GPa, G = ${material.G_GPa !== undefined ? `${formatNumber(material.G_GPa, 3)} GPa` : 'from Poisson’s ratio'}, density ${formatNumber(material.density_kg_m3, 0)} kg/m³${shape && barMaterialFamily(shape) === 'metal' ? ' (metal is stiff in shear, E/G ≈ 2.6: shear barely moves its partials)' : ' (shear-soft timber, E/G of 10–20, lowers the upper partials)'}.</p>` : nothing}
            <table>
              <caption class="visually-hidden">Frequencies of each vibration family</caption>
              <thead><tr><th>Family</th><th class="number">Mode</th><th class="number">Hz</th></tr></thead>
              <tbody>
                ${value.analysis.bending.map((mode) => html`<tr><td>vertical bending</td><td class="number">${mode.mode}</td><td class="number">${formatHz(mode.hz)}</td></tr>`)}
                ${value.analysis.torsion.slice(0, 4).map((mode) => html`<tr><td>torsion (twisting)</td><td class="number">${mode.mode}</td><td class="number">${formatHz(mode.hz)}</td></tr>`)}
                ${value.analysis.lateral.slice(0, 3).map((mode) => html`<tr><td>lateral (side to side)</td><td class="number">${mode.mode}</td><td class="number">${formatHz(mode.hz)}</td></tr>`)}
              </tbody>
            </table>`
        : html`<p class="muted">No result yet.</p>`}
    </details>`;
  }

  protected override render() {
    const project = this.project;
    const bar = this.bar;
    if (!project || !bar) return html`<p>Choose a bar in the keyboard list.</p>`;
    const value = this.analysed.value;
    const nodes = value?.analysis.bending[0]?.nodes_mm ?? [];
    const rect = bar.current.section.shape === 'rect';
    return html`<div class="top">
        <bw-bar-picker .bars=${project.bars} bar-id=${bar.id}></bw-bar-picker>
        <div class="state-field">
          <label for="state">State</label>
          <select id="state" @change=${this.setState} aria-describedby="state-meaning" title=${stateMeanings[bar.state]}>
            ${(['not-started', 'rough', 'tuning', 'done'] as const).map((state) => html`<option value=${state} ?selected=${state === bar.state} title=${stateMeanings[state]}>${stateName(state)}</option>`)}
          </select>
          <span class="muted" id="state-meaning" style="font-size:0.85rem;max-width:16rem">${stateMeanings[bar.state]}</span>
        </div>
      </div>
      <div class="layout">
        <div class="stack">
          <section class="panel"><bw-blank-form .blank=${bar.blank} bar-id=${bar.id} ?measured=${bar.session.steps.length > 0}></bw-blank-form></section>
          <section class="panel notes">
            <label for="notes">Notes on this bar</label>
            <textarea id="notes" rows="4" .value=${bar.notes} @change=${(event: Event) => sendEdit(this, (project) => setBarNotes(project, this.barId, (event.target as HTMLTextAreaElement).value, new Date().toISOString()))}></textarea>
          </section>
        </div>
        <div class="stack">
          <section class="panel" aria-labelledby="profile-heading">
            <h3 id="profile-heading">${rect ? 'Side profile, undercut below' : 'Side view'}</h3>
            ${rect && !bar.current.profile_mm
              ? html`<p>This blank is uncut. <button @click=${this.addStations}>Add stations every 10 mm to shape an undercut</button></p>`
              : rect
                ? html`<div class="spread muted">
                    <span>Drag a station up or down (◀ ▶ ▲ ▼ keys: 0.1 mm, Shift 1 mm).</span>
                    <label for="spread">Neighbours follow within</label>
                    <select id="spread" @change=${(event: Event) => (this.spread = Number((event.target as HTMLSelectElement).value))}>
                      ${[0, 15, 30, 60].map((mm) => html`<option value=${mm} ?selected=${mm === this.spread}>${mm} mm</option>`)}
                    </select>
                  </div>`
                : nothing}
            <bw-profile-drawing
              .bar=${bar.current}
              .nodesMm=${nodes}
              ?editable=${rect && !!bar.current.profile_mm}
              min-thickness=${bar.session.limits.min_thickness_mm}
              spread=${this.spread}
              @profile-preview=${this.onPreview}
              @profile-commit=${this.onCommit}
            ></bw-profile-drawing>
            ${this.shapeError ? html`<p class="problem" role="alert">${this.shapeError}</p>` : nothing}
          </section>
          ${this.renderPartials()}
          ${rect && bar.current.profile_mm ? html`<bw-cautions material=${barMaterialFamily(bar.current)}></bw-cautions>` : nothing}
          <section class="panel">
            <h3>What a cut does, along the bar</h3>
            <bw-cut-map .sensitivities=${this.cutMap} .applicable=${rect} length=${this.shape?.length_mm ?? 0}></bw-cut-map>
          </section>
          ${this.renderModes()}
          <section class="panel" aria-labelledby="solid-heading">
            <h3 id="solid-heading">On the 3D model</h3>
            <bw-solid-check .bar=${bar.current} bar-id=${bar.id} partials=${registerOf(project, bar).ratios.length} .calibrationInputs=${this.calibrationInputs()}></bw-solid-check>
          </section>
          ${rect ? this.renderPlan() : nothing} ${this.renderEngineering()}
        </div>
      </div>`;
  }
}

declare global {
  interface HTMLElementTagNameMap {
    'bw-shape-view': BwShapeView;
  }
}
