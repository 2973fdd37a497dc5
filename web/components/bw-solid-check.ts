// The bar on the 3D solid model, on request: its tuned partials, torsion, lateral and
// longitudinal modes, each against the line model in cents, the nodal lines on a top view of the
// bar and the chosen mode's shape along it. Solved in a worker of its own (progress, cancel).
import { LitElement, html, css, nothing, svg } from 'lit';
import { customElement, property, state } from 'lit/decorators.js';
import { barMaterialFamily, stableHash, type BarAnalysis, type BarFile, type LotPrior, type ModeResult, type SessionFile } from '../../src/index.ts';
import type { SolidModesResult } from '../worker/solverProtocol.ts';
import { TaskController, workerJob } from '../controllers/TaskController.ts';
import { solidSolver } from '../worker/SolverClient.ts';
import { sharedStyles } from '../styles/sharedStyles.ts';
import { formatCents, formatHz, formatMm, formatNumber } from '../format.ts';
import type { PlottedMode } from './bw-mode-chart.ts';
import './bw-mode-chart.ts';

/** The families as the maker reads them. */
const familyNames: Record<string, string> = {
  bending: 'vertical bending (tuned partial)',
  torsion: 'torsion (twisting)',
  lateral: 'lateral (side to side)',
  longitudinal: 'longitudinal (stretching)',
};

type Family = 'bending' | 'torsion' | 'lateral' | 'longitudinal';

/** A family's name with a capital, to start a heading or a legend. */
const headingOf = (family: Family): string => familyNames[family]!.charAt(0).toUpperCase() + familyNames[family]!.slice(1);

/** What each family's shape curve shows (the cross-section's mean motion, or its twist). */
const quantities: Record<Family, string> = {
  bending: 'Up-and-down motion (scaled)',
  torsion: 'Twist of the cross-section (scaled)',
  lateral: 'Side-to-side motion (scaled)',
  longitudinal: 'Motion along the bar (scaled)',
};

/** `<bw-solid-check .bar bar-id>`: the 3D model of the bar shown, run when asked. */
@customElement('bw-solid-check')
export class BwSolidCheck extends LitElement {
  static override styles = [
    sharedStyles,
    css`
      :host {
        display: block;
      }
      .actions {
        display: flex;
        flex-wrap: wrap;
        gap: 0.5rem;
        align-items: center;
      }
      .scroll {
        overflow-x: auto;
      }
      tr.chosen {
        outline: 2px solid currentColor;
      }
      tr[data-mode] {
        cursor: pointer;
      }
      svg.top {
        width: 100%;
        height: auto;
        max-height: 9rem;
      }
    `,
  ];

  /** The bar as it is now. */
  @property({ attribute: false }) bar: BarFile | null = null;
  @property({ attribute: 'bar-id' }) barId = '';
  /** Tuned partials to list (the register's). */
  @property({ type: Number }) partials = 3;
  /** What calibrates the bar once it has rounds (its session and lot), or null. */
  @property({ attribute: false }) calibrationInputs: { session: SessionFile; lot: LotPrior | null } | null = null;

  @state() private chosen: { family: Family; mode: number } = { family: 'bending', mode: 1 };

  private readonly solid = new TaskController<SolidModesResult>(this, {});

  /** Fingerprint of what a check of the bar shown would be asked (kept current in willUpdate, not hashed on every render). */
  private inputsKey = '';

  protected override willUpdate(changed: Map<string, unknown>): void {
    if (changed.has('bar') || changed.has('partials') || changed.has('calibrationInputs')) this.inputsKey = this.bar ? stableHash({ bar: this.bar, partials: this.partials, calibration: this.calibrationInputs }) : '';
  }

  private run(): void {
    const bar = this.bar;
    if (!bar) return;
    this.chosen = { family: 'bending', mode: 1 };
    this.solid.run({ subject: this.barId, key: this.inputsKey }, workerJob(solidSolver, 'solidModes', { bar, modes: this.partials, ...this.calibrationInputs }));
  }

  private modesOf(analysis: BarAnalysis): { family: Family; mode: ModeResult }[] {
    const families: Family[] = ['bending', 'torsion', 'lateral', 'longitudinal'];
    return families.flatMap((family) => (analysis[family] ?? []).map((mode) => ({ family, mode })));
  }

  /** A top view of the bar (left end at the left) with the chosen mode's nodal lines. */
  private renderTopView(bar: BarFile, family: Family, mode: ModeResult) {
    if (bar.section.shape !== 'rect') return nothing;
    const length = bar.length_mm;
    const width = bar.section.width_mm;
    const lines = mode.nodal_lines_mm ?? [];
    return html`<svg class="top" viewBox="${-5} ${-5} ${length + 10} ${width + 10}" role="img" aria-label=${`Top view: nodal lines of ${familyNames[family]} mode ${mode.mode} at ${lines.map((x) => formatMm(x)).join(', ')} mm from the left end${family === 'torsion' ? ', and along the centre line' : ''}`}>
      <rect x="0" y="0" width=${length} height=${width} fill="none" stroke="currentColor" stroke-width="0.8"></rect>
      ${family === 'torsion' ? svg`<line x1="0" x2=${length} y1=${width / 2} y2=${width / 2} stroke="currentColor" stroke-width="1.2" stroke-dasharray="4 3"></line>` : nothing}
      ${lines.map((x) => svg`<line x1=${x} x2=${x} y1="0" y2=${width} stroke="currentColor" stroke-width="1.6" stroke-dasharray="4 3"></line>`)}
    </svg>`;
  }

