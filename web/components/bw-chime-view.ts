// The chime set page: the maker picks the stock (a tube or rod size, the metal), the notes, A4
// and which pitch is tuned; the set is planned in the solver worker (the library's chime-set
// rules and planChimeSet) and shown with the cut list to download or print. Rules broken are
// written beside the field they concern.
import { LitElement, html, css, nothing } from 'lit';
import { customElement, state } from 'lit/decorators.js';
import { materialPresets, stableHash } from '../../src/index.ts';
import { TaskController, workerJob } from '../controllers/TaskController.ts';
import { solver } from '../worker/SolverClient.ts';
import type { SolverJobs } from '../worker/solverProtocol.ts';
import { sharedStyles } from '../styles/sharedStyles.ts';
import { chimeStockChoices } from '../chimeStockChoices.ts';
import { downloadText, fileStem } from '../download.ts';
import type { ValueCommitDetail } from './bw-number-field.ts';
import './bw-number-field.ts';
import './bw-chime-results.ts';

/** The form's values (mm, g, Hz). */
interface ChimeForm {
  name: string;
  shape: 'tube' | 'round';
  outer_diameter_mm: number;
  wall_mm: number;
  diameter_mm: number;
  material: string;
  notes: string;
  a4_hz: number;
  tune: 'fundamental' | 'strike';
  bar_length_mm: number;
  saw_kerf_mm: number;
  plug_g: number;
  plug_length_mm: number;
}

/** Starting values: the demo workshop's aluminium tubes. */
const initialForm: ChimeForm = {
  name: 'Demo workshop chime tubes',
  shape: 'tube',
  outer_diameter_mm: 25.4,
  wall_mm: 1.6,
  diameter_mm: 16,
  material: 'aluminium-6061-t6',
  notes: 'C5 D5 E5 G5 A5 C6',
  a4_hz: 442,
  tune: 'fundamental',
  bar_length_mm: 2000,
  saw_kerf_mm: 2,
  plug_g: 0,
  plug_length_mm: 12,
};

/** Which form field a chime-set rule concerns (the file's field name → the form's). */
function formFieldOf(field: string): keyof ChimeForm | 'other' {
  if (field.startsWith('notes') || field.startsWith('offsets')) return 'notes';
  if (field === 'a4_hz') return 'a4_hz';
  if (field.includes('outer_diameter_mm')) return 'outer_diameter_mm';
  if (field.includes('wall_mm')) return 'wall_mm';
  if (field.includes('stock.section.diameter_mm')) return 'diameter_mm';
  if (field.startsWith('stock.material')) return 'material';
  if (field.includes('bar_length_mm')) return 'bar_length_mm';
  if (field === 'saw_kerf_mm') return 'saw_kerf_mm';
  if (field.startsWith('end_masses')) return field.endsWith('length_mm') ? 'plug_length_mm' : 'plug_g';
  return 'other';
}

const labels: Record<keyof ChimeForm, string> = {
  name: 'Set name',
  shape: 'Stock shape',
  outer_diameter_mm: 'Outer diameter',
  wall_mm: 'Wall',
  diameter_mm: 'Rod diameter',
  material: 'Metal',
  notes: 'Notes',
  a4_hz: 'A4 reference',
  tune: 'Tuned on',
  bar_length_mm: 'Stock length',
  saw_kerf_mm: 'Saw cut width',
  plug_g: 'Top plug mass',
  plug_length_mm: 'Plug length',
};

/** `<bw-chime-view>` */
@customElement('bw-chime-view')
export class BwChimeView extends LitElement {
  static override styles = [
    sharedStyles,
    css`
      :host {
        display: block;
      }
      .form {
        display: flex;
        flex-wrap: wrap;
        gap: 0.8rem 1.4rem;
        align-items: start;
      }
      .field {
        display: grid;
        gap: 0.2rem;
      }
      .field input[type='text'] {
        width: 18rem;
        max-width: 100%;
      }
      .field-error {
        color: var(--bw-problem-ink);
        font-size: 0.9rem;
        margin: 0;
        max-width: 22rem;
      }
      .actions {
        display: flex;
        flex-wrap: wrap;
        gap: 0.5rem;
        margin: 0.8rem 0;
      }
      .panel + .panel {
        margin-top: 1rem;
      }
      section[data-stale='true'] {
        opacity: 0.55;
      }
      @media print {
        section[data-stale='true'] {
          opacity: 1;
        }
        .screen-only {
          display: none !important;
        }
        .panel {
          border: none;
          padding: 0;
        }
      }
    `,
  ];

