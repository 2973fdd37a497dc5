// Typing the partials heard: one field per partial, Enter moves to the next and, on the last,
// records the round. Filled in when listening hears the bar. Fires `round-submit`.
// A heard frequency is kept as the number it is: the field shows it rounded, and the round
// records the full value unless the maker types over it (then the typed number counts). The
// twisting and sideways modes, when read, go with the round (bw-other-mode-fields).
import { LitElement, html, css, nothing } from 'lit';
import { customElement, property, state } from 'lit/decorators.js';
import { sharedStyles } from '../styles/sharedStyles.ts';
import { formatHz, partialName } from '../format.ts';
import type { BwOtherModeFields, OtherModeReadings } from './bw-other-mode-fields.ts';
import './bw-other-mode-fields.ts';

/** Detail of `round-submit`. */
export interface RoundSubmitDetail extends OtherModeReadings {
  hz: number[];
  source: 'typed' | 'microphone' | 'file';
}

/** `<bw-partial-entry count .targets .filled>` */
@customElement('bw-partial-entry')
export class BwPartialEntry extends LitElement {
  static override styles = [
    sharedStyles,
    css`
      :host {
        display: block;
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
        font-size: 1.4rem;
        font-weight: 700;
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
      .actions {
        margin-top: 0.6rem;
      }
    `,
  ];

  /** How many partials to enter. */
  @property({ type: Number }) count = 3;
  /** Target frequencies (shown as hints), Hz. */
  @property({ attribute: false }) targets: number[] = [];
  /** The range each partial's reading may lie in for this piece, [lowest, highest] Hz (readingRangesHz); none where missing. */
  @property({ attribute: false }) ranges: [number, number][] = [];
  /** Frequencies heard by listening, to fill in (null = not heard). */
  @property({ attribute: false }) filled: (number | null)[] | null = null;
  /** Where `filled` came from. */
  @property() filledFrom: 'microphone' | 'file' = 'microphone';

  @state() private texts: string[] = [];
  /** Heard frequencies behind untouched fields, Hz (full precision; null where typed or empty). */
  @state() private heard: (number | null)[] = [];
  @state() private errors: string[] = [];
  @state() private source: RoundSubmitDetail['source'] = 'typed';

  protected override willUpdate(changed: Map<string, unknown>): void {
    if (changed.has('filled') && this.filled) {
      const filled = this.filled;
      this.heard = Array.from({ length: this.count }, (_, index) => filled[index] ?? null);
      this.texts = this.heard.map((hz) => (hz === null ? '' : formatHz(hz)));
      this.errors = [];
      this.source = this.filledFrom;
    }
  }

  private check(): number[] | null {
    const errors: string[] = [];
    const values: number[] = [];
    let ended = false;
    for (let index = 0; index < this.count; index += 1) {
      const text = (this.texts[index] ?? '').trim().replace(',', '.');
      const heard = this.heard[index] ?? null;
      if (text === '') {
        if (index === 0) errors[index] = 'Enter at least the fundamental (Hz)';
        ended = true;
        continue;
      }
      const value = heard ?? Number(text);
      if (ended) errors[index] = `Fill in ${partialName(index - 1).toLowerCase()} first, or clear this one`;
      else if (!Number.isFinite(value) || value <= 0) errors[index] = 'Must be a frequency in Hz greater than 0';
      else if (this.outOfRange(index, value)) errors[index] = this.outOfRange(index, value);
      else if (index > 0 && value <= values[index - 1]!) errors[index] = `Must be higher than ${partialName(index - 1).toLowerCase()} (${formatHz(values[index - 1])} Hz)`;
      else values.push(value);
    }
    this.errors = errors;
    return errors.some(Boolean) ? null : values;
  }

  /** The refusal of a reading outside its range for this piece, with the range; '' when inside. */
  private outOfRange(index: number, value: number): string {
    const range = this.ranges[index];
    if (!range || (value >= range[0] && value <= range[1])) return '';
    return `${partialName(index)} must lie within ${formatHz(range[0])}–${formatHz(range[1])} Hz for this piece (a quarter to four times what its shape should sound)`;
  }

