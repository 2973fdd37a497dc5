// The advised cut, for the bench: a suspect reading headed as such with what to check; the
// headline (or a light sanding); checks before cutting and cautions; the drawing; checkpoints at
// round positions and every station; where to check with the caliper; what the cut should sound
// like; and "I made this cut" (whole or part; `cut-made` bubbles up from bw-cut-made). A stuck
// verdict shows why, or the suspect reading that explains it.
import { LitElement, html, css, nothing } from 'lit';
import { customElement, property } from 'lit/decorators.js';
import {
  barMaterialFamily,
  barTargetHz,
  comparePartials,
  cutInstructions,
  fineSandingDepthMm,
  registerOf,
  suspectReading,
  type CutAdvice,
  type CutInstructions,
  type NextCutResult,
  type ProjectBar,
  type ProjectFile,
  type SuspectReading,
} from '../../src/index.ts';
import { sharedStyles } from '../styles/sharedStyles.ts';
import { formatMm, partialName } from '../format.ts';
import './bw-cautions.ts';
import './bw-profile-drawing.ts';
import './bw-station-table.ts';
import './bw-caliper-checkpoints.ts';
import './bw-cents-readout.ts';
import './bw-round-checkpoints.ts';
import './bw-cut-made.ts';

/** `<bw-cut-advice .project .bar .advice .nodesMm>` (advice with status 'cut' or 'stuck') */
@customElement('bw-cut-advice')
export class BwCutAdvice extends LitElement {
  static override styles = [
    sharedStyles,
    css`
      :host {
        display: block;
      }
      .advice-status {
        font-size: 1.25rem;
        font-weight: 800;
      }
      .after {
        display: grid;
        grid-template-columns: repeat(auto-fit, minmax(9rem, 1fr));
        gap: 0.5rem;
      }
      .suspect {
        border: 2px solid var(--bw-problem-ink);
        border-radius: 8px;
        padding: 0.4rem 0.8rem;
        margin-bottom: 0.8rem;
      }
    `,
  ];

  @property({ attribute: false }) project: ProjectFile | null = null;
  @property({ attribute: false }) bar: ProjectBar | null = null;
  @property({ attribute: false }) advice: CutAdvice | null = null;
  /** The fundamental's nodes on the bar now, mm from the left end (for the drawing). */
  @property({ attribute: false }) nodesMm: number[] = [];

  /** The last round judged from the advice's calibration: suspect when no plausible bar explains it (suspectReading). */
  private suspect(project: ProjectFile, bar: ProjectBar, calibration: NextCutResult['calibration'] | undefined): SuspectReading | null {
    const last = bar.session.steps[bar.session.steps.length - 1];
    if (!calibration || !last) return null;
    const verdict = suspectReading({
      family: barMaterialFamily(bar.current),
      E_GPa: calibration.E_GPa,
      step: bar.session.steps.length,
      residualCents: calibration.residual_cents[calibration.residual_cents.length - 1] ?? [],
      flags: calibration.flags,
      correctionPercent: calibration.correction_percent,
      archDepth: calibration.arch_depth,
      readingsHz: last.measured_hz,
      ratios: registerOf(project, bar).ratios,
    });
    return verdict.suspect ? verdict : null;
  }

  private renderSuspect(verdict: SuspectReading, bar: ProjectBar) {
    return html`<div class="suspect" role="alert" data-testid="suspect-reading">
      <p class="advice-status problem">⚠ SUSPECT READING: check round ${bar.session.steps.length} before cutting</p>
      <p>No plausible bar sounds like this: ${verdict.why.join('; ')}.</p>
      <p><strong>Check, most likely first:</strong></p>
      <ul>${verdict.check.map((item) => html`<li>${item}</li>`)}</ul>
      <p class="muted">If the reading was wrong, remove the last round below and enter it again; if it stands after a careful re-strike, the bar itself may be cracked or the cut not as recorded.</p>
    </div>`;
  }

  protected override render() {
    const { project, bar, advice } = this;
    if (!project || !bar || !advice) return nothing;
    const register = registerOf(project, bar);
    const targets = barTargetHz(project, bar);
    const plan: CutInstructions = (advice as { cut?: CutInstructions | null }).cut ?? cutInstructions(bar.current, advice.bar_after);
    const extras = advice as { warnings?: string[]; calibration?: NextCutResult['calibration']; predicted_cents?: number[]; now_cents?: number[] };
    // Where the temperature coefficient comes from is a note on the readings, not a check before cutting.
    const checks = (extras.warnings ?? []).filter((warning) => !warning.startsWith('temperature:'));
    const predicted = comparePartials(advice.predicted_hz, targets, register.tolerance_cents);
    const suspect = this.suspect(project, bar, extras.calibration);
    const light = plan.shortening_mm <= 0.005 && plan.max_depth_mm < fineSandingDepthMm;
    const effect = extras.predicted_cents?.map((cents, index) => cents - (extras.now_cents?.[index] ?? cents)) ?? [];
    return advice.status === 'stuck'
      ? suspect
        ? html`${this.renderSuspect(suspect, bar)}<details><summary>What the advice made of it</summary><p>No removal can reach the target from this reading: ${advice.reason ?? ''}</p></details>`
        : html`<p class="advice-status problem">No removal can reach the target from here.</p><p>${advice.reason ?? ''}</p>`
      : html`${suspect ? this.renderSuspect(suspect, bar) : nothing}
          <p class="advice-status">${light ? 'Only a light sanding: under 0.05 mm anywhere, shaded on the drawing.' : html`Take off up to ${formatMm(plan.max_depth_mm, 2)} mm${plan.shortening_mm > 0.005 ? ` and shorten ${formatMm(plan.shortening_mm / 2)} mm each end` : ''}, shaded on the drawing.`}</p>
          ${checks.length > 0 ? html`<div class="problem" role="status"><strong>⚠ Check before cutting:</strong><ul>${checks.map((warning) => html`<li>${warning}</li>`)}</ul></div>` : nothing}
          <bw-cautions material=${barMaterialFamily(bar.current)}></bw-cautions>
          <bw-profile-drawing .bar=${bar.current} .cutTo=${advice.bar_after} .cut=${plan} .nodesMm=${this.nodesMm}></bw-profile-drawing>
          <bw-round-checkpoints .now=${bar.current} .cutTo=${advice.bar_after} .plan=${plan} .effectCents=${effect}></bw-round-checkpoints>
          <details>
            <summary>Every station of the plan (from the left end)</summary>
            <bw-station-table .plan=${plan}></bw-station-table>
          </details>
          <bw-caliper-checkpoints .points=${advice.checkpoints ?? []}></bw-caliper-checkpoints>
          <h4>Expected after this cut</h4>
          <div class="after">
            ${predicted.map((standing, index) => html`<bw-cents-readout compact label=${partialName(index)} .cents=${standing.cents} .verdict=${standing.verdict} .hz=${standing.hz} .targetHz=${standing.targetHz}></bw-cents-readout>`)}
          </div>
          <bw-cut-made></bw-cut-made>`;
  }
}

declare global {
  interface HTMLElementTagNameMap {
    'bw-cut-advice': BwCutAdvice;
  }
}