  @state() private form: ChimeForm = { ...initialForm };
  /** The set as the form describes it, recomputed as it changes (the newest form follows the one being computed). */
  private readonly solve = new TaskController<SolverJobs['chimeSet']['result']>(this, { policy: 'latest' });

  override connectedCallback(): void {
    super.connectedCallback();
    this.recompute();
  }

  /** The chime-set file value the form describes (validated in the worker by the library). */
  private fileValue(): unknown {
    const f = this.form;
    return {
      format: 'barwright.chime-set',
      version: 1,
      name: f.name,
      a4_hz: f.a4_hz,
      notes: f.notes.split(/[\s,;]+/).filter((n) => n.length > 0),
      tune: f.tune,
      stock: {
        section: f.shape === 'tube' ? { shape: 'tube', outer_diameter_mm: f.outer_diameter_mm, wall_mm: f.wall_mm } : { shape: 'round', diameter_mm: f.diameter_mm },
        material: { preset: f.material },
        bar_length_mm: f.bar_length_mm,
      },
      end_masses: f.plug_g > 0 ? [{ end: 'top', mass_g: f.plug_g, length_mm: f.plug_length_mm }] : [],
      saw_kerf_mm: f.saw_kerf_mm,
    };
  }

  private recompute(): void {
    const file = this.fileValue();
    this.solve.run({ subject: 'chime-set', key: stableHash(file) }, workerJob(solver, 'chimeSet', { file }));
  }

  private setField<K extends keyof ChimeForm>(key: K, value: ChimeForm[K]): void {
    this.form = { ...this.form, [key]: value };
    this.recompute();
  }

  private pickStock(id: string): void {
    const choice = chimeStockChoices.find((c) => c.id === id);
    if (!choice) return;
    const section = choice.section;
    this.form = section.shape === 'tube' ? { ...this.form, shape: 'tube', outer_diameter_mm: section.outer_diameter_mm, wall_mm: section.wall_mm } : { ...this.form, shape: 'round', diameter_mm: section.diameter_mm };
    this.recompute();
  }

  /** The library's rule for a form field, when the newest input broke one. */
  private ruleFor(key: keyof ChimeForm | 'other'): string {
    const problem = this.solve.state('chime-set').problem;
    if (!problem || problem.status !== 'input-error') return '';
    return formFieldOf(problem.field) === key ? `${labels[key as keyof ChimeForm] ?? problem.field}: ${problem.rule}` : '';
  }

  private number(key: keyof ChimeForm, unit: string, min: number, max: number, exclusiveMin = true, hint = '') {
    return html`<bw-number-field label=${labels[key]} unit=${unit} name=${key} .value=${this.form[key] as number} .min=${min} .max=${max} ?exclusive-min=${exclusiveMin} hint=${hint} error=${this.ruleFor(key)}
      @value-commit=${(event: CustomEvent<ValueCommitDetail>) => this.setField(key, event.detail.value as never)}></bw-number-field>`;
  }

  private download(): void {
    const value = this.solve.state('chime-set').value;
    if (!value) return;
    downloadText(`${fileStem(value.plan.name, 'chimes')}-chime-cut-list.csv`, value.csv);
  }

