// Resonators for the keyboard: a closed-bottom tube under each bar, tuned to its fundamental at
// the air temperature of the room where the instrument will be played. Temperature, open end,
// each register's bore and the frame's longest tube are set here; the tube list (the library's
// projectResonatorTubes: lengths, which partials each tube reinforces, warnings of impractical
// tubes with their remedies) is shown, printed on its own page, and downloaded as CSV.
import { LitElement, html, css, nothing } from 'lit';
import { customElement, property, state } from 'lit/decorators.js';
import {
  projectResonatorTubes,
  projectTubeListCsv,
  resonatorBoreRangeMm,
  resonatorFrameRangeMm,
  setResonatorBore,
  setResonatorFrame,
  speedOfSound,
  temperatureDrift,
  updateInstrument,
  type ProjectFile,
  type ProjectTube,
} from '../../src/index.ts';
import { sharedStyles } from '../styles/sharedStyles.ts';
import { sendEdit } from '../events.ts';
import { downloadText } from '../download.ts';
import { formatHz, formatMm, formatNumber, formatRatios, formatWhen } from '../format.ts';
import type { ValueCommitDetail } from './bw-number-field.ts';
import './bw-number-field.ts';

/** Which tube resonance meets a partial, in the trade's words: the tube's f, 3f or 5f. */
function resonanceWords(resonance: number): string {
  return resonance === 1 ? 'f' : `${2 * resonance - 1}f`;
}

/** `<bw-resonator-view .project>` */
@customElement('bw-resonator-view')
export class BwResonatorView extends LitElement {
  static override styles = [
    sharedStyles,
    css`
      :host {
        display: block;
      }
      .settings {
        display: flex;
        flex-wrap: wrap;
        gap: 1rem 2rem;
        align-items: start;
      }
      .select-field {
        display: grid;
        gap: 0.2rem;
      }
      table {
        width: 100%;
      }
      td.length {
        font-size: 1.3rem;
        font-weight: 800;
      }
      .big-temperature {
        font-size: 1.6rem;
        font-weight: 800;
      }
      .warning {
        display: block;
        color: var(--bw-problem-ink);
        font-weight: 700;
      }
      .warning::before {
        content: '⚠ ';
      }
      ul.remedies {
        margin: 0.2rem 0 0;
        padding-left: 1.1rem;
        font-size: 0.9rem;
      }
      tr.warned td {
        background: var(--bw-problem-ground);
      }
      tr.warned:has(+ tr.warning-row) td {
        border-bottom: none;
      }
      .reinforces {
        min-width: 9rem;
      }
      .actions {
        display: flex;
        flex-wrap: wrap;
        gap: 0.5rem;
        align-items: center;
        margin: 0.6rem 0;
      }
      .print-only {
        display: none;
      }
      @media print {
        .screen-only {
          display: none !important;
        }
        .print-only {
          display: block;
        }
        .panel {
          border: none;
          padding: 0;
        }
        .table-wrap {
          overflow: visible;
        }
        table {
          font-size: 10pt;
        }
        th,
        td {
          padding: 0.15rem 0.4rem;
        }
        td.note,
        td.length {
          font-size: 12pt;
        }
        ul.remedies {
          font-size: 9pt;
        }
        tr.warned td {
          background: none;
        }
        h3 {
          font-size: 13pt;
        }
        .big-temperature {
          font-size: 13pt;
        }
      }
    `,
  ];

  @property({ attribute: false }) project: ProjectFile | null = null;
  @state() private errors: Record<string, string> = {};

  private edit(key: string, change: (project: ProjectFile) => ProjectFile): void {
    const outcome = sendEdit(this, change);
    this.errors = { ...this.errors, [key]: outcome.ok ? '' : outcome.error.rule };
  }

  private download(): void {
    const project = this.project;
    if (!project) return;
    const stem = project.name.replace(/[^\p{L}\p{N}]+/gu, '-').replace(/^-|-$/g, '').toLowerCase() || 'project';
    downloadText(`${stem}-resonator-tubes.csv`, projectTubeListCsv(project));
  }

  /** Prints the tube list on its own: A4 portrait (the list is narrow), the settings left out. */
  private print(): void {
    const style = document.createElement('style');
    style.textContent = '@page { size: A4 portrait; margin: 12mm; }';
    document.head.append(style);
    window.addEventListener('afterprint', () => style.remove(), { once: true });
    window.print();
  }

