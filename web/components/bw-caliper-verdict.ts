// What the caliper said about the last cut: how deep it went against its plan and where it was
// furthest off; the advice then follows the bar as measured.
import { LitElement, html, css, nothing } from 'lit';
import { customElement, property } from 'lit/decorators.js';
import type { CutAgainstPlan } from '../../src/index.ts';
import { sharedStyles } from '../styles/sharedStyles.ts';
import { formatMm, formatNumber } from '../format.ts';

/** `<bw-caliper-verdict .checked>` */
@customElement('bw-caliper-verdict')
export class BwCaliperVerdict extends LitElement {
  static override styles = [
    sharedStyles,
    css`
      :host {
        display: block;
      }
    `,
  ];

  /** The last cut checked against its plan (the advice's calibration), or null. */
  @property({ attribute: false }) checked: CutAgainstPlan | null = null;

  protected override render() {
    const checked = this.checked;
    if (!checked || checked.checkpoints.length === 0) return nothing;
    const worst = checked.checkpoints.reduce((far, point) => (Math.abs(point.off_mm) > Math.abs(far.off_mm) ? point : far));
    const off = Math.abs(worst.off_mm);
    return html`<p data-testid="caliper-verdict">
      <strong>Caliper after the last cut:</strong>
      ${checked.percent !== null ? `it went ${formatNumber(checked.percent, 0)} % as deep as planned; ` : ''}${off < 0.005 ? 'on plan at every checkpoint' : `furthest from plan at ${formatMm(worst.x_mm, 0)} mm, ${formatMm(off, 2)} mm ${worst.off_mm > 0 ? 'deeper' : 'shallower'}`}.
      The advice uses the bar as measured.
    </p>`;
  }
}

declare global {
  interface HTMLElementTagNameMap {
    'bw-caliper-verdict': BwCaliperVerdict;
  }
}