  protected override render() {
    const f = this.form;
    const state = this.solve.state('chime-set');
    const problem = state.problem;
    const stale = problem !== null;
    const metals = materialPresets.filter((preset) => preset.kind === 'metal');
    const otherRule = this.ruleFor('other');
    return html`<section class="panel screen-only" aria-labelledby="chime-heading">
        <h2 id="chime-heading">Chime set</h2>
        <p class="muted">Tubes or rods hung from one end: the length that sounds each note, where to drill the hanging hole, the strike note and the overtones. Changes are computed as you go.</p>
        <div class="form">
          <div class="field">
            <label for="chime-name">${labels.name}</label>
            <input id="chime-name" type="text" .value=${f.name} @change=${(e: Event) => this.setField('name', (e.target as HTMLInputElement).value)} />
          </div>
          <div class="field">
            <label for="chime-stock">Stock size</label>
            <select id="chime-stock" @change=${(e: Event) => this.pickStock((e.target as HTMLSelectElement).value)}>
              <option value="">Choose a common size…</option>
              ${chimeStockChoices.map((choice) => html`<option value=${choice.id}>${choice.label}</option>`)}
            </select>
          </div>
          <div class="field">
            <label for="chime-shape">${labels.shape}</label>
            <select id="chime-shape" @change=${(e: Event) => this.setField('shape', (e.target as HTMLSelectElement).value as ChimeForm['shape'])}>
              <option value="tube" ?selected=${f.shape === 'tube'}>Tube</option>
              <option value="round" ?selected=${f.shape === 'round'}>Solid rod</option>
            </select>
          </div>
          ${f.shape === 'tube' ? html`${this.number('outer_diameter_mm', 'mm', 0, 300)}${this.number('wall_mm', 'mm', 0, 50)}` : this.number('diameter_mm', 'mm', 0, 300)}
          <div class="field">
            <label for="chime-material">${labels.material}</label>
            <select id="chime-material" @change=${(e: Event) => this.setField('material', (e.target as HTMLSelectElement).value)}>
              ${metals.map((preset) => html`<option value=${preset.name} ?selected=${preset.name === f.material}>${preset.label}</option>`)}
            </select>
            ${this.ruleFor('material') ? html`<p class="field-error" role="alert">✕ ${this.ruleFor('material')}</p>` : nothing}
          </div>
          <div class="field">
            <label for="chime-notes">${labels.notes} (e.g. C5 D5 E5 G5)</label>
            <input id="chime-notes" type="text" autocomplete="off" .value=${f.notes} aria-invalid=${this.ruleFor('notes') ? 'true' : 'false'}
              @change=${(e: Event) => this.setField('notes', (e.target as HTMLInputElement).value)} @keydown=${(e: KeyboardEvent) => e.key === 'Enter' && this.setField('notes', (e.target as HTMLInputElement).value)} />
            ${this.ruleFor('notes') ? html`<p class="field-error" role="alert" data-testid="notes-error">✕ ${this.ruleFor('notes')}</p>` : nothing}
          </div>
          ${this.number('a4_hz', 'Hz', 300, 600, false)}
          <div class="field">
            <label for="chime-tune">${labels.tune}</label>
            <select id="chime-tune" @change=${(e: Event) => this.setField('tune', (e.target as HTMLSelectElement).value as ChimeForm['tune'])}>
              <option value="fundamental" ?selected=${f.tune === 'fundamental'}>Fundamental (wind chimes)</option>
              <option value="strike" ?selected=${f.tune === 'strike'}>Strike note (tubular bells)</option>
            </select>
          </div>
          ${this.number('bar_length_mm', 'mm', 0, 20000, true, 'for the cutting plan')}
          ${this.number('saw_kerf_mm', 'mm', 0, 20, false)}
          ${this.number('plug_g', 'g', 0, 5000, false, '0 for an open top')}
          ${f.plug_g > 0 ? this.number('plug_length_mm', 'mm', 0, 500) : nothing}
        </div>
        ${otherRule ? html`<p class="problem" role="alert">${otherRule}</p>` : nothing}
        ${problem && problem.status !== 'input-error' ? html`<p class="problem" role="alert">${problem.status === 'failed' ? problem.message : problem.status === 'unavailable' ? `${problem.what} is not available` : 'Cancelled'}</p>` : nothing}
        <div class="actions">
          <button class="primary" ?disabled=${!state.value || stale} @click=${() => this.download()} data-testid="chime-download">Download the cut list (CSV)</button>
          <button ?disabled=${!state.value || stale} @click=${() => window.print()}>Print the cut list</button>
          <span class="muted" role="status">${state.running ? 'Computing…' : stale ? 'Showing the last set that could be computed: fix the field marked above.' : ''}</span>
        </div>
      </section>
      <section class="panel" aria-label="Chime set results" data-stale=${stale ? 'true' : 'false'}>
        ${state.value ? html`<bw-chime-results .plan=${state.value.plan}></bw-chime-results>` : html`<p role="status">Computing the set…</p>`}
      </section>`;
  }
}

declare global {
  interface HTMLElementTagNameMap {
    'bw-chime-view': BwChimeView;
  }
}
