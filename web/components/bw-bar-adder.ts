// Adds bars to the project: one note (with a suggested blank the maker can lengthen or shorten
// before adding), every note of a range, or the keyboard plan's notes that have no bar yet. Each
// choice previews what it will add (the library's own edit run on a copy) and sends one edit up;
// a rule broken is shown beside its field. Fires `bars-added` with the notes added.
import { LitElement, html, css, nothing } from 'lit';
import { customElement, property, state } from 'lit/decorators.js';
import { addBar, addBarsFromPlan, addBarsInRange, checkPlayableNote, isInputError, registerForNote, suggestBlank, type BarFile, type BlankSuggestion, type ProjectFile } from '../../src/index.ts';
import { sharedStyles } from '../styles/sharedStyles.ts';
import { sendEdit } from '../events.ts';
import { formatMm } from '../format.ts';
import type { ValueCommitDetail } from './bw-number-field.ts';
import './bw-number-field.ts';

type Mode = 'note' | 'range' | 'plan';

/** Detail of `bars-added`. */
export interface BarsAddedDetail {
  notes: string[];
  skipped: string[];
}

/** The blank in words: "508 × 62 × 24 mm" or "476.0 mm, tube ⌀25.4 × 1.6 mm". */
function blankWords(blank: BarFile): string {
  const section = blank.section;
  if (section.shape === 'rect') return `${formatMm(blank.length_mm, 0)} × ${formatMm(section.width_mm, 0)} × ${formatMm(section.thickness_mm, 0)} mm`;
  if (section.shape === 'tube') return `${formatMm(blank.length_mm)} mm, tube ⌀${formatMm(section.outer_diameter_mm)} × ${formatMm(section.wall_mm)} mm`;
  return `${formatMm(blank.length_mm)} mm, rod ⌀${formatMm(section.diameter_mm)} mm`;
}

/** `<bw-bar-adder .project>` */
@customElement('bw-bar-adder')
export class BwBarAdder extends LitElement {
  static override styles = [
    sharedStyles,
    css`
      :host {
        display: block;
      }
      .modes {
        display: flex;
        flex-wrap: wrap;
        gap: 0.4rem;
        margin: 0 0 0.6rem;
      }
      .modes button[aria-checked='true'] {
        background: var(--bw-action);
        color: var(--bw-action-ink);
      }
      .fields {
        display: flex;
        flex-wrap: wrap;
        gap: 0.6rem 1rem;
        align-items: start;
      }
      .field {
        display: grid;
        gap: 0.2rem;
      }
      .field input {
        width: 7rem;
      }
      .field input.wide {
        width: 14rem;
        max-width: 100%;
      }
      .field-error {
        color: var(--bw-problem-ink);
        font-size: 0.9rem;
        margin: 0;
      }
      .preview {
        margin: 0.6rem 0;
      }
      .actions {
        display: flex;
        flex-wrap: wrap;
        gap: 0.5rem;
        align-items: center;
      }
    `,
  ];

  @property({ attribute: false }) project: ProjectFile | null = null;

  @state() private mode: Mode = 'note';
  @state() private note = '';
  @state() private registerId = '';
  @state() private name = '';
  @state() private lengthMm: number | null = null;
  @state() private lowest = '';
  @state() private highest = '';
  @state() private spelling: 'sharp' | 'flat' = 'sharp';
  @state() private problem = '';
  @state() private problemField = '';

  private now(): string {
    return new Date().toISOString();
  }

  /** The register a new bar goes to: the one chosen, else by pitch (the nearest keyboard bar). */
  private registerFor(project: ProjectFile, note: string): string {
    if (this.registerId) return this.registerId;
    return registerForNote(project, checkPlayableNote(note, 'bar', 'note').midi).id;
  }

  /** The blank suggested for the note typed, or why there is none (empty note, not a playable note). */
  private suggestion(): { suggestion: BlankSuggestion } | { rule: string } {
    const project = this.project;
    if (!project || this.note.trim() === '') return { rule: '' };
    try {
      return { suggestion: suggestBlank(project, this.note.trim(), this.registerFor(project, this.note.trim())) };
    } catch (error) {
      if (isInputError(error)) return { rule: error.rule };
      throw error;
    }
  }

  private fail(error: unknown): void {
    if (!isInputError(error)) throw error;
    this.problem = error.rule;
    this.problemField = error.field;
  }

  private done(notes: string[], skipped: string[] = []): void {
    this.problem = '';
    this.problemField = '';
    this.dispatchEvent(new CustomEvent<BarsAddedDetail>('bars-added', { detail: { notes, skipped }, bubbles: true, composed: true }));
  }

