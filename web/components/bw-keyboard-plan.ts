// "Plan every bar" on the keyboard overview: the notes to plan, the run with its progress
// (which step, how many done, the last note), cancel and resume, then every planned bar's status
// at a glance, the cut list to download and the way to the templates' print view.
import { LitElement, html, css, nothing } from 'lit';
import { customElement, property, state } from 'lit/decorators.js';
import { keyboardCutListCsv, type ProjectFile, type StoredKeyboardBar } from '../../src/index.ts';
import { KeyboardPlanRunController, applyThroughShell } from '../controllers/KeyboardPlanRun.ts';
import { sharedStyles } from '../styles/sharedStyles.ts';
import { NavigateEvent } from '../events.ts';
import { downloadText, fileStem } from '../download.ts';
import { formatWhen } from '../format.ts';
import './bw-plan-table.ts';
import './bw-cautions.ts';

const stepWords = { advice: 'Step 1 of 2: choosing blank lengths', design: 'Step 2 of 2: planning each undercut' } as const;

/** `<bw-keyboard-plan .project>` */
@customElement('bw-keyboard-plan')
export class BwKeyboardPlan extends LitElement {
  static override styles = [
    sharedStyles,
    css`
      :host {
        display: block;
        min-width: 0;
      }
      .choices {
        display: flex;
        flex-wrap: wrap;
        gap: 0.8rem 1.4rem;
        align-items: end;
      }
      .field {
        display: grid;
        gap: 0.2rem;
      }
      .field input[type='text'] {
        width: 6rem;
      }
      .check {
        display: flex;
        gap: 0.5rem;
        align-items: center;
        min-height: var(--bw-touch);
      }
      .check input {
        width: var(--bw-touch);
        height: var(--bw-touch);
        margin: 0;
        accent-color: var(--bw-action);
      }
      .field-error {
        color: var(--bw-problem-ink);
        font-size: 0.9rem;
        margin: 0;
      }
      .run {
        margin: 0.8rem 0;
        display: grid;
        gap: 0.4rem;
      }
      progress {
        width: min(30rem, 100%);
        height: 1.4rem;
      }
      .progress-line {
        font-size: 1.1rem;
        font-weight: 700;
      }
      .summary {
        font-size: 1.05rem;
      }
      .actions {
        display: flex;
        flex-wrap: wrap;
        gap: 0.5rem;
        margin: 0.6rem 0;
      }
    `,
  ];

  @property({ attribute: false }) project: ProjectFile | null = null;

  @state() private lowest = '';
  @state() private highest = '';
  @state() private keepLengths = true;
  @state() private onSolid = false;
  private readonly run = new KeyboardPlanRunController(this);

  protected override willUpdate(changed: Map<string, unknown>): void {
    // The range to plan follows the project opened (another project, a new one), not the one before.
    const previous = changed.get('project') as ProjectFile | null | undefined;
    if (changed.has('project') && this.project && (!this.lowest || (previous && previous.id !== this.project.id))) {
      const range = this.project.keyboard_plan?.keyboard.range;
      this.lowest = range?.lowest ?? this.project.instrument.lowest_note;
      this.highest = range?.highest ?? this.project.instrument.highest_note;
    }
  }

  private start(fresh: boolean): void {
    if (!this.project) return;
    void this.run.run.start(this.project, { lowest: this.lowest.trim(), highest: this.highest.trim(), keepBlankLengths: this.keepLengths }, { fresh, apply: applyThroughShell(this), theory: this.onSolid ? 'solid' : 'timoshenko' });
  }

  private plannedBars(): StoredKeyboardBar[] {
    const plan = this.project?.keyboard_plan?.plan;
    if (!plan) return [];
    return plan.notes.map((note) => plan.bars[note]).filter((bar): bar is StoredKeyboardBar => bar !== undefined);
  }

  private downloadCutList(): void {
    const record = this.project?.keyboard_plan;
    if (!record) return;
    downloadText(`${fileStem(record.plan.name, 'keyboard')}-cut-list.csv`, keyboardCutListCsv(this.plannedBars()));
  }

  private fieldError(field: string) {
    const problem = this.run.state.problem;
    if (!problem || problem.field !== field) return nothing;
    return html`<p class="field-error" role="alert">✕ ${field === 'lowest note' ? 'From' : 'To'}: ${problem.rule}</p>`;
  }

