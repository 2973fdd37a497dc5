// Where to check a cut with the caliper: 3–5 positions from the left end of the bar after the cut,
// and the thickness to expect at each. Readings taken there go with the next round.
import { LitElement, html, css, nothing } from 'lit';
import { customElement, property } from 'lit/decorators.js';
import type { CaliperCheckpoint } from '../../src/index.ts';
import { sharedStyles } from '../styles/sharedStyles.ts';
import { formatMm } from '../format.ts';

/** `<bw-caliper-checkpoints .points>` */
@customElement('bw-caliper-checkpoints')
export class BwCaliperCheckpoints extends LitElement {
  static override styles = [
    sharedStyles,
    css`
      :host {
        display: block;
      }
      td,
      th {
        font-size: 1.1rem;
      }
    `,
  ];

  @property({ attribute: false }) points: readonly CaliperCheckpoint[] = [];

  protected override render() {
    const points = this.points;
    if (points.length === 0) return nothing;
    return html`<h4>Check with the caliper after the cut</h4>
      <table data-testid="checkpoints">
        <caption class="visually-hidden">Caliper checkpoints: position from the left end and the thickness to expect</caption>
        <thead><tr><th scope="col" class="number">From the left end (mm)</th><th scope="col" class="number">Expect (mm)</th></tr></thead>
        <tbody>${points.map((point) => html`<tr><td class="number">${formatMm(point.x_mm, 0)}</td><td class="number">${formatMm(point.thickness_mm, 2)}</td></tr>`)}</tbody>
      </table>
      <p class="muted">Enter what you measure with the next round: the advice then follows the bar as it really is.</p>`;
  }
}

declare global {
  interface HTMLElementTagNameMap {
    'bw-caliper-checkpoints': BwCaliperCheckpoints;
  }
}