  private addOne(): void {
    const project = this.project;
    if (!project) return;
    const note = this.note.trim();
    try {
      const suggestion = suggestBlank(project, note, this.registerFor(project, note));
      const blank = { ...suggestion.blank, length_mm: this.lengthMm ?? suggestion.blank.length_mm };
      const registerId = this.registerFor(project, note);
      const name = this.name.trim();
      const outcome = sendEdit(this, (current) => addBar(current, { note, registerId, blank, ...(name ? { name } : {}), at: this.now() }).project);
      if (!outcome.ok) return this.fail(outcome.error);
      this.note = '';
      this.name = '';
      this.lengthMm = null;
      this.done([note]);
    } catch (error) {
      this.fail(error);
    }
  }

  private rangeChoice(project: ProjectFile) {
    return { lowest: this.lowest || project.instrument.lowest_note, highest: this.highest || project.instrument.highest_note, spelling: this.spelling, ...(this.registerId ? { registerId: this.registerId } : {}) };
  }

  private addRange(): void {
    const project = this.project;
    if (!project) return;
    let added: string[] = [];
    let skipped: string[] = [];
    const outcome = sendEdit(this, (current) => {
      const result = addBarsInRange(current, { ...this.rangeChoice(project), at: this.now() });
      ({ added, skipped } = result);
      return result.project;
    });
    if (!outcome.ok) return this.fail(outcome.error);
    this.done(added, skipped);
  }

  private addFromPlan(): void {
    let added: string[] = [];
    const outcome = sendEdit(this, (current) => {
      const result = addBarsFromPlan(current, this.now());
      added = result.added;
      return result.project;
    });
    if (!outcome.ok) return this.fail(outcome.error);
    this.done(added);
  }

  private error(field: string) {
    return this.problem && this.problemField === field ? html`<p class="field-error" role="alert">✕ ${this.problem}</p>` : nothing;
  }

  private renderRegisterChoice(project: ProjectFile) {
    return html`<div class="field">
      <label for="add-register">Register</label>
      <select id="add-register" @change=${(event: Event) => (this.registerId = (event.target as HTMLSelectElement).value)}>
        <option value="" ?selected=${this.registerId === ''}>By pitch (as the nearest bar)</option>
        ${project.instrument.registers.map((register) => html`<option value=${register.id} ?selected=${register.id === this.registerId}>${register.label}</option>`)}
      </select>
    </div>`;
  }

  private renderNote(project: ProjectFile) {
    const found = this.suggestion();
    const suggestion = 'suggestion' in found ? found.suggestion : null;
    const typedRule = 'rule' in found ? found.rule : '';
    return html`<div class="fields">
        <div class="field">
          <label for="add-note">Note</label>
          <input id="add-note" type="text" autocomplete="off" placeholder="e.g. F#3" .value=${this.note} aria-invalid=${this.problemField === 'note' ? 'true' : 'false'}
            @input=${(event: Event) => ((this.note = (event.target as HTMLInputElement).value), (this.lengthMm = null))}
            @keydown=${(event: KeyboardEvent) => event.key === 'Enter' && this.addOne()} />
          ${this.error('note')}
        </div>
        ${this.renderRegisterChoice(project)}
        <div class="field">
          <label for="add-name">Name (optional)</label>
          <input id="add-name" class="wide" type="text" maxlength="80" autocomplete="off" placeholder="the note" .value=${this.name} @input=${(event: Event) => (this.name = (event.target as HTMLInputElement).value)} />
          ${this.error('name')}
        </div>
        <bw-number-field label="Blank length" unit="mm" name="add-length" .value=${this.lengthMm ?? suggestion?.blank.length_mm ?? null} .min=${10} .max=${3000} ?disabled=${!suggestion}
          @value-commit=${(event: CustomEvent<ValueCommitDetail>) => (this.lengthMm = event.detail.value)}></bw-number-field>
      </div>
      <p class="preview muted" role="status">${suggestion
        ? html`Blank ${blankWords({ ...suggestion.blank, length_mm: this.lengthMm ?? suggestion.blank.length_mm })}: ${suggestion.rule}. Width, thickness and timber can be changed in the Shape view.`
        : typedRule
          ? html`<span class="field-error" data-testid="add-note-problem">✕ ${typedRule}</span>`
          : 'Type a note from A0 to C8 (scientific pitch notation: F#3, Bb5).'}</p>
      <div class="actions"><button class="primary" ?disabled=${!suggestion} @click=${() => this.addOne()} data-testid="add-bar">Add this bar</button></div>`;
  }