  protected override render() {
    const bar = this.bar;
    if (!bar) return nothing;
    if (bar.section.shape !== 'rect')
      return html`<p class="muted">The 3D model covers rectangular bars; ${bar.section.shape === 'tube' ? 'tubes' : 'rods'} stay on the line model, whose results are above.</p>`;
    const state = this.solid.state(this.barId);
    const current = state.valueBinding?.key === this.inputsKey;
    const analysis = state.value?.analysis ?? null;
    const calibration = state.value?.calibration ?? null;
    const rows = analysis ? this.modesOf(analysis) : [];
    const chosen = rows.find((row) => row.family === this.chosen.family && row.mode.mode === this.chosen.mode) ?? rows[0];
    const plotted: PlottedMode[] = chosen?.mode.shape
      ? [{ mode: chosen.mode.mode, hz: chosen.mode.hz, nodes_mm: chosen.mode.nodal_lines_mm ?? [], shape: chosen.mode.shape, name: `${headingOf(chosen.family)} ${chosen.mode.mode}` }]
      : [];
    return html`<div class="actions">
        <button @click=${this.run} ?disabled=${state.running} data-testid="solid-run">${analysis && !current ? 'Check this shape on the 3D model again' : 'Check on the 3D model'}</button>
        ${state.running
          ? html`<span role="status">Solving the block of wood in 3D…</span><button @click=${() => this.solid.cancel(this.barId)} data-testid="solid-cancel">Cancel</button>`
          : nothing}
        ${state.problem && state.problem.status !== 'stale' && !state.running ? html`<span class="problem" role="alert">${state.problem.status === 'cancelled' ? 'Stopped.' : state.problem.status === 'unavailable' ? `Not available here: ${state.problem.what}` : state.problem.message}</span>` : nothing}
      </div>
      <p class="muted">
        The line model treats the bar as a line; the 3D model solves
        ${barMaterialFamily(bar) === 'metal' ? 'the bar as the solid block of metal it is' : 'the block of wood with its grain'} (about a second). The difference matters most on deep
        arches and for torsion and side-to-side modes.
      </p>
      ${analysis
        ? html`<p class="muted" data-testid="solid-status">
              ${current ? 'For the shape shown' : 'For an earlier shape: the bar has changed since'}${state.latencyMs !== null ? html`; answered in <span data-testid="solid-time">${formatNumber(state.latencyMs / 1000, 2)}</span> s` : nothing}${state.workerMs !== null ? html`, <span data-testid="solid-worker-time">${formatNumber(state.workerMs / 1000, 2)}</span> s of it solving` : nothing}
              (${analysis.mesh.elements} elements${analysis.material?.assumed.length ? `; assumed: ${analysis.material.assumed.join(', ')}` : ''}).
              ${calibration
                ? html`<span data-testid="solid-calibrated">Material from this bar's ${calibration.steps} measured round${calibration.steps === 1 ? '' : 's'}: E ${formatNumber(calibration.E_GPa, 2)} GPa and G ${formatNumber(calibration.G_GPa, 3)} GPa, the other constants scaled with them.</span>`
                : nothing}
            </p>
            <div class="scroll">
              <table data-testid="solid-modes">
                <thead>
                  <tr><th>Family</th><th class="number">Mode</th><th class="number">Hz</th><th class="number">Ratio</th><th class="number" title="1200·log₂(f line / f 3D): + means the line model is sharp">Line model</th><th>Nodal lines, mm from the left end</th></tr>
                </thead>
                <tbody>
                  ${rows.map(
                    ({ family, mode }) =>
                      html`<tr
                        data-mode=${`${family}-${mode.mode}`}
                        class=${chosen && chosen.family === family && chosen.mode.mode === mode.mode ? 'chosen' : ''}
                        tabindex="0"
                        @click=${() => (this.chosen = { family, mode: mode.mode })}
                        @keydown=${(event: KeyboardEvent) => {
                          if (event.key === 'Enter' || event.key === ' ') this.chosen = { family, mode: mode.mode };
                        }}
                      >
                        <td>${familyNames[family]}</td>
                        <td class="number">${mode.mode}</td>
                        <td class="number">${formatHz(mode.hz)}</td>
                        <td class="number">${formatNumber(mode.ratio, 3)}</td>
                        <td class="number">${mode.line_model_cents === null || mode.line_model_cents === undefined ? '—' : formatCents(mode.line_model_cents)}</td>
                        <td>${(mode.nodal_lines_mm ?? []).map((x) => formatMm(x)).join(', ')}</td>
                      </tr>`,
                  )}
                </tbody>
              </table>
            </div>
            ${analysis.warnings.length ? html`<ul class="problem" data-testid="solid-warnings">${analysis.warnings.map((warning) => html`<li>${warning}</li>`)}</ul>` : html`<p class="muted">No other mode within beating distance of partials 1–3.</p>`}
            ${chosen
              ? html`<h4>${headingOf(chosen.family)} ${chosen.mode.mode}: nodal lines from above, and its shape along the bar</h4>
                  ${this.renderTopView(bar, chosen.family, chosen.mode)}
                  <bw-mode-chart .modes=${plotted} length=${bar.length_mm} quantity=${quantities[chosen.family]}></bw-mode-chart>`
              : nothing}`
        : nothing}`;
  }
}

declare global {
  interface HTMLElementTagNameMap {
    'bw-solid-check': BwSolidCheck;
  }
}
