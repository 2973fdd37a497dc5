// Per lot (the board or batch bars were cut from): what its finished bars taught, from which bars,
// and what the next bar cut from it starts from; the bars still waiting. A bar names its lot in
// the shape view's blank form; a bar marked done in the tuning view teaches its lot.
import { LitElement, html, css, nothing } from 'lit';
import { customElement, property } from 'lit/decorators.js';
import { projectLots, type ProjectFile, type ProjectLot } from '../../src/index.ts';
import { sharedStyles } from '../styles/sharedStyles.ts';
import { formatNumber, partialName } from '../format.ts';

/** A correction per unit arch depth in percent, signed. */
function percent(value: number): string {
  return `${value >= 0 ? '+' : '−'}${formatNumber(Math.abs(100 * value), 1)} %`;
}

/** `<bw-lot-panel .project>` */
@customElement('bw-lot-panel')
export class BwLotPanel extends LitElement {
  static override styles = [
    sharedStyles,
    css`
      :host {
        display: block;
      }
      .lot + .lot {
        margin-top: 1rem;
        border-top: 1px solid var(--bw-line-soft);
        padding-top: 0.8rem;
      }
      h4 {
        margin: 0 0 0.3rem;
      }
    `,
  ];

  @property({ attribute: false }) project: ProjectFile | null = null;

  private renderLot(lot: ProjectLot) {
    const next = lot.next;
    return html`<div class="lot" data-testid="lot" data-lot=${lot.name}>
      <h4>Lot ${lot.name}</h4>
      ${next
        ? html`<p data-testid="lot-next">
              The next bar starts from stiffness (E) ${formatNumber(next.E_GPa, 2)} GPa ± ${formatNumber(next.E_spread_percent, 1)} %, shear stiffness (G) ${formatNumber(next.G_GPa, 3)} GPa ± ${formatNumber(next.G_spread_percent, 0)} %;
              model correction per unit arch depth ${next.corrections.slice(0, 3).map((c, n) => `${partialName(n)} ${percent(c.mean)} ± ${formatNumber(100 * c.sigma, 1)}`).join(', ')}${next.pitch ? `; pitch ${formatNumber(next.pitch.cents_per_c, 2)} ± ${formatNumber(next.pitch.sigma, 2)} cents per °C` : ''}.
            </p>
            <div class="table-wrap">
              <table data-testid="lot-bars">
                <caption class="visually-hidden">What each finished bar of lot ${lot.name} taught</caption>
                <thead>
                  <tr><th scope="col">Learnt from</th><th scope="col" class="number">Rounds</th><th scope="col" class="number">E (GPa)</th><th scope="col" class="number">G (GPa)</th><th scope="col" class="number">Density (kg/m³)</th><th scope="col" class="number">Cents per °C</th></tr>
                </thead>
                <tbody>
                  ${lot.learntFrom.map(
                    ({ note, record }) => html`<tr>
                      <th scope="row">${note}</th>
                      <td class="number">${record.steps}</td>
                      <td class="number">${formatNumber(record.E_GPa, 2)}</td>
                      <td class="number">${formatNumber(record.G_GPa, 3)}</td>
                      <td class="number">${formatNumber(record.density_kg_m3, 0)}</td>
                      <td class="number">${record.pitch_cents_per_c === undefined ? '–' : `${formatNumber(record.pitch_cents_per_c, 2)}${record.pitch_learnt ? ' (its own)' : ''}`}</td>
                    </tr>`,
                  )}
                </tbody>
              </table>
            </div>`
        : html`<p class="muted">Nothing learnt yet: when a bar cut from it is marked done, what its rounds taught becomes the next bar's starting point.</p>`}
      ${lot.waiting.length > 0 ? html`<p class="muted">Still to tune from this lot: ${lot.waiting.join(', ')}.</p>` : nothing}
    </div>`;
  }

  protected override render() {
    const project = this.project;
    if (!project) return nothing;
    const lots = projectLots(project);
    return html`<section class="panel" aria-labelledby="lots-heading" data-testid="lots">
      <h3 id="lots-heading">Lots (boards and batches)</h3>
      ${lots.length === 0
        ? html`<p class="muted">No bar names the board or batch it was cut from. Name it in a bar's blank (shape view): each finished bar then teaches the next one from the same lot.</p>`
        : lots.map((lot) => this.renderLot(lot))}
    </section>`;
  }
}

declare global {
  interface HTMLElementTagNameMap {
    'bw-lot-panel': BwLotPanel;
  }
}
