// The blank and its timber or metal: length and section with units, material values or a preset. Each
// change is sent up as a project edit; a rule the library refuses is shown beside its field.
import { LitElement, html, css, nothing } from 'lit';
import { customElement, property, state } from 'lit/decorators.js';
import { barMaterialFamily, blankFieldRanges, materialPresets, setBarBlank, setBarLot, type BarFile, type BlankRangeField } from '../../src/index.ts';
import { sharedStyles } from '../styles/sharedStyles.ts';
import { sendEdit } from '../events.ts';
import type { ValueCommitDetail } from './bw-number-field.ts';
import './bw-number-field.ts';

type Explicit = { E_GPa: number; G_GPa?: number; poisson?: number; density_kg_m3: number; shear_coefficient?: number; label?: string; pitch_cents_per_c?: number };

/** `<bw-blank-form .blank bar-id>` */
@customElement('bw-blank-form')
export class BwBlankForm extends LitElement {
  static override styles = [
    sharedStyles,
    css`
      :host {
        display: block;
      }
      fieldset {
        border: 1px solid var(--bw-line-soft);
        border-radius: 8px;
        margin: 0 0 0.8rem;
        padding: 0.6rem 0.8rem 0.8rem;
        display: grid;
        grid-template-columns: repeat(auto-fill, minmax(11rem, 1fr));
        gap: 0.6rem 1rem;
      }
      legend {
        font-weight: 700;
        padding: 0 0.3rem;
      }
      .wide {
        grid-column: 1 / -1;
      }
      .select-field {
        display: grid;
        gap: 0.2rem;
      }
      .select-field select {
        width: 100%;
        min-width: 0;
      }
      .note {
        font-size: 0.9rem;
        color: var(--bw-ink-muted);
      }
    `,
  ];

  /** The blank (bar file without undercut). */
  @property({ attribute: false }) blank: BarFile | null = null;
  @property({ attribute: 'bar-id' }) barId = '';
  /** True once rounds are recorded: the present shape no longer follows the blank. */
  @property({ type: Boolean }) measured = false;

  @state() private errors: Record<string, string> = {};

  private apply(next: BarFile, field: string): void {
    const outcome = sendEdit(this, (project) => setBarBlank(project, this.barId, next, new Date().toISOString()));
    const errors = { ...this.errors };
    delete errors[field];
    if (!outcome.ok) errors[outcome.error.field.replace(/^bar\./, '') || field] = outcome.error.rule;
    this.errors = errors;
  }

  private setNumber(path: string, value: number): void {
    const blank = structuredClone(this.blank!);
    const [head, tail] = path.split('.') as [string, string | undefined];
    if (tail === undefined) (blank as unknown as Record<string, unknown>)[head] = value;
    else ((blank as unknown as Record<string, Record<string, unknown>>)[head]!)[tail] = value;
    this.apply(blank, path);
  }

  private field(label: string, unit: string, path: string, value: number | undefined, hint = '') {
    // Every size and material value refuses what no blank can be, with the range in the message.
    const range = (blankFieldRanges as Record<string, readonly [number, number]>)[path as BlankRangeField];
    return html`<bw-number-field
      label=${label}
      unit=${unit}
      name=${path}
      .value=${value ?? null}
      .min=${range ? range[0] : 0}
      .max=${range ? range[1] : null}
      ?exclusive-min=${!range}
      hint=${hint}
      error=${this.errors[path] ?? ''}
      @value-commit=${(event: CustomEvent<ValueCommitDetail>) => this.setNumber(path, event.detail.value)}
    ></bw-number-field>`;
  }

  /** Names the board or batch the bar was cut from (empty: none). */
  private onLot(event: Event): void {
    const value = (event.target as HTMLInputElement).value;
    const outcome = sendEdit(this, (project) => setBarLot(project, this.barId, value, new Date().toISOString()));
    this.errors = { ...this.errors, lot: outcome.ok ? '' : outcome.error.rule };
  }