  private renderRun() {
    const run = this.run.state;
    if (!run.running) {
      const problem = run.problem && run.problem.field !== 'lowest note' && run.problem.field !== 'highest note' ? run.problem : null;
      return html`${run.message ? html`<p role="status" data-testid="plan-message">${run.message}</p>` : nothing}${problem ? html`<p class="problem" role="alert">${problem.field ? `${problem.field}: ` : ''}${problem.rule}</p>` : nothing}`;
    }
    const progress = run.progress;
    return html`<div class="run" aria-live="polite" data-testid="plan-progress">
      <progress max=${progress?.total || 1} value=${progress?.done ?? 0} aria-label="Planning progress"></progress>
      <span class="progress-line">${progress ? `${stepWords[progress.stage]} — ${progress.done} of ${progress.total} done${progress.note ? `, last ${progress.note}` : ''}` : 'Starting the planning workers…'}</span>
      ${run.kept ? html`<span data-testid="plan-kept">${run.kept} bar${run.kept === 1 ? '' : 's'} kept from the plan stored before (not redone).</span>` : nothing}
      <span class="muted">${run.stopping ? 'Stopping after the bars in progress; what is done will be kept…' : `Running on ${run.workers} worker${run.workers === 1 ? '' : 's'}; the page stays usable.`}</span>
      <div><button @click=${() => this.run.run.cancel()} ?disabled=${run.stopping}>Cancel</button></div>
    </div>`;
  }

  protected override render() {
    const project = this.project;
    if (!project) return nothing;
    const record = project.keyboard_plan;
    const run = this.run.state;
    const summary = record?.plan.summary;
    const resumable = summary && !summary.complete;
    return html`<section class="panel" aria-labelledby="plan-heading">
      <h2 id="plan-heading">Plan every bar</h2>
      <p class="muted">Works out a blank length for every note and plans each bar's undercut to its target ratios, on the workers of this computer. Sections and targets come from the bars set up below: each note takes them from the nearest bar at or below it. The tools of <a href="#/workshop" data-testid="plan-workshop">${project.workshop?.name ?? 'the default workshop'}</a> set what may be cut.</p>
      <div class="choices">
        <div class="field">
          <label for="plan-from">From note</label>
          <input id="plan-from" type="text" autocomplete="off" .value=${this.lowest} @input=${(e: Event) => (this.lowest = (e.target as HTMLInputElement).value)} aria-invalid=${run.problem?.field === 'lowest note' ? 'true' : 'false'} />
          ${this.fieldError('lowest note')}
        </div>
        <div class="field">
          <label for="plan-to">To note</label>
          <input id="plan-to" type="text" autocomplete="off" .value=${this.highest} @input=${(e: Event) => (this.highest = (e.target as HTMLInputElement).value)} aria-invalid=${run.problem?.field === 'highest note' ? 'true' : 'false'} />
          ${this.fieldError('highest note')}
        </div>
        <label class="check"><input type="checkbox" .checked=${this.keepLengths} @change=${(e: Event) => (this.keepLengths = (e.target as HTMLInputElement).checked)} /> Keep the lengths of blanks already cut</label>
        <label class="check" title="Each bar's arch is corrected by the 3D model of the bar until the 3D model meets the targets: closer to the real bar on deep arches, a few seconds a bar instead of a fraction of one."><input type="checkbox" data-testid="plan-solid" .checked=${this.onSolid} @change=${(e: Event) => (this.onSolid = (e.target as HTMLInputElement).checked)} /> Design on the 3D model (slower)</label>
        <button class="primary" ?disabled=${run.running} @click=${() => this.start(false)} data-testid="plan-start">${resumable ? 'Resume plan' : record ? 'Plan again (keeps bars that did not change)' : 'Plan every bar'}</button>
        ${record ? html`<button ?disabled=${run.running} @click=${() => this.start(true)}>Start over</button>` : nothing}
      </div>
      ${this.renderRun()}
      ${record && summary
        ? html`<p class="summary" data-testid="plan-summary">
              <strong>${record.plan.range.lowest}–${record.plan.range.highest}</strong>, stored ${formatWhen(record.planned_at)}: ${summary.designed} of ${summary.bars} bars planned —
              ${summary.in_tolerance} in tolerance, ${summary.out_of_tolerance} out of tolerance, ${summary.infeasible} cannot be made on their blank${summary.complete ? '.' : '; not finished (resume to carry on).'}${record.plan.theory === 'solid' ? ' Designed and checked on the 3D model.' : ''}
            </p>
            <div class="actions">
              <button @click=${() => this.downloadCutList()} ?disabled=${summary.designed === 0} data-testid="cut-list-download">Download the cut list (CSV)</button>
              <button @click=${() => this.dispatchEvent(new NavigateEvent('plan-print'))} ?disabled=${summary.designed === 0}>Templates of the plan (1:1)…</button>
            </div>
            <bw-cautions></bw-cautions>
            <bw-plan-table .plan=${record.plan}></bw-plan-table>`
        : nothing}
    </section>`;
  }
}

declare global {
  interface HTMLElementTagNameMap {
    'bw-keyboard-plan': BwKeyboardPlan;
  }
}
