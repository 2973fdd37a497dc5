// Chooses which bar a view shows: a labelled list of the project's bars plus previous / next
// buttons (large targets). Fires `bar-pick` with the chosen bar's id.
import { LitElement, html, css } from 'lit';
import { customElement, property } from 'lit/decorators.js';
import { barName, type ProjectBar } from '../../src/index.ts';
import { sharedStyles } from '../styles/sharedStyles.ts';
import { stateName } from '../format.ts';

/** `<bw-bar-picker .bars bar-id>` */
@customElement('bw-bar-picker')
export class BwBarPicker extends LitElement {
  static override styles = [
    sharedStyles,
    css`
      :host {
        display: block;
      }
      .picker {
        display: flex;
        gap: 0.5rem;
        align-items: end;
        flex-wrap: wrap;
      }
      .choose {
        display: grid;
        gap: 0.2rem;
      }
      select {
        min-width: 14rem;
        font-size: 1.1rem;
        font-weight: 700;
      }
    `,
  ];

  @property({ attribute: false }) bars: ProjectBar[] = [];
  @property({ attribute: 'bar-id' }) barId = '';

  private pick(id: string | undefined): void {
    if (!id || id === this.barId) return;
    this.dispatchEvent(new CustomEvent<{ barId: string }>('bar-pick', { detail: { barId: id }, bubbles: true, composed: true }));
  }

  protected override render() {
    const index = this.bars.findIndex((bar) => bar.id === this.barId);
    return html`<div class="picker">
      <button aria-label="Previous bar" ?disabled=${index <= 0} @click=${() => this.pick(this.bars[index - 1]?.id)}>◀</button>
      <div class="choose">
        <label for="bar">Bar</label>
        <select id="bar" @change=${(event: Event) => this.pick((event.target as HTMLSelectElement).value)}>
          ${this.bars.map(
            (bar) => html`<option value=${bar.id} ?selected=${bar.id === this.barId}>${bar.note}${barName(bar) !== bar.note ? ` “${barName(bar)}”` : ''}${bar.current.section.shape === 'tube' ? ' (tube)' : bar.current.section.shape === 'round' ? ' (rod)' : ''} — ${stateName(bar.state)}</option>`,
          )}
        </select>
      </div>
      <button aria-label="Next bar" ?disabled=${index < 0 || index >= this.bars.length - 1} @click=${() => this.pick(this.bars[index + 1]?.id)}>▶</button>
    </div>`;
  }
}

declare global {
  interface HTMLElementTagNameMap {
    'bw-bar-picker': BwBarPicker;
  }
}