  private onPreset(event: Event): void {
    const name = (event.target as HTMLSelectElement).value;
    const preset = materialPresets.find((candidate) => candidate.name === name);
    if (!preset || !this.blank) return;
    const material: Explicit = { E_GPa: preset.E_GPa, density_kg_m3: preset.density_kg_m3, poisson: preset.poisson, label: preset.label };
    if (preset.G_GPa !== undefined) material.G_GPa = preset.G_GPa;
    material.pitch_cents_per_c = preset.pitch_cents_per_c;
    this.apply({ ...structuredClone(this.blank), material }, 'material');
  }

  protected override render() {
    const blank = this.blank;
    if (!blank) return nothing;
    const section = blank.section;
    const material = 'preset' in blank.material ? null : (blank.material as Explicit);
    const metal = barMaterialFamily(blank) === 'metal';
    return html`<fieldset>
        <legend>Blank</legend>
        ${this.field('Length', 'mm', 'length_mm', blank.length_mm)}
        ${section.shape === 'rect'
          ? html`${this.field('Width', 'mm', 'section.width_mm', section.width_mm)}${this.field('Thickness', 'mm', 'section.thickness_mm', section.thickness_mm)}`
          : section.shape === 'tube'
            ? html`${this.field('Outer diameter', 'mm', 'section.outer_diameter_mm', section.outer_diameter_mm)}${this.field('Wall', 'mm', 'section.wall_mm', section.wall_mm)}`
            : this.field('Diameter', 'mm', 'section.diameter_mm', section.diameter_mm)}
        ${this.errors['section'] || this.errors['profile_mm'] ? html`<p class="problem wide" role="alert">${this.errors['section'] ?? this.errors['profile_mm']}</p>` : nothing}
        <p class="note wide">${this.measured ? 'Rounds are recorded for this bar, so changing the blank corrects the record only; the present shape stays as measured.' : 'Until the first round is recorded the present shape follows the blank.'}</p>
      </fieldset>
      <fieldset>
        <legend>${metal ? 'Metal' : 'Timber'}</legend>
        <div class="select-field wide">
          <label for="preset">Start from a preset</label>
          <select id="preset" @change=${this.onPreset}>
            <option value="">${material?.label ?? 'Choose a preset…'}</option>
            ${materialPresets.map((preset) => html`<option value=${preset.name}>${preset.label}</option>`)}
          </select>
        </div>
        ${material
          ? html`${this.field(metal ? 'Stiffness (E)' : 'Stiffness along the grain (E)', 'GPa', 'material.E_GPa', material.E_GPa)}
            ${material.G_GPa !== undefined ? this.field('Shear stiffness (G)', 'GPa', 'material.G_GPa', material.G_GPa) : nothing}
            ${this.field('Density', 'kg/m³', 'material.density_kg_m3', material.density_kg_m3)}
            ${this.errors['material'] ? html`<p class="problem wide" role="alert">${this.errors['material']}</p>` : nothing}
            <p class="note wide">${metal ? 'Handbook values: each alloy and temper differs a little, and tuning rounds learn the real values.' : 'A starting guess: each blank differs, and tuning rounds learn the real values.'}</p>`
          : html`<p class="note wide">Uses the preset “${(blank.material as { preset: string }).preset}”.</p>`}
        <div class="select-field wide">
          <label for="lot">Lot (the ${metal ? 'stock' : 'board'} or batch it was cut from)</label>
          <input id="lot" autocomplete="off" .value=${blank.lot ?? ''} @change=${this.onLot} aria-invalid=${this.errors['lot'] ? 'true' : 'false'} />
          ${this.errors['lot'] ? html`<span class="field-error" role="alert">✕ ${this.errors['lot']}</span>` : html`<span class="note">Bars of one lot share their ${metal ? 'metal' : 'wood'}: each finished bar teaches the next.</span>`}
        </div>
      </fieldset>`;
  }
}

declare global {
  interface HTMLElementTagNameMap {
    'bw-blank-form': BwBlankForm;
  }
}
