// Resonators for the keyboard: a closed-bottom tube under each bar, tuned to its fundamental at
// the air temperature of the room where the instrument will be played. Temperature and the
// open-end type are set here; lengths come from the library's closed-tube sizing.
import { LitElement, html, css, nothing } from 'lit';
import { customElement, property, state } from 'lit/decorators.js';
import { barTargetHz, closedTubeResonator, isInputError, registerOf, speedOfSound, updateInstrument, updateRegister, type ProjectFile } from '../../src/index.ts';
import { sharedStyles } from '../styles/sharedStyles.ts';
import { sendEdit } from '../events.ts';
import { formatHz, formatMm, formatNumber, formatRatios } from '../format.ts';
import type { ValueCommitDetail } from './bw-number-field.ts';
import './bw-number-field.ts';

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
      td.note {
        font-weight: 800;
        font-size: 1.15rem;
      }
      .big-temperature {
        font-size: 1.6rem;
        font-weight: 800;
      }
    `,
  ];

  @property({ attribute: false }) project: ProjectFile | null = null;
  @state() private errors: Record<string, string> = {};

  private edit(key: string, change: (project: ProjectFile) => ProjectFile): void {
    const outcome = sendEdit(this, change);
    this.errors = { ...this.errors, [key]: outcome.ok ? '' : outcome.error.rule };
  }

  protected override render() {
    const project = this.project;
    if (!project) return nothing;
    const instrument = project.instrument;
    const keyboardBars = project.bars.filter((bar) => registerOf(project, bar).family === 'keyboard');
    const keyboardRegisters = instrument.registers.filter((register) => register.family === 'keyboard');
    return html`<section class="panel" aria-labelledby="air-heading">
        <h2 id="air-heading">Resonator tubes</h2>
        <p class="muted">Closed at the bottom, open at the top, each tuned to its bar's fundamental. Tubes sound about 3 cents flat for each °C colder than the temperature set here.</p>
        <div class="settings">
          <bw-number-field
            label="Air temperature where it will be played"
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
          ${keyboardRegisters.map(
            (register) => html`<bw-number-field
              label=${`Inner diameter, ${register.label}`}
              unit="mm"
              name=${`diameter-${register.id}`}
              .value=${register.resonator_inner_diameter_mm ?? null}
              .min=${0}
              exclusive-min
              error=${this.errors[`diameter-${register.id}`] ?? ''}
              @value-commit=${(event: CustomEvent<ValueCommitDetail>) => this.edit(`diameter-${register.id}`, (p) => updateRegister(p, register.id, { resonator_inner_diameter_mm: event.detail.value }))}
            ></bw-number-field>`,
          )}
        </div>
      </section>
      <section class="panel" style="margin-top: 1rem" aria-labelledby="tubes-heading">
        <h3 id="tubes-heading">Tube lengths at <span class="big-temperature">${instrument.air_temperature_c} °C</span></h3>
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
                <th scope="col">Bar ratios</th>
              </tr>
            </thead>
            <tbody>
              ${keyboardBars.map((bar) => {
                const register = registerOf(project, bar);
                const fundamental = barTargetHz(project, bar)[0]!;
                const diameter = register.resonator_inner_diameter_mm;
                if (!diameter) return html`<tr><td class="note">${bar.note}</td><td class="number">${formatHz(fundamental)}</td><td colspan="5" class="muted">Set the register's inner diameter.</td></tr>`;
                try {
                  const tube = closedTubeResonator({ hz: fundamental, innerDiameterMm: diameter, temperatureC: instrument.air_temperature_c, end: instrument.resonator_end });
                  const reinforcesSecond = register.ratios[1] === 3;
                  return html`<tr>
                    <td class="note">${bar.note}</td>
                    <td class="number">${formatHz(fundamental)}</td>
                    <td class="number">${formatMm(diameter)}</td>
                    <td class="number length">${formatMm(tube.length_mm)}</td>
                    <td class="number">${formatMm(tube.end_correction_mm)}</td>
                    <td>${tube.harmonics_hz.slice(1).map((hz) => formatHz(hz)).join(', ')}</td>
                    <td style="white-space: nowrap">${formatRatios(register.ratios)}${reinforcesSecond ? ' · tube helps partial 2' : ''}</td>
                  </tr>`;
                } catch (error) {
                  return html`<tr><td class="note">${bar.note}</td><td colspan="6" class="problem">${isInputError(error) ? error.message : String(error)}</td></tr>`;
                }
              })}
            </tbody>
          </table>
        </div>
        <p class="muted">Speed of sound at ${instrument.air_temperature_c} °C in dry air: ${formatNumber(this.speed(), 1)} m/s.</p>
      </section>`;
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
