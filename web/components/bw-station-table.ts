// The next cut as a station table: position from the left end, thickness now and after, and
// how much to take off, in large figures; any shortening first.
import { LitElement, html, css, nothing } from 'lit';
import { customElement, property } from 'lit/decorators.js';
import type { CutInstructions } from '../../src/index.ts';
import { sharedStyles } from '../styles/sharedStyles.ts';
import { formatMm } from '../format.ts';

/** `<bw-station-table .plan>` (the library's cut instructions: stations where wood comes off) */
@customElement('bw-station-table')
export class BwStationTable extends LitElement {
  static override styles = [
    sharedStyles,
    css`
      :host {
        display: block;
      }
      .wrap {
        max-height: 26rem;
        overflow: auto;
        border: 1px solid var(--bw-line-soft);
        border-radius: 8px;
      }
      table {
        width: 100%;
      }
      thead th {
        position: sticky;
        top: 0;
        background: var(--bw-panel);
      }
      td.remove {
        font-size: 1.25rem;
        font-weight: 800;
      }
      tr.idle td {
        color: var(--bw-ink-muted);
      }
      .shorten {
        font-size: 1.2rem;
        font-weight: 800;
      }
      @media print {
        .wrap {
          max-height: none;
          overflow: visible;
        }
      }
      /* On a template sheet: every row the height the paper plan counts (templateSheet.table_row_mm), no scroll box. */
      :host([printed]) .wrap {
        max-height: none;
        overflow: visible;
        border-radius: 0;
      }
      :host([printed]) th,
      :host([printed]) td {
        height: 6mm;
        padding: 0 0.6rem;
        line-height: 1.2;
        font-size: 10pt;
        box-sizing: border-box;
      }
      :host([printed]) thead th {
        height: 9mm;
      }
      :host([printed]) td.remove {
        font-size: 11pt;
      }
    `,
  ];

  @property({ attribute: false }) plan: CutInstructions | null = null;
  /** Part of a printed template: fixed row heights, no scroll box, and the shortening left to the sheet's heading. */
  @property({ type: Boolean, reflect: true }) printed = false;
  protected override render() {
    const plan = this.plan;
    if (!plan) return nothing;
    const stations = plan.stations;
    return html`${plan.shortening_mm > 0.005 && !this.printed ? html`<p class="shorten">First shorten: take ${formatMm(plan.shortening_mm / 2, 1)} mm off each end (${formatMm(plan.shortening_mm, 1)} mm in all).</p>` : nothing}
      <div class="wrap">
        <table data-testid="station-table">
          <caption class="visually-hidden">Stations of the cut, millimetres</caption>
          <thead>
            <tr><th scope="col" class="number">Station (mm from left)</th><th scope="col" class="number">Thick now (mm)</th><th scope="col" class="number">Thick after (mm)</th><th scope="col" class="number">Take off (mm)</th></tr>
          </thead>
          <tbody>
            ${stations.map(
              (station) => html`<tr class=${station.remove_mm < 0.005 ? 'idle' : ''}>
                <td class="number">${formatMm(station.position_mm)}</td>
                <td class="number">${formatMm(station.thickness_now_mm, 2)}</td>
                <td class="number">${formatMm(station.thickness_after_mm, 2)}</td>
                <td class="number remove">${station.remove_mm < 0.005 ? '–' : formatMm(station.remove_mm, 2)}</td>
              </tr>`,
            )}
          </tbody>
        </table>
      </div>`;
  }
}

declare global {
  interface HTMLElementTagNameMap {
    'bw-station-table': BwStationTable;
  }
}
