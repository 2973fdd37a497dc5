// "I made this cut", or only part of it: the whole advised cut in one press, or the share of each
// depth actually taken off (the next round then calibrates from the shape really cut). Fires
// `cut-made` with the percent made; the view records it.
import { LitElement, html, css } from 'lit';
import { customElement, state } from 'lit/decorators.js';
import { smallestPartialCutPercent } from '../../src/index.ts';
import { sharedStyles } from '../styles/sharedStyles.ts';
import type { ValueCommitDetail } from './bw-number-field.ts';
import './bw-number-field.ts';

/** Detail of `cut-made`: the share of each advised depth taken off, percent (100 = all of it). */
export interface CutMadeDetail {
  percent: number;
}

/** `<bw-cut-made>` */
@customElement('bw-cut-made')
export class BwCutMade extends LitElement {
  static override styles = [
    sharedStyles,
    css`
      :host {
        display: block;
        margin-top: 0.8rem;
      }
      details {
        margin-top: 0.6rem;
      }
      .part {
        display: flex;
        flex-wrap: wrap;
        gap: 0.6rem;
        align-items: end;
        margin-top: 0.4rem;
      }
    `,
  ];

  @state() private percent: number | null = null;

  private send(percent: number): void {
    this.dispatchEvent(new CustomEvent<CutMadeDetail>('cut-made', { detail: { percent }, bubbles: true, composed: true }));
    this.percent = null;
  }

  protected override render() {
    return html`<div class="row">
        <button class="primary" @click=${() => this.send(100)} data-testid="mark-cut-done">I made this cut</button>
        <span class="muted">Then strike the bar and record the next round. Cut less if unsure: the next round corrects it.</span>
      </div>
      <details data-testid="part-cut">
        <summary>I made only part of it</summary>
        <p class="muted">Say how much of each depth you took off (a half-made cut is 50 %): the next round is then worked out from the shape you really cut.</p>
        <div class="part">
          <bw-number-field label="Part of each depth made" unit="%" name="part-made" .value=${this.percent} .min=${smallestPartialCutPercent} .max=${99}
            @value-commit=${(event: CustomEvent<ValueCommitDetail>) => (this.percent = event.detail.value)}></bw-number-field>
          <button ?disabled=${this.percent === null} @click=${() => this.percent !== null && this.send(this.percent)} data-testid="mark-part-done">Record the part I made</button>
        </div>
      </details>`;
  }
}

declare global {
  interface HTMLElementTagNameMap {
    'bw-cut-made': BwCutMade;
  }
}
