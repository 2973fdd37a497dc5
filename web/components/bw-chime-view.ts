// The chime set page: the maker picks the stock (a tube or rod size, the metal), the notes and
// which pitch is tuned; the set is kept in the project (its `chime_set`, at the project's A4), planned
// in the solver worker (the library's chime-set rules and planChimeSet) and shown with the cut list
// to download or print, beside the project's chime pieces (the same length computation). Rules
// broken are written beside the field they concern.
import { LitElement, html, css, nothing } from 'lit';
import { customElement, property, state } from 'lit/decorators.js';
import { addMissingChimePieces, chimeSetPieceRows, materialPresets, projectChimeSet, setChimeSet, stableHash, type ChimeSetFile, type ProjectFile } from '../../src/index.ts';
import { sendEdit } from '../events.ts';
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
  /** A preset name, or '' for the set's own values (E, density) as stored. */
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

/** The form showing a stored chime set. */
function formOf(set: ChimeSetFile): ChimeForm {
  const section = set.stock.section;
  const plug = set.end_masses.find((mass) => mass.end === 'top');
  return {
    name: set.name,
    shape: section.shape,
    outer_diameter_mm: section.shape === 'tube' ? section.outer_diameter_mm : 25.4,
    wall_mm: section.shape === 'tube' ? section.wall_mm : 1.6,
    diameter_mm: section.shape === 'round' ? section.diameter_mm : 16,
    material: 'preset' in set.stock.material ? set.stock.material.preset : '',
    notes: set.notes.join(' '),
    a4_hz: set.a4_hz,
    tune: set.tune,
    bar_length_mm: set.stock.bar_length_mm ?? 0,
    saw_kerf_mm: set.saw_kerf_mm,
    plug_g: plug?.mass_g ?? 0,
    plug_length_mm: plug?.length_mm ?? 12,
  };
}

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

  @property({ attribute: false }) project: ProjectFile | null = null;

  @state() private form: ChimeForm | null = null;
  /** The rule the newest edit broke (the form keeps what was typed; the project keeps the last good set). */
  @state() private editProblem: { field: string; rule: string } | null = null;
  @state() private piecesMessage = '';
  /** The set as stored in the project, planned as it changes (the newest set follows the one being computed). */
  private readonly solve = new TaskController<SolverJobs['chimeSet']['result']>(this, { policy: 'latest' });
  private shownSet = '';

  protected override willUpdate(): void {
    const project = this.project;
    if (!project) return;
    const set = projectChimeSet(project);
    const key = stableHash({ id: project.id, set });
    if (key === this.shownSet) return;
    this.shownSet = key;
    // The project's set changed (an edit saved, a reload, another project opened): show it and plan it.
    if (!this.editProblem) this.form = formOf(set);
    this.solve.run({ subject: 'chime-set', key: stableHash(set) }, workerJob(solver, 'chimeSet', { file: set }));
  }

  /** The chime-set file value the form describes over the stored set (validated by the library when stored). */
  private fileValue(form: ChimeForm): unknown {
    const stored = projectChimeSet(this.project!);
    const f = form;
    const otherMasses = stored.end_masses.filter((mass) => mass.end !== 'top');
    return {
      ...stored,
      name: f.name,
      notes: f.notes.split(/[\s,;]+/).filter((n) => n.length > 0),
      offsets_cents: Object.fromEntries(Object.entries(stored.offsets_cents).filter(([note]) => f.notes.split(/[\s,;]+/).includes(note))),
      tune: f.tune,
      stock: {
        section: f.shape === 'tube' ? { shape: 'tube', outer_diameter_mm: f.outer_diameter_mm, wall_mm: f.wall_mm } : { shape: 'round', diameter_mm: f.diameter_mm },
        material: f.material ? { preset: f.material } : stored.stock.material,
        ...(f.bar_length_mm > 0 ? { bar_length_mm: f.bar_length_mm } : {}),
      },
      end_masses: f.plug_g > 0 ? [{ end: 'top', mass_g: f.plug_g, length_mm: f.plug_length_mm }, ...otherMasses] : otherMasses,
      saw_kerf_mm: f.saw_kerf_mm,
    };
  }

  /** Stores the form's set in the project; a broken rule is shown beside its field and nothing is stored. */
  private store(form: ChimeForm): void {
    this.form = form;
    const outcome = sendEdit(this, (project) => setChimeSet(project, this.fileValue(form)));
    this.editProblem = outcome.ok ? null : { field: outcome.error.field, rule: outcome.error.rule };
  }

  private setField<K extends keyof ChimeForm>(key: K, value: ChimeForm[K]): void {
    if (!this.form) return;
    this.store({ ...this.form, [key]: value });
  }

  private pickStock(id: string): void {
    const choice = chimeStockChoices.find((c) => c.id === id);
    if (!choice || !this.form) return;
    const section = choice.section;
    this.store(section.shape === 'tube' ? { ...this.form, shape: 'tube', outer_diameter_mm: section.outer_diameter_mm, wall_mm: section.wall_mm } : { ...this.form, shape: 'round', diameter_mm: section.diameter_mm });
  }

  private addPieces(): void {
    let added: string[] = [];
    const outcome = sendEdit(this, (project) => {
      const result = addMissingChimePieces(project, new Date().toISOString());
      added = result.added;
      return result.project;
    });
    this.piecesMessage = outcome.ok ? (added.length > 0 ? `Added ${added.join(', ')} to the project: tune them in the Tuning tab.` : 'Every note of the set is already a piece.') : outcome.error.message;
  }

  /** The library's rule for a form field, when the newest edit (or the plan of the stored set) broke one. */
  private ruleFor(key: keyof ChimeForm | 'other'): string {
    const problem = this.editProblem ?? (() => {
      const planned = this.solve.state('chime-set').problem;
      return planned?.status === 'input-error' ? { field: planned.field, rule: planned.rule } : null;
    })();
    if (!problem) return '';
    return formFieldOf(problem.field) === key ? `${labels[key as keyof ChimeForm] ?? problem.field}: ${problem.rule}` : '';
  }

  private number(key: keyof ChimeForm, unit: string, min: number, max: number, exclusiveMin = true, hint = '') {
    return html`<bw-number-field label=${labels[key]} unit=${unit} name=${key} .value=${this.form![key] as number} .min=${min} .max=${max} ?exclusive-min=${exclusiveMin} hint=${hint} error=${this.ruleFor(key)}
      @value-commit=${(event: CustomEvent<ValueCommitDetail>) => this.setField(key, event.detail.value as never)}></bw-number-field>`;
  }

  private download(): void {
    const value = this.solve.state('chime-set').value;
    if (!value) return;
    downloadText(`${fileStem(value.plan.name, 'chimes')}-chime-cut-list.csv`, value.csv);
  }

  protected override render() {
    const f = this.form;
    const project = this.project;
    if (!f || !project) return html`<p role="status">Opening the project…</p>`;
    const state = this.solve.state('chime-set');
    const problem = state.problem;
    const stale = problem !== null || this.editProblem !== null;
    const stored = projectChimeSet(project).stock.material;
    const rows = state.value ? chimeSetPieceRows(project, state.value.plan.chimes) : [];
    const hasChimeRegister = project.instrument.registers.some((register) => register.family === 'chime');
    const metals = materialPresets.filter((preset) => preset.kind === 'metal');
    const otherRule = this.ruleFor('other');
    return html`<section class="panel screen-only" aria-labelledby="chime-heading">
        <h2 id="chime-heading">Chime set</h2>
        <p class="muted">Tubes or rods hung from one end: the length that sounds each note, where to drill the hanging hole, the strike note and the overtones. The set is kept with the project; changes are computed as you go.</p>
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
              ${'preset' in stored ? nothing : html`<option value="" ?selected=${f.material === ''}>As stored: E ${stored.E_GPa} GPa, ${stored.density_kg_m3} kg/m³</option>`}
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
          <div class="field"><span>${labels.a4_hz}</span><strong data-testid="chime-a4">${f.a4_hz} Hz</strong><span class="muted">the project's (change it in the project settings)</span></div>
          <div class="field">
            <label for="chime-tune">${labels.tune}</label>
            <select id="chime-tune" @change=${(e: Event) => this.setField('tune', (e.target as HTMLSelectElement).value as ChimeForm['tune'])}>
              <option value="fundamental" ?selected=${f.tune === 'fundamental'}>Fundamental (wind chimes)</option>
              <option value="strike" ?selected=${f.tune === 'strike'}>Strike note (tubular bells)</option>
            </select>
          </div>
          ${this.number('bar_length_mm', 'mm', 0, 20000, false, 'for the cutting plan; 0 for none')}
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
        ${state.value ? html`<bw-chime-results .plan=${state.value.plan} .pieces=${rows}></bw-chime-results>` : html`<p role="status">Computing the set…</p>`}
        <div class="actions screen-only">
          ${hasChimeRegister
            ? html`<button ?disabled=${stale || !rows.some((row) => row.piece === null)} data-testid="add-chime-pieces" @click=${() => this.addPieces()}>Add the notes without a piece to the project</button>`
            : html`<p class="muted">The project has no chime register: the set is a cut list only.</p>`}
          <span role="status">${this.piecesMessage}</span>
        </div>
      </section>`;
  }
}

declare global {
  interface HTMLElementTagNameMap {
    'bw-chime-view': BwChimeView;
  }
}
