// The keyboard's bars at a glance: each bar's state (with a legend of what the states mean), blank,
// partials' errors in cents (as last heard, else as predicted), plan and rounds, with the way to
// its Shape and Tuning views; and the list kept by hand: bars added (bw-bar-adder), moved,
// renamed (name and note) and removed (with undo). Every change is a pure edit sent up.
import { LitElement, html, css, nothing } from 'lit';
import { customElement, property, state } from 'lit/decorators.js';
import {
  barName,
  barTargetHz,
  comparePartials,
  lastReadingAtPlayingHz,
  moveBar,
  parseNote,
  registerOf,
  removeBar,
  renameBar,
  restoreBar,
  sortBarsByPitch,
  type ProjectBar,
  type ProjectFile,
  type RemovedBar,
} from '../../src/index.ts';
import type { AnalyzeManyEntry } from '../worker/solverProtocol.ts';
import { sharedStyles } from '../styles/sharedStyles.ts';
import { NavigateEvent, sendEdit } from '../events.ts';
import { formatCents, formatMm, formatWhen, partialName, stateMarks, stateMeanings, stateName, verdictClass, verdictMark } from '../format.ts';
import type { BarsAddedDetail } from './bw-bar-adder.ts';
import './bw-bar-adder.ts';

/** How the predictions of the bars' partials stand (from the keyboard view's worker task). */
export interface PredictionStanding {
  running: boolean;
  progress: { done: number; total: number };
  /** Why there are none, in words (cancelled, failed), or ''. */
  note: string;
}

/** `<bw-bar-list .project .predictions .predicting>`; fires `predictions-cancel`. */
@customElement('bw-bar-list')
export class BwBarList extends LitElement {
  static override styles = [
    sharedStyles,
    css`
      :host {
        display: block;
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
        font-weight: 400;
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
      .fact {
        display: grid;
        gap: 0.2rem;
      }
      .legend {
        display: flex;
        flex-wrap: wrap;
        gap: 0.2rem 1.2rem;
        margin: 0 0 0.6rem;
        padding: 0;
        list-style: none;
        font-size: 0.9rem;
        color: var(--bw-ink-muted);
      }
      .legend strong {
        color: var(--bw-ink);
      }
      .toolbar {
        display: flex;
        flex-wrap: wrap;
        gap: 0.5rem;
        align-items: center;
        margin-bottom: 0.6rem;
      }
      .toolbar button[aria-pressed='true'] {
        background: var(--bw-action);
        color: var(--bw-action-ink);
      }
      .adder {
        border: 2px solid var(--bw-action-soft);
        border-radius: 8px;
        padding: 0.8rem;
        margin-bottom: 0.8rem;
      }
      .rename {
        display: flex;
        flex-wrap: wrap;
        gap: 0.4rem;
        align-items: end;
      }
      .rename input {
        width: 11rem;
      }
      .rename input.note-input {
        width: 5.5rem;
      }
      .bar-name {
        display: block;
        font-size: 0.95rem;
        font-weight: 600;
      }
      .empty {
        padding: 1rem 0;
      }
    `,
  ];

  @property({ attribute: false }) project: ProjectFile | null = null;
  /** Each bar's predicted partials, by bar id. */
  @property({ attribute: false }) predictions = new Map<string, AnalyzeManyEntry>();
  @property({ attribute: false }) predicting: PredictionStanding = { running: false, progress: { done: 0, total: 0 }, note: '' };

  @state() private adding = false;
  @state() private arranging = false;
  /** The bar being renamed (its id), with the fields as typed and the rule broken, if any. */
  @state() private renaming: { id: string; note: string; name: string; error: string } | null = null;
  /** The last bar removed, offered for undo. */
  @state() private removed: RemovedBar | null = null;
  /** What the last change to the list did, in words. */
  @state() private listMessage = '';

  private move(bar: ProjectBar, step: number): void {
    const project = this.project!;
    const index = project.bars.findIndex((candidate) => candidate.id === bar.id);
    sendEdit(this, (current) => moveBar(current, bar.id, index + step));
    this.listMessage = `Moved ${barName(bar)} ${step < 0 ? 'up' : 'down'}.`;
  }

  private removeFromList(bar: ProjectBar): void {
    let removed: RemovedBar | null = null;
    const outcome = sendEdit(this, (project) => {
      const result = removeBar(project, bar.id);
      removed = result.removed;
      return result.project;
    });
    if (!outcome.ok) return;
    this.removed = removed;
    this.renaming = null;
    this.listMessage = '';
  }