  /** Refuses a typed reading outside its range as soon as the field is left. */
  private onBlur(index: number): void {
    const text = (this.texts[index] ?? '').trim().replace(',', '.');
    if (text === '') return;
    const value = this.heard[index] ?? Number(text);
    const errors = [...this.errors];
    errors[index] = !Number.isFinite(value) || value <= 0 ? 'Must be a frequency in Hz greater than 0' : this.outOfRange(index, value);
    this.errors = errors;
  }

  private get otherModes(): BwOtherModeFields | null {
    return this.renderRoot.querySelector('bw-other-mode-fields');
  }

  /** The fundamental as entered so far, Hz (null while it is not a frequency). */
  private fundamentalHz(): number | null {
    const text = (this.texts[0] ?? '').trim().replace(',', '.');
    const value = this.heard[0] ?? (text === '' ? NaN : Number(text));
    return Number.isFinite(value) && value > 0 ? value : null;
  }

  private submit(): void {
    const values = this.check();
    const fields = this.otherModes;
    const others = fields ? fields.readings() : {};
    if (!values || !others) return;
    this.dispatchEvent(new CustomEvent<RoundSubmitDetail>('round-submit', { detail: { hz: values, source: this.source, ...others }, bubbles: true, composed: true }));
    this.texts = [];
    this.heard = [];
    this.source = 'typed';
    this.otherModes?.clear();
  }

  /** Clears the fields (after a round was recorded elsewhere). */
  clear(): void {
    this.texts = [];
    this.heard = [];
    this.errors = [];
    this.otherModes?.clear();
  }

  private onKey(event: KeyboardEvent, index: number): void {
    if (event.key !== 'Enter') return;
    event.preventDefault();
    const next = this.renderRoot.querySelector<HTMLInputElement>(`#partial-${index + 1}`);
    if (next && index + 1 < this.count) next.focus();
    else this.submit();
  }

  protected override render() {
    return html`<div class="fields">
        ${Array.from({ length: this.count }, (_, index) => {
          const error = this.errors[index];
          return html`<div class="field">
            <label for=${`partial-${index}`}>${partialName(index)} heard <span class="visually-hidden">(Hz)</span></label>
            <input
              id=${`partial-${index}`}
              inputmode="decimal"
              autocomplete="off"
              placeholder="Hz"
              .value=${this.texts[index] ?? ''}
              aria-invalid=${error ? 'true' : 'false'}
              aria-describedby=${`partial-${index}-hint`}
              @input=${(event: Event) => {
                const texts = [...this.texts];
                texts[index] = (event.target as HTMLInputElement).value;
                this.texts = texts;
                const heard = [...this.heard];
                heard[index] = null;
                this.heard = heard;
                this.source = 'typed';
              }}
              @keydown=${(event: KeyboardEvent) => this.onKey(event, index)}
              @blur=${() => this.onBlur(index)}
            />
            <span class="hint" id=${`partial-${index}-hint`}>Hz · target ${formatHz(this.targets[index])}${this.ranges[index] ? html` · takes ${formatHz(this.ranges[index]![0])}–${formatHz(this.ranges[index]![1])}` : nothing}</span>
            ${error ? html`<span class="message" role="alert">✕ ${error}</span>` : nothing}
          </div>`;
        })}
      </div>
      <bw-other-mode-fields .fundamentalHz=${this.fundamentalHz()} @other-modes-enter=${this.submit}></bw-other-mode-fields>
      <div class="actions row">
        <button class="primary" @click=${this.submit} data-testid="record-round">Record this round</button>
        <span class="muted">Enter moves to the next partial; Enter on the last records.</span>
      </div>`;
  }
}

declare global {
  interface HTMLElementTagNameMap {
    'bw-partial-entry': BwPartialEntry;
  }
}
