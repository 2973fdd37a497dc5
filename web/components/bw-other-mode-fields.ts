// Two optional readings that go with a round: the first twisting mode (strike a corner) and the
// first sideways mode (strike the side), Hz. The 3D model's advice fits the grain to them. Each is
// refused at its field by the session file's rule: above the fundamental, below 20 000 Hz.
import { LitElement, html, css, nothing } from 'lit';
import { customElement, property, state } from 'lit/decorators.js';
import { isInputError, otherModeHz } from '../../src/index.ts';
import { sharedStyles } from '../styles/sharedStyles.ts';

/** The readings given, Hz (a field left empty is absent). */
export interface OtherModeReadings {
  torsionHz?: number;
  lateralHz?: number;
}

const fields = [
  { key: 'torsionHz', field: 'measured_torsion_hz', label: 'Twisting mode', hint: 'strike a corner', testid: 'torsion-hz' },
  { key: 'lateralHz', field: 'measured_lateral_hz', label: 'Sideways mode', hint: 'strike the side', testid: 'lateral-hz' },
] as const;

/** `<bw-other-mode-fields .fundamentalHz>`; Enter in the last field fires `other-modes-enter`. */
@customElement('bw-other-mode-fields')
export class BwOtherModeFields extends LitElement {
  static override styles = [
    sharedStyles,
    css`
      :host {
        display: block;
        margin-top: 0.6rem;
      }
      .fields {
        display: grid;
        grid-template-columns: repeat(auto-fit, minmax(10rem, 1fr));
        gap: 0.6rem;
      }
      .field {
        display: grid;
        gap: 0.2rem;
      }
      input {
        width: 100%;
        text-align: right;
        font-variant-numeric: tabular-nums;
      }
      .hint {
        font-size: 0.85rem;
        color: var(--bw-ink-muted);
      }
      .message {
        color: var(--bw-problem-ink);
        font-size: 0.9rem;
      }
    `,
  ];

  /** The fundamental of the round being entered, Hz (null while it is not a number). */
  @property({ attribute: false }) fundamentalHz: number | null = null;

  @state() private texts: string[] = ['', ''];
  @state() private errors: string[] = ['', ''];

  /** The refusal of field `index` by the session file's rule; '' when empty or accepted. */
  private refusal(index: number): string {
    const text = (this.texts[index] ?? '').trim().replace(',', '.');
    if (text === '') return '';
    const value = Number(text);
    if (!Number.isFinite(value)) return 'Must be a frequency in Hz';
    if (this.fundamentalHz === null) return 'Enter the fundamental first';
    try {
      otherModeHz('round', fields[index]!.field, value, [this.fundamentalHz]);
      return '';
    } catch (error) {
      if (isInputError(error)) return error.rule.charAt(0).toUpperCase() + error.rule.slice(1);
      throw error;
    }
  }

  /** The readings when both fields are empty or accepted (their refusals shown otherwise), else null. */
  readings(): OtherModeReadings | null {
    this.errors = fields.map((_, index) => this.refusal(index));
    if (this.errors.some(Boolean)) return null;
    const readings: OtherModeReadings = {};
    fields.forEach((entry, index) => {
      const text = (this.texts[index] ?? '').trim().replace(',', '.');
      if (text !== '') readings[entry.key] = Number(text);
    });
    return readings;
  }

  /** Empties both fields (after the round was recorded). */
  clear(): void {
    this.texts = ['', ''];
    this.errors = ['', ''];
  }

  private onBlur(index: number): void {
    const errors = [...this.errors];
    errors[index] = this.refusal(index);
    this.errors = errors;
  }

  private onKey(event: KeyboardEvent, index: number): void {
    if (event.key !== 'Enter') return;
    event.preventDefault();
    const next = this.renderRoot.querySelector<HTMLInputElement>(`#${fields[index + 1]?.testid ?? ''}`);
    if (next) next.focus();
    else this.dispatchEvent(new CustomEvent('other-modes-enter', { bubbles: true, composed: true }));
  }

  protected override render() {
    return html`<div class="fields" role="group" aria-label="Other modes heard (optional)">
      ${fields.map((entry, index) => {
        const error = this.errors[index];
        return html`<div class="field">
          <label for=${entry.testid}>${entry.label} <span class="muted">(Hz, optional)</span></label>
          <input
            id=${entry.testid}
            data-testid=${entry.testid}
            inputmode="decimal"
            autocomplete="off"
            placeholder="Hz"
            .value=${this.texts[index] ?? ''}
            aria-invalid=${error ? 'true' : 'false'}
            aria-describedby=${`${entry.testid}-hint`}
            @input=${(event: Event) => {
              const texts = [...this.texts];
              texts[index] = (event.target as HTMLInputElement).value;
              this.texts = texts;
              // A refusal shown goes as soon as the reading is acceptable (not on leaving the field, which would move what is below under the pointer).
              if (this.errors[index] && !this.refusal(index)) this.errors = this.errors.map((message, at) => (at === index ? '' : message));
            }}
            @keydown=${(event: KeyboardEvent) => this.onKey(event, index)}
            @blur=${() => this.onBlur(index)}
          />
          <span class="hint" id=${`${entry.testid}-hint`}>${entry.hint}; lets the 3D model fit the grain</span>
          ${error ? html`<span class="message" role="alert" data-testid=${`${entry.testid}-error`}>✕ ${error}</span>` : nothing}
        </div>`;
      })}
    </div>`;
  }
}

declare global {
  interface HTMLElementTagNameMap {
    'bw-other-mode-fields': BwOtherModeFields;
  }
}