  private undoRemove(): void {
    const removed = this.removed;
    if (!removed) return;
    const outcome = sendEdit(this, (project) => restoreBar(project, removed));
    this.listMessage = outcome.ok ? `${barName(removed.bar)} is back.` : outcome.error.rule;
    this.removed = null;
  }

  private saveRename(): void {
    const renaming = this.renaming;
    const bar = this.project?.bars.find((candidate) => candidate.id === renaming?.id);
    if (!renaming || !bar) return;
    const change: { name?: string; note?: string } = {};
    if (renaming.note.trim() !== bar.note) change.note = renaming.note;
    if (renaming.name.trim() !== barName(bar)) change.name = renaming.name;
    const outcome = sendEdit(this, (project) => renameBar(project, bar.id, change, new Date().toISOString()));
    if (!outcome.ok) {
      this.renaming = { ...renaming, error: `${outcome.error.field === 'note' ? 'Note' : 'Name'} ${outcome.error.rule}` };
      return;
    }
    this.renaming = null;
    this.listMessage = `Renamed ${bar.note} to ${renaming.name.trim() || renaming.note.trim()}.`;
  }

  private onAdded(event: CustomEvent<BarsAddedDetail>): void {
    const { notes, skipped } = event.detail;
    this.removed = null;
    this.listMessage = `Added ${notes.length === 1 ? `bar ${notes[0]}` : `${notes.length} bars: ${notes.join(' ')}`}${skipped.length ? ` (${skipped.length} already there)` : ''}.`;
  }

  private go(view: 'shape' | 'tuning', barId: string): void {
    this.dispatchEvent(new NavigateEvent(view, barId));
  }

