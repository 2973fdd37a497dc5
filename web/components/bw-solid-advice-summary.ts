// What the 3D model said about a round's advice, in plain words: the wood it fitted (stiffness
// along the grain, shear against the bar file's), the grain when a twisting or sideways mode was
// read, whether the cut was planned with its own sensitivities, and how many analyses it took.
// The arch's correction is behind an engineering-detail disclosure. Never shows a non-finite number.
import { LitElement, html, css, nothing } from 'lit';
import { customElement, property } from 'lit/decorators.js';
import type { SolidSessionReport } from '../../src/index.ts';
import { sharedStyles } from '../styles/sharedStyles.ts';
import { formatCents, formatNumber, partialName } from '../format.ts';

const finite = (value: number | null | undefined): value is number => typeof value === 'number' && Number.isFinite(value);

/** `<bw-solid-advice-summary .report>` (null: the 3D model was not consulted for this round). */
@customElement('bw-solid-advice-summary')
export class BwSolidAdviceSummary extends LitElement {
  static override styles = [
    sharedStyles,
    css`
      :host {
        display: block;
        border-left: 4px solid var(--bw-action);
        padding: 0.2rem 0 0.2rem 0.8rem;
        margin: 0.6rem 0;
      }
      p {
        margin: 0.3rem 0;
      }
    `,
  ];

  @property({ attribute: false }) report: SolidSessionReport | null = null;

  private renderWood(report: SolidSessionReport) {
    if (!finite(report.E_L_GPa) || !finite(report.shear_scale)) return nothing;
    const residuals = report.fit_residual_cents.filter(finite);
    const worst = residuals.length ? Math.max(...residuals.map(Math.abs)) : null;
    return html`<p data-testid="solid-wood">The wood, fitted on the 3D model: stiffness along the grain <strong>${formatNumber(report.E_L_GPa, 2)} GPa</strong>, shear stiffness <strong>${formatNumber(100 * report.shear_scale, 0)} %</strong> of the bar file's${worst !== null ? html` (the readings left unexplained: within ${formatNumber(worst, 1)} cents)` : nothing}.</p>`;
  }

  private renderGrain(report: SolidSessionReport) {
    const grain = report.grain;
    if (!grain || !finite(grain.ring_angle_deg)) return html`<p class="muted" data-testid="solid-grain">Grain: as the bar file says (a twisting or sideways mode read with a round lets the 3D model fit it).</p>`;
    const from = [
      ...(finite(grain.residual_hz.torsion) ? [`the twisting mode (model ${formatNumber(Math.abs(grain.residual_hz.torsion), 1)} Hz ${grain.residual_hz.torsion >= 0 ? 'below' : 'above'} the reading)`] : []),
      ...(finite(grain.residual_hz.lateral) ? [`the sideways mode (model ${formatNumber(Math.abs(grain.residual_hz.lateral), 1)} Hz ${grain.residual_hz.lateral >= 0 ? 'below' : 'above'} the reading)`] : []),
    ];
    return html`<p data-testid="solid-grain">The grain, fitted${from.length ? ` to ${from.join(' and ')}` : ''}: growth rings at about <strong>${formatNumber(grain.ring_angle_deg, 0)}°</strong> to the thickness (0° quarter-sawn, 90° flat-sawn).</p>`;
  }

  private renderDetail(report: SolidSessionReport) {
    const gaps = report.solid_minus_line_cents;
    if (!finite(report.arch_depth) || gaps.length === 0 || !gaps.every(finite)) return nothing;
    return html`<details>
      <summary>Engineering detail</summary>
      <p>On the planned shape (arch depth ${formatNumber(report.arch_depth, 2)}), the 3D model against the line model: ${gaps.map((cents, index) => `${partialName(index).toLowerCase()} ${formatCents(cents)} cents`).join(', ')}; the calibration's correction starts from that gap.</p>
    </details>`;
  }

  protected override render() {
    const report = this.report;
    if (!report) return html`<p class="muted" data-testid="solid-advice">The 3D model was not needed this round: there is no cut to plan.</p>`;
    const solves = finite(report.solid_solves) ? report.solid_solves : 0;
    return html`<div data-testid="solid-advice">
      <p><strong>Worked out on the 3D model</strong> (${solves} ${solves === 1 ? 'analysis' : 'analyses'} of the 3D bar).</p>
      ${this.renderWood(report)} ${this.renderGrain(report)}
      ${report.solid_sensitivities ? html`<p data-testid="solid-closing-in">Closing in with the 3D model's own sensitivities: small cuts move the partials as the 3D bar does.</p>` : nothing}
      ${this.renderDetail(report)}
    </div>`;
  }
}

declare global {
  interface HTMLElementTagNameMap {
    'bw-solid-advice-summary': BwSolidAdviceSummary;
  }
}