  private renderRange(project: ProjectFile) {
    let preview: { added: string[]; skipped: string[] } | null = null;
    let previewProblem = '';
    try {
      const result = addBarsInRange(project, { ...this.rangeChoice(project), at: this.now() });
      preview = { added: result.added, skipped: result.skipped };
    } catch (error) {
      if (!isInputError(error)) throw error;
      previewProblem = error.rule;
    }
    return html`<div class="fields">
        <div class="field"><label for="add-from">From note</label><input id="add-from" type="text" autocomplete="off" .value=${this.lowest || project.instrument.lowest_note} @input=${(event: Event) => (this.lowest = (event.target as HTMLInputElement).value)} /></div>
        <div class="field"><label for="add-to">To note</label><input id="add-to" type="text" autocomplete="off" .value=${this.highest || project.instrument.highest_note} @input=${(event: Event) => (this.highest = (event.target as HTMLInputElement).value)} /></div>
        ${this.renderRegisterChoice(project)}
        <div class="field">
          <label for="add-spelling">Spell black notes with</label>
          <select id="add-spelling" @change=${(event: Event) => (this.spelling = (event.target as HTMLSelectElement).value as 'sharp' | 'flat')}>
            <option value="sharp" ?selected=${this.spelling === 'sharp'}>sharps (F#3)</option>
            <option value="flat" ?selected=${this.spelling === 'flat'}>flats (Gb3)</option>
          </select>
        </div>
      </div>
      <p class="preview" role="status">${preview
        ? html`${preview.added.length} new bar${preview.added.length === 1 ? '' : 's'}${preview.added.length ? html`: ${preview.added.join(' ')}` : ''}${preview.skipped.length ? html` <span class="muted">(${preview.skipped.length} already there: ${preview.skipped.join(' ')})</span>` : ''}. Each blank is scaled from its nearest bar.`
        : html`<span class="field-error">✕ ${previewProblem}</span>`}</p>
      ${this.error('lowest note')}${this.error('highest note')}
      <div class="actions"><button class="primary" ?disabled=${!preview || preview.added.length === 0} @click=${() => this.addRange()} data-testid="add-range">Add ${preview?.added.length ?? 0} bar${preview?.added.length === 1 ? '' : 's'}</button></div>`;
  }

  private renderPlan(project: ProjectFile) {
    let added: string[] = [];
    try {
      added = project.keyboard_plan ? addBarsFromPlan(project, this.now()).added : [];
    } catch (error) {
      if (!isInputError(error)) throw error;
    }
    return html`<p class="preview" role="status">${!project.keyboard_plan
        ? 'There is no keyboard plan yet: use “Plan every bar” above first.'
        : added.length === 0
          ? 'Every planned note already has a bar.'
          : html`${added.length} planned note${added.length === 1 ? ' has' : 's have'} no bar yet: ${added.join(' ')}. Each gets the plan's blank and its planned undercut.`}</p>
      <div class="actions"><button class="primary" ?disabled=${added.length === 0} @click=${() => this.addFromPlan()} data-testid="add-from-plan">Add ${added.length} bar${added.length === 1 ? '' : 's'} from the plan</button></div>`;
  }

  /** Arrow keys move between the three choices (a radio group). */
  private arrowKeys(event: KeyboardEvent): void {
    const order: Mode[] = ['note', 'range', 'plan'];
    const step = event.key === 'ArrowRight' || event.key === 'ArrowDown' ? 1 : event.key === 'ArrowLeft' || event.key === 'ArrowUp' ? -1 : 0;
    if (step === 0) return;
    event.preventDefault();
    this.mode = order[(order.indexOf(this.mode) + step + order.length) % order.length]!;
    void this.updateComplete.then(() => this.renderRoot.querySelector<HTMLButtonElement>('[role="radio"][aria-checked="true"]')?.focus());
  }

  protected override render() {
    const project = this.project;
    if (!project) return nothing;
    const choose = (mode: Mode) => () => ((this.mode = mode), (this.problem = ''));
    const mode = (value: Mode, label: string) =>
      html`<button role="radio" aria-checked=${this.mode === value ? 'true' : 'false'} tabindex=${this.mode === value ? '0' : '-1'} @click=${choose(value)} @keydown=${(event: KeyboardEvent) => this.arrowKeys(event)}>${label}</button>`;
    return html`<div class="modes" role="radiogroup" aria-label="What to add">
        ${mode('note', 'One note')}${mode('range', 'Every note of a range')}${mode('plan', 'The plan’s notes without a bar')}
      </div>
      ${this.mode === 'note' ? this.renderNote(project) : this.mode === 'range' ? this.renderRange(project) : this.renderPlan(project)}
      ${this.problem && !['note', 'name', 'lowest note', 'highest note'].includes(this.problemField) ? html`<p class="field-error" role="alert">✕ ${this.problemField}: ${this.problem}</p>` : nothing}`;
  }
}

declare global {
  interface HTMLElementTagNameMap {
    'bw-bar-adder': BwBarAdder;
  }
}