  /** Which of the bar's partials the tube helps: "fundamental", "fundamental + partial 2 (3f)". */
  private renderReinforces(tube: ProjectTube) {
    if (tube.reinforces.length === 0) return html`<span class="muted">none</span>`;
    return html`${tube.reinforces.map((entry, index) => html`${index > 0 ? ' + ' : ''}${entry.partial === 1 ? 'fundamental' : html`<strong>partial ${entry.partial}</strong> (tube's ${resonanceWords(entry.resonance)})`}`)}`;
  }

  private renderRow(tube: ProjectTube) {
    const warned = tube.warnings.length > 0;
    return html`<tr class=${warned ? 'warned' : ''} data-note=${tube.note}>
        <td class="note">${tube.note}</td>
        <td class="number">${formatHz(tube.targetHz)}</td>
        <td class="number">${tube.innerDiameterMm === null ? '–' : formatMm(tube.innerDiameterMm)}</td>
        <td class="number length">${tube.tube ? formatMm(tube.tube.lengthMm) : '–'}</td>
        <td class="number">${tube.tube ? formatMm(tube.tube.endCorrectionMm) : '–'}</td>
        <td>${tube.tube ? tube.tube.harmonicsHz.slice(1).map((hz) => formatHz(hz)).join(', ') : '–'}</td>
        <td class="reinforces" data-testid="reinforces">${tube.missing ? html`<span class="muted">${tube.missing}</span>` : this.renderReinforces(tube)}</td>
      </tr>
      ${tube.warnings.map(
        (warning) => html`<tr class="warned warning-row">
          <td></td>
          <td colspan="6">
            <span class="warning" data-testid="tube-warning" data-kind=${warning.kind}>${tube.note}: ${warning.message}</span>
            <ul class="remedies">
              ${warning.remedies.map((remedy) => html`<li>${remedy}</li>`)}
            </ul>
          </td>
        </tr>`,
      )}`;
  }

  protected override render() {
    const project = this.project;
    if (!project) return nothing;
    const instrument = project.instrument;
    const keyboardRegisters = instrument.registers.filter((register) => register.family === 'keyboard');
    const tubes = projectResonatorTubes(project);
    const warned = tubes.filter((tube) => tube.warnings.length > 0);
    const bore = resonatorBoreRangeMm;
    const frame = resonatorFrameRangeMm;
    return html`<section class="panel screen-only" aria-labelledby="air-heading">
        <h2 id="air-heading">Resonator tubes</h2>
        <p class="muted">Closed at the bottom, open at the top, each tuned to its bar's fundamental at the playing temperature. Every bar's readings in the tuning view are shown at this temperature too.</p>
        <div class="settings">
          <bw-number-field
            label="Playing temperature (air where it will be played)"
            unit="°C"
            name="temperature"
            .value=${instrument.air_temperature_c}
            .min=${-30}
            .max=${60}
            step="0.5"
            error=${this.errors['temperature'] ?? ''}
            @value-commit=${(event: CustomEvent<ValueCommitDetail>) => this.edit('temperature', (p) => updateInstrument(p, { air_temperature_c: event.detail.value }))}
          ></bw-number-field>
          <div class="select-field">
            <label for="end">Open end</label>
            <select id="end" @change=${(event: Event) => this.edit('end', (p) => updateInstrument(p, { resonator_end: (event.target as HTMLSelectElement).value as 'unflanged' | 'flanged' }))}>
              <option value="unflanged" ?selected=${instrument.resonator_end === 'unflanged'}>Plain tube end (unflanged)</option>
              <option value="flanged" ?selected=${instrument.resonator_end === 'flanged'}>End set in a board (flanged)</option>
            </select>
          </div>
          <bw-number-field
            label="Longest tube the frame takes"
            unit="mm"
            name="frame"
            .value=${instrument.resonator_max_length_mm ?? null}
            .min=${frame.min}
            .max=${frame.max}
            step="10"
            optional
            hint="Leave empty for no limit."
            error=${this.errors['frame'] ?? ''}
            @value-commit=${(event: CustomEvent<ValueCommitDetail>) => this.edit('frame', (p) => setResonatorFrame(p, event.detail.value))}
            @value-clear=${() => this.edit('frame', (p) => setResonatorFrame(p, null))}
          ></bw-number-field>
          ${keyboardRegisters.map(
            (register) => html`<bw-number-field
              label=${`Inner diameter, ${register.label}`}
              unit="mm"
              name=${`diameter-${register.id}`}
              .value=${register.resonator_inner_diameter_mm ?? null}
              .min=${bore.min}
              .max=${bore.max}
              error=${this.errors[`diameter-${register.id}`] ?? ''}
              @value-commit=${(event: CustomEvent<ValueCommitDetail>) => this.edit(`diameter-${register.id}`, (p) => setResonatorBore(p, register.id, event.detail.value))}
            ></bw-number-field>`,
          )}
        </div>
        ${this.renderDrift(project)}
      </section>
      <section class="panel" style="margin-top: 1rem" aria-labelledby="tubes-heading">
        <h3 id="tubes-heading">Tube lengths at <span class="big-temperature">${instrument.air_temperature_c} °C</span></h3>
        <p class="print-only">${project.name} · ${instrument.resonator_end === 'flanged' ? 'flanged' : 'plain'} open ends · A4 = ${instrument.a4_hz} Hz · printed ${formatWhen(new Date().toISOString())}. Length from the closed bottom (inside face of the stopper) to the open end; cut long, then trim while listening.</p>
        <div class="actions screen-only">
          <button class="primary" @click=${() => this.download()} ?disabled=${tubes.every((tube) => !tube.tube)} data-testid="tube-csv">Download the tube list (CSV)</button>
          <button @click=${() => this.print()} ?disabled=${tubes.length === 0} data-testid="tube-print">Print the tube list</button>
          <span role="status" data-testid="tube-summary">${warned.length === 0 ? `${tubes.length} tubes, none impractical.` : html`<strong class="warning">${warned.length} of ${tubes.length} tubes impractical: ${warned.map((tube) => tube.note).join(', ')}</strong>`}</span>
        </div>
        <div class="table-wrap">
          <table data-testid="resonators">
            <thead>
              <tr>
                <th scope="col">Note</th>
                <th scope="col" class="number">Fundamental (Hz)</th>
                <th scope="col" class="number">Inner ⌀ (mm)</th>
                <th scope="col" class="number">Tube length (mm)</th>
                <th scope="col" class="number">End correction (mm)</th>
                <th scope="col">Tube also sounds (Hz)</th>
                <th scope="col">Helps the bar's</th>
              </tr>
            </thead>
            <tbody>
              ${tubes.map((tube) => this.renderRow(tube))}
            </tbody>
          </table>
        </div>
        <p class="muted">A tube closed at the bottom sounds only f, 3f, 5f…: its 3f meets the second partial of a bar tuned 1 : 3, while the 4× and 10× partials of a 1 : 4 : 10 bar get no help from it. Target ratios here: ${keyboardRegisters.map((register) => `${register.label} ${formatRatios(register.ratios)}`).join(' · ')}. Speed of sound at ${instrument.air_temperature_c} °C in dry air: ${formatNumber(this.speed(), 1)} m/s.</p>
      </section>`;
  }

