// A labelled number input with its unit, checked as typed; the rule broken is written next to
// the field with the allowed range (never a NaN). Fires `value-commit` with a valid number on
// Enter or leaving the field, or `value-clear` when an optional field is emptied.
import { LitElement, html, css } from 'lit';
import { customElement, property, state } from 'lit/decorators.js';
import { sharedStyles } from '../styles/sharedStyles.ts';

/** Detail of `value-commit`. */
export interface ValueCommitDetail {
  value: number;
}

let fieldCounter = 0;

/** `<bw-number-field label unit value min max>` */
@customElement('bw-number-field')
export class BwNumberField extends LitElement {
  static override styles = [
    sharedStyles,
    css`
      :host {
        display: block;
      }
      .field {
        display: grid;
        gap: 0.2rem;
      }
      .entry {
        display: flex;
        align-items: center;
        gap: 0.4rem;
      }
      input {
        width: var(--bw-field-width, 7.5rem);
        font-variant-numeric: tabular-nums;
        text-align: right;
      }
      .unit {
        color: var(--bw-ink-muted);
        min-width: 2.5rem;
      }
      .message {
        color: var(--bw-problem-ink);
        font-size: 0.9rem;
        margin: 0;
      }
      .message::before {
        content: '✕ ';
        font-weight: 700;
      }
      .hint {
        color: var(--bw-ink-muted);
        font-size: 0.85rem;
        margin: 0;
      }
    `,
  ];

  /** Visible label. */
  @property() label = '';
  /** Unit written after the field (mm, GPa, Hz, °C…). */
  @property() unit = '';
  /** The value shown (null = empty). */
  @property({ type: Number }) value: number | null = null;
  /** Smallest allowed value (inclusive unless `exclusiveMin`). */
  @property({ type: Number }) min: number | null = null;
  /** Largest allowed value. */
  @property({ type: Number }) max: number | null = null;
  /** The minimum itself is not allowed (e.g. "greater than 0"). */
  @property({ type: Boolean, attribute: 'exclusive-min' }) exclusiveMin = false;
  /** Arrow-key step. */
  @property({ type: Number }) step = 0.1;
  /** A problem reported from outside (the library's rule), shown next to the field. */
  @property() error = '';
  /** Short hint under the field. */
  @property() hint = '';
  /** Field name used in test ids and messages. */
  @property() name = '';
  @property({ type: Boolean }) disabled = false;
  /** An empty field is allowed: it fires `value-clear` instead of asking for a number. */
  @property({ type: Boolean }) optional = false;

  @state() private localError = '';
  @state() private draft: string | null = null;
  private readonly inputId = `bw-number-${++fieldCounter}`;

  protected override willUpdate(changed: Map<string, unknown>): void {
    if (changed.has('value')) {
      this.draft = null;
      this.localError = '';
    }
  }

  /** The allowed range in words ("10–250 mm", "greater than 0 and at most 600 Hz"), or '' with no bounds. */
  private rangeWords(): string {
    const unit = this.unit ? ` ${this.unit}` : '';
    if (this.min !== null && this.max !== null) return this.exclusiveMin ? `greater than ${this.min} and at most ${this.max}${unit}` : `${this.min}–${this.max}${unit}`;
    if (this.min !== null) return `${this.exclusiveMin ? 'greater than' : 'at least'} ${this.min}${unit}`;
    if (this.max !== null) return `at most ${this.max}${unit}`;
    return '';
  }

  /** Checks the typed text; returns the number, null for an allowed empty field, or a rule in words (with the range). */
  private check(text: string): { value: number | null } | { rule: string } {
    const trimmed = text.trim().replace(',', '.').replace('−', '-');
    if (trimmed === '') return this.optional ? { value: null } : { rule: `${this.label} is needed` };
    const value = Number(trimmed);
    if (!Number.isFinite(value)) return { rule: `${this.label} must be a number${this.unit ? ` in ${this.unit}` : ''}` };
    const below = this.min !== null && (this.exclusiveMin ? value <= this.min : value < this.min);
    const above = this.max !== null && value > this.max;
    if (below || above) {
      const both = this.min !== null && this.max !== null;
      return { rule: `${this.label} must ${both && !this.exclusiveMin ? 'lie within' : 'be'} ${this.rangeWords()}` };
    }
    return { value };
  }

  private onInput(event: InputEvent): void {
    const text = (event.target as HTMLInputElement).value;
    this.draft = text;
    const result = this.check(text);
    this.localError = 'rule' in result ? result.rule : '';
  }

  private commit(): void {
    if (this.draft === null) return;
    const result = this.check(this.draft);
    if ('rule' in result) {
      this.localError = result.rule;
      return;
    }
    this.localError = '';
    if (result.value === this.value) {
      this.draft = null;
      return;
    }
    if (result.value === null) {
      this.dispatchEvent(new CustomEvent('value-clear', { bubbles: true, composed: true }));
      return;
    }
    this.dispatchEvent(new CustomEvent<ValueCommitDetail>('value-commit', { detail: { value: result.value }, bubbles: true, composed: true }));
  }

  private onKeyDown(event: KeyboardEvent): void {
    if (event.key === 'Enter') {
      event.preventDefault();
      this.commit();
    } else if (event.key === 'Escape') {
      this.draft = null;
      this.localError = '';
    }
  }

  /** Moves keyboard focus into the input. */
  override focus(): void {
    this.renderRoot.querySelector('input')?.focus();
  }

  protected override render() {
    const message = this.localError || this.error;
    const shown = this.draft ?? (this.value === null || !Number.isFinite(this.value) ? '' : String(this.value));
    return html`<div class="field">
      <label for=${this.inputId}>${this.label}${this.unit ? html`<span class="visually-hidden"> (${this.unit})</span>` : ''}</label>
      <div class="entry">
        <input
          id=${this.inputId}
          name=${this.name || this.label}
          inputmode="decimal"
          autocomplete="off"
          .value=${shown}
          ?disabled=${this.disabled}
          aria-invalid=${message ? 'true' : 'false'}
          aria-describedby=${`${this.inputId}-message ${this.inputId}-hint`}
          @input=${this.onInput}
          @change=${this.commit}
          @keydown=${this.onKeyDown}
        />
        <span class="unit" aria-hidden=${this.unit ? 'false' : 'true'}>${this.unit}</span>
      </div>
      ${message ? html`<p class="message" id=${`${this.inputId}-message`} role="alert">${message}</p>` : html`<span id=${`${this.inputId}-message`}></span>`}
      ${this.hint ? html`<p class="hint" id=${`${this.inputId}-hint`}>${this.hint}</p>` : html`<span id=${`${this.inputId}-hint`}></span>`}
    </div>`;
  }
}

declare global {
  interface HTMLElementTagNameMap {
    'bw-number-field': BwNumberField;
  }
}