  private renderErrors(bar: ProjectBar) {
    const project = this.project!;
    const register = registerOf(project, bar);
    const targets = barTargetHz(project, bar);
    // As heard, moved to the playing temperature (as the tuning view shows it).
    const measured = lastReadingAtPlayingHz(project, bar);
    const prediction = this.predictions.get(bar.id);
    const hz = measured ?? prediction?.analysis?.bending.map((mode) => mode.hz) ?? null;
    if (!hz) return html`<span class="muted">${prediction?.error ?? (this.predicting.running ? 'predicting…' : '–')}</span>`;
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

  private renderNoteCell(project: ProjectFile, bar: ProjectBar) {
    const renaming = this.renaming?.id === bar.id ? this.renaming : null;
    if (!renaming) {
      const name = barName(bar);
      return html`<td class="note">${bar.note}${name !== bar.note ? html`<span class="bar-name">${name}</span>` : nothing}<span class="source">${registerOf(project, bar).label}</span></td>`;
    }
    const set = (key: 'note' | 'name') => (event: Event) => (this.renaming = { ...renaming, [key]: (event.target as HTMLInputElement).value });
    return html`<td colspan="6">
      <div class="rename" data-testid="rename-form">
        <div class="fact"><label for=${`rename-note-${bar.id}`}>Note</label><input class="note-input" id=${`rename-note-${bar.id}`} autocomplete="off" .value=${renaming.note} @input=${set('note')} @keydown=${(event: KeyboardEvent) => event.key === 'Enter' && this.saveRename()} /></div>
        <div class="fact"><label for=${`rename-name-${bar.id}`}>Name</label><input id=${`rename-name-${bar.id}`} maxlength="80" autocomplete="off" .value=${renaming.name} @input=${set('name')} @keydown=${(event: KeyboardEvent) => event.key === 'Enter' && this.saveRename()} /></div>
        <button class="primary" @click=${() => this.saveRename()}>Save</button>
        <button @click=${() => (this.renaming = null)}>Cancel</button>
      </div>
      ${renaming.error ? html`<span class="field-error" role="alert">✕ ${renaming.error}</span>` : html`<span class="muted">A new note moves the bar's targets; rounds already recorded stay as heard.</span>`}
    </td>`;
  }

  private renderRow(project: ProjectFile, bar: ProjectBar, index: number) {
    const name = barName(bar);
    const renaming = this.renaming?.id === bar.id;
    return html`<tr data-bar=${bar.id}>
      ${this.renderNoteCell(project, bar)}
      ${renaming
        ? nothing
        : html`<td class="state" title=${stateMeanings[bar.state]}>${stateMarks[bar.state]} ${stateName(bar.state)}</td>
            <td>${this.blankText(bar)}</td>
            <td>${this.renderErrors(bar)}</td>
            <td>${this.planText(bar)}</td>
            <td class="number">${bar.session.steps.length}</td>`}
      <td class="actions">
        ${this.arranging
          ? html`<div>
              <button aria-label=${`Move ${name} up`} ?disabled=${index === 0} @click=${() => this.move(bar, -1)}>▲</button>
              <button aria-label=${`Move ${name} down`} ?disabled=${index === project.bars.length - 1} @click=${() => this.move(bar, 1)}>▼</button>
              <button aria-label=${`Rename ${name}`} @click=${() => (this.renaming = { id: bar.id, note: bar.note, name, error: '' })} data-testid="rename-bar">Rename</button>
              <button aria-label=${`Remove ${name}`} @click=${() => this.removeFromList(bar)} data-testid="remove-bar">Remove</button>
            </div>`
          : html`<div>
              <button @click=${() => this.go('shape', bar.id)} aria-label=${`Shape of ${name}`}>Shape</button>
              <button class="primary" @click=${() => this.go('tuning', bar.id)} aria-label=${`Tuning of ${name}`}>Tuning</button>
            </div>`}
      </td>
    </tr>`;
  }

  protected override render() {
    const project = this.project;
    if (!project) return nothing;
    const predicting = this.predicting;
    const progress = predicting.progress;
    return html`<section class="panel" aria-labelledby="bars-heading">
        <div class="row" style="justify-content: space-between">
          <h2 id="bars-heading">Bars</h2>
          <div class="row" aria-live="polite">
            ${predicting.running
              ? html`<progress max=${progress.total} value=${progress.done} aria-label="Predicting partials"></progress><span>Predicting ${progress.done} of ${progress.total}</span><button @click=${() => this.dispatchEvent(new CustomEvent('predictions-cancel'))}>Cancel</button>`
              : html`<span class="muted">${predicting.note}</span>`}
          </div>
        </div>
        <div class="toolbar">
          <button aria-pressed=${this.adding ? 'true' : 'false'} @click=${() => (this.adding = !this.adding)} data-testid="toggle-add">Add bars…</button>
          <button aria-pressed=${this.arranging ? 'true' : 'false'} @click=${() => ((this.arranging = !this.arranging), (this.renaming = null))} data-testid="toggle-arrange">Arrange, rename or remove…</button>
          ${this.arranging ? html`<button @click=${() => sendEdit(this, sortBarsByPitch)}>Sort by register and pitch</button>` : nothing}
        </div>
        ${this.adding ? html`<div class="adder"><bw-bar-adder .project=${project} @bars-added=${this.onAdded}></bw-bar-adder></div>` : nothing}
        <p class="row" role="status" data-testid="list-message">
          ${this.removed
            ? html`<span>Removed ${barName(this.removed.bar)}${this.removed.bar.session.steps.length ? ` with its ${this.removed.bar.session.steps.length} round${this.removed.bar.session.steps.length === 1 ? '' : 's'}` : ''}.</span><button class="primary" @click=${() => this.undoRemove()} data-testid="undo-remove">Undo</button>`
            : this.listMessage}
        </p>
        <p class="muted">${project.bars.length} bar${project.bars.length === 1 ? '' : 's'} set up. Cents from target per partial (fundamental first): ▲ sharp · ▼ flat · ● in tune.</p>
        <ul class="legend" aria-label="Bar states">
          ${(['not-started', 'rough', 'tuning', 'done'] as const).map((state) => html`<li><strong>${stateMarks[state]} ${stateName(state)}</strong>: ${stateMeanings[state]}</li>`)}
        </ul>
        ${project.bars.length === 0
          ? html`<p class="empty" data-testid="no-bars">No bars yet. Use <strong>Add bars…</strong> to add one note, every note of a range, or the plan's notes.</p>`
          : html`<div class="table-wrap">
              <table class="bars" data-testid="bar-list">
                <thead>
                  <tr><th scope="col">Note</th><th scope="col">State</th><th scope="col">Blank (mm)</th><th scope="col">Partials (cents)</th><th scope="col">Plan</th><th scope="col" class="number">Rounds</th><th scope="col">${this.arranging ? 'Arrange' : 'Open'}</th></tr>
                </thead>
                <tbody>
                  ${project.bars.map((bar, index) => this.renderRow(project, bar, index))}
                </tbody>
              </table>
            </div>`}
      </section>`;
  }
}

declare global {
  interface HTMLElementTagNameMap {
    'bw-bar-list': BwBarList;
  }
}