  /** How far bar and tube drift apart per °C away from the playing temperature. */
  private renderDrift(project: ProjectFile) {
    const drift = temperatureDrift(project);
    const signed = (value: number) => `${value >= 0 ? '+' : '−'}${formatNumber(Math.abs(value), 1)}`;
    return html`<div class="drift" style="margin-top: 1rem" data-testid="temperature-drift">
      <h3>Bar and tube apart per °C</h3>
      <p>
        Away from ${drift.playingC} °C, a tube moves <strong>${signed(drift.tubeCentsPerC)} cents per °C</strong> (warmer air, sharper tube) and the bars
        <strong>${signed(drift.instrument.barCentsPerC)} cents per °C</strong> (${drift.instrument.from === 'default' ? 'the usual figure for wood, common practice: a bar struck unchanged at two temperatures learns its own' : drift.instrument.source}): they drift apart by
        <strong data-testid="drift-apart">${formatNumber(Math.abs(drift.instrument.apartCentsPerC), 1)} cents per °C</strong>, so ${formatNumber(Math.abs(5 * drift.instrument.apartCentsPerC), 0)} cents at 5 °C off.
      </p>
      ${drift.learnt.length > 0
        ? html`<ul data-testid="drift-learnt">
            ${drift.learnt.map((bar) => html`<li>${bar.note}: the bar moves ${signed(bar.barCentsPerC)} cents per °C (learnt from its rounds), ${formatNumber(Math.abs(bar.apartCentsPerC), 1)} cents per °C from its tube.</li>`)}
          </ul>`
        : nothing}
    </div>`;
  }

  private speed(): number | null {
    const project = this.project;
    if (!project) return null;
    try {
      return speedOfSound({ temperatureC: project.instrument.air_temperature_c });
    } catch {
      return null;
    }
  }
}

declare global {
  interface HTMLElementTagNameMap {
    'bw-resonator-view': BwResonatorView;
  }
}
