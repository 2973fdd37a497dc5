// The workshop: the tools this project's bars are cut with and the shop's own rules (thinnest
// point, uncut ends, cord-hole drill). The designer's limits follow from them; the panel beside
// the tools says which tool sets each limit (the library's workshopLimitLines). Kept in the
// project file's `workshop` section, so every plan of the project — one bar in the shape view or
// the whole keyboard — is made for it; downloadable as a workshop file for `barwright plan
// --workshop`, and read back from one.
import { LitElement, html, css, nothing } from 'lit';
import { customElement, property, state } from 'lit/decorators.js';
import {
  InputError,
  newWorkshopTool,
  parseWorkshopFile,
  projectWorkshop,
  setProjectWorkshop,
  withWorkshopTool,
  withoutWorkshopTool,
  workshopFileFromProject,
  workshopLimitLines,
  workshopToolKinds,
  type ProjectFile,
  type Workshop,
  type WorkshopTool,
  type WorkshopToolKind,
} from '../../src/index.ts';
import { sharedStyles } from '../styles/sharedStyles.ts';
import { sendEdit } from '../events.ts';
import { downloadText, fileStem } from '../download.ts';
import type { ValueCommitDetail } from './bw-number-field.ts';
import './bw-number-field.ts';
import './bw-cautions.ts';

/** The tool kinds in the maker's words. */
const kindNames: Record<WorkshopToolKind, string> = {
  'band-saw': 'Band saw (roughs the arch out)',
  drum: 'Sanding drum (bar underside-down)',
  spindle: 'Spindle sander (bar on its side)',
  'router-template': 'Router with a template',
  'grinding-wheel': 'Grinding wheel',
};

/** `<bw-workshop-view .project>` */
@customElement('bw-workshop-view')
export class BwWorkshopView extends LitElement {
  static override styles = [
    sharedStyles,
    css`
      :host {
        display: block;
      }
      .layout {
        display: grid;
        grid-template-columns: minmax(0, 3fr) minmax(16rem, 2fr);
        gap: 1rem;
        align-items: start;
      }
      @media (max-width: 900px) {
        .layout {
          grid-template-columns: minmax(0, 1fr);
        }
      }
      .tool {
        display: flex;
        flex-wrap: wrap;
        gap: 0.6rem 1rem;
        align-items: end;
        padding: 0.6rem 0;
        border-bottom: 1px solid var(--bw-line);
      }
      .text-field {
        display: grid;
        gap: 0.2rem;
      }
      .text-field input {
        width: 20rem;
        max-width: 100%;
      }
      .row {
        display: flex;
        flex-wrap: wrap;
        gap: 0.6rem 1.5rem;
        align-items: end;
        margin: 0.6rem 0;
      }
      dl.limits {
        margin: 0;
      }
      dl.limits dt {
        font-weight: 700;
        margin-top: 0.6rem;
      }
      dl.limits dd {
        margin: 0.1rem 0 0;
      }
      .value {
        font-size: 1.2rem;
        font-weight: 800;
        font-variant-numeric: tabular-nums;
      }
      .set-by {
        display: block;
        color: var(--bw-ink-muted);
        font-size: 0.9rem;
      }
      .problem {
        color: var(--bw-problem-ink);
        font-weight: 700;
      }
    `,
  ];

  @property({ attribute: false }) project: ProjectFile | null = null;
  @state() private errors: Record<string, string> = {};
  @state() private kindToAdd: WorkshopToolKind = 'drum';

  /** Sends the project with `change` applied to its workshop; the rule broken shows beside `key`. */
  private edit(key: string, change: (workshop: Workshop) => Workshop | null): void {
    const outcome = sendEdit(this, (project) => setProjectWorkshop(project, change(projectWorkshop(project))));
    this.errors = { ...this.errors, [key]: outcome.ok ? '' : outcome.error.rule };
  }

  private editTool(index: number, change: Partial<WorkshopTool>): void {
    this.edit(`tool-${index}`, (workshop) => withWorkshopTool(workshop, index, { ...workshop.tools[index]!, ...change }));
  }

  private download(): void {
    const project = this.project;
    if (!project) return;
    downloadText(`${fileStem(project.name, 'project')}.workshop.json`, `${JSON.stringify(workshopFileFromProject(project), null, 2)}\n`, 'application/json');
  }

  private async readFile(event: Event): Promise<void> {
    const input = event.target as HTMLInputElement;
    const file = input.files?.[0];
    input.value = '';
    if (!file) return;
    try {
      const { format: _format, version: _version, ...workshop } = parseWorkshopFile(JSON.parse(await file.text()), file.name);
      this.edit('file', () => workshop);
    } catch (error) {
      this.errors = { ...this.errors, file: error instanceof InputError ? error.message : `${file.name} is not a JSON file (${error instanceof Error ? error.message : String(error)}); nothing was changed` };
    }
  }

  private renderTool(tool: WorkshopTool, index: number) {
    const saw = tool.kind === 'band-saw';
    return html`<div class="tool" data-testid="workshop-tool" data-kind=${tool.kind}>
      <div class="text-field">
        <label for=${`kind-${index}`}>Tool ${index + 1}</label>
        <select id=${`kind-${index}`} @change=${(event: Event) => this.edit(`tool-${index}`, (workshop) => withWorkshopTool(workshop, index, { ...newWorkshopTool((event.target as HTMLSelectElement).value as WorkshopToolKind), ...(tool.label ? { label: tool.label } : {}) }))}>
          ${workshopToolKinds.map((kind) => html`<option value=${kind} ?selected=${kind === tool.kind}>${kindNames[kind]}</option>`)}
        </select>
      </div>
      <div class="text-field">
        <label for=${`label-${index}`}>What you call it</label>
        <input id=${`label-${index}`} maxlength="200" .value=${tool.label ?? ''} @change=${(event: Event) => {
          const label = (event.target as HTMLInputElement).value.trim();
          this.edit(`tool-${index}`, (workshop) => {
            const { label: _old, ...rest } = workshop.tools[index]!;
            return withWorkshopTool(workshop, index, label ? { ...rest, label } : rest);
          });
        }} />
      </div>
      ${saw
        ? html`<bw-number-field label="Blade width" unit="mm" name=${`blade-${index}`} .value=${tool.blade_width_mm ?? null} .min=${0} .max=${50} exclusive-min step="1" @value-commit=${(event: CustomEvent<ValueCommitDetail>) => this.editTool(index, { blade_width_mm: event.detail.value })}></bw-number-field>`
        : html`<bw-number-field label="Radius" unit="mm" name=${`radius-${index}`} .value=${tool.radius_mm ?? null} .min=${0} .max=${500} exclusive-min step="0.5" hint="Half the drum's, sleeve's or bit's diameter." @value-commit=${(event: CustomEvent<ValueCommitDetail>) => this.editTool(index, { radius_mm: event.detail.value })}></bw-number-field>
            <bw-number-field
              label="Steepest wall it finishes"
              unit="rise/run"
              name=${`wall-${index}`}
              .value=${tool.steepest_wall ?? null}
              .min=${0}
              .max=${10}
              exclusive-min
              optional
              hint="Empty: the usual figure for this kind of tool."
              @value-commit=${(event: CustomEvent<ValueCommitDetail>) => this.editTool(index, { steepest_wall: event.detail.value })}
              @value-clear=${() =>
                this.edit(`tool-${index}`, (workshop) => {
                  const { steepest_wall: _wall, ...rest } = workshop.tools[index]!;
                  return withWorkshopTool(workshop, index, rest);
                })}
            ></bw-number-field>`}
      <button @click=${() => this.edit(`tool-${index}`, (workshop) => withoutWorkshopTool(workshop, index))} aria-label=${`Remove tool ${index + 1}`}>Remove</button>
      ${this.errors[`tool-${index}`] ? html`<p class="problem" role="alert" data-testid="tool-error">${this.errors[`tool-${index}`]}</p>` : nothing}
    </div>`;
  }

  private renderLimits(workshop: Workshop) {
    return html`<section class="panel" aria-labelledby="limits-heading" data-testid="workshop-limits">
      <h3 id="limits-heading">What the designer may cut</h3>
      <p class="muted">Every plan of this project — one bar in the shape view or the whole keyboard — keeps to these. A bar's own thinnest point (tuning view) still applies where it is stricter.</p>
      <dl class="limits">
        ${workshopLimitLines(workshop).map(
          (line) => html`<dt>${line.label}</dt>
            <dd data-limit=${line.key}><span class="value">${line.value}</span><span class="set-by">set by ${line.setBy}</span></dd>`,
        )}
      </dl>
    </section>`;
  }

  protected override render() {
    const project = this.project;
    if (!project) return nothing;
    const workshop = projectWorkshop(project);
    const own = project.workshop !== undefined;
    return html`<div class="layout">
      <section class="panel" aria-labelledby="workshop-heading">
        <h2 id="workshop-heading">Workshop</h2>
        <p class="muted" data-testid="workshop-origin">${own ? 'This project’s own workshop.' : 'barwright’s default: a typical small shop. Change anything below to make it this project’s own.'}</p>
        <div class="row">
          <div class="text-field">
            <label for="workshop-name">Name</label>
            <input id="workshop-name" maxlength="200" .value=${workshop.name ?? ''} @change=${(event: Event) => this.edit('name', (current) => ({ ...current, name: (event.target as HTMLInputElement).value.trim() || 'workshop' }))} />
          </div>
        </div>
        <h3>Tools</h3>
        ${workshop.tools.map((tool, index) => this.renderTool(tool, index))}
        <div class="row">
          <div class="text-field">
            <label for="add-kind">Kind of tool</label>
            <select id="add-kind" @change=${(event: Event) => (this.kindToAdd = (event.target as HTMLSelectElement).value as WorkshopToolKind)}>
              ${workshopToolKinds.map((kind) => html`<option value=${kind} ?selected=${kind === this.kindToAdd}>${kindNames[kind]}</option>`)}
            </select>
          </div>
          <button @click=${() => this.edit('add', (current) => ({ ...current, tools: [...current.tools, newWorkshopTool(this.kindToAdd)] }))}>Add this tool</button>
        </div>
        <h3>Rules of the shop</h3>
        <div class="row">
          <bw-number-field label="Cord-hole drill" unit="mm" name="drill" .value=${workshop.cord_holes.diameter_mm} .min=${0} .max=${20} step="0.5" hint="0 for bars hung without holes." error=${this.errors['drill'] ?? ''} @value-commit=${(event: CustomEvent<ValueCommitDetail>) => this.edit('drill', (current) => ({ ...current, cord_holes: { ...current.cord_holes, diameter_mm: event.detail.value } }))}></bw-number-field>
          <bw-number-field label="Wood between hole and arch" unit="mm" name="clearance" .value=${workshop.cord_holes.clearance_mm} .min=${0} .max=${30} step="0.5" error=${this.errors['clearance'] ?? ''} @value-commit=${(event: CustomEvent<ValueCommitDetail>) => this.edit('clearance', (current) => ({ ...current, cord_holes: { ...current.cord_holes, clearance_mm: event.detail.value } }))}></bw-number-field>
          <bw-number-field
            label="Thinnest point"
            unit="% of blank"
            name="thinnest"
            .value=${workshop.min_thickness_fraction === undefined ? null : Math.round(workshop.min_thickness_fraction * 1000) / 10}
            .min=${1}
            .max=${90}
            step="1"
            optional
            hint="Empty: a quarter of the blank (common practice)."
            error=${this.errors['thinnest'] ?? ''}
            @value-commit=${(event: CustomEvent<ValueCommitDetail>) => this.edit('thinnest', (current) => ({ ...current, min_thickness_fraction: event.detail.value / 100 }))}
            @value-clear=${() =>
              this.edit('thinnest', (current) => {
                const { min_thickness_fraction: _fraction, ...rest } = current;
                return rest;
              })}
          ></bw-number-field>
          <bw-number-field
            label="Uncut at each end"
            unit="% of length"
            name="uncut"
            .value=${workshop.uncut_end_fraction === undefined ? null : Math.round(workshop.uncut_end_fraction * 1000) / 10}
            .min=${0}
            .max=${40}
            step="1"
            optional
            hint="Empty: as far as the cord holes need."
            error=${this.errors['uncut'] ?? ''}
            @value-commit=${(event: CustomEvent<ValueCommitDetail>) => this.edit('uncut', (current) => ({ ...current, uncut_end_fraction: event.detail.value / 100 }))}
            @value-clear=${() =>
              this.edit('uncut', (current) => {
                const { uncut_end_fraction: _fraction, ...rest } = current;
                return rest;
              })}
          ></bw-number-field>
        </div>
        <div class="row">
          <button @click=${() => this.download()} data-testid="workshop-download">Download as a workshop file</button>
          <label class="button" for="workshop-file">Read a workshop file…</label>
          <input id="workshop-file" class="visually-hidden" type="file" accept=".json,application/json" @change=${(event: Event) => void this.readFile(event)} />
          ${own ? html`<button @click=${() => this.edit('reset', () => null)} data-testid="workshop-reset">Back to barwright’s default shop</button>` : nothing}
        </div>
        ${['name', 'add', 'file', 'reset'].map((key) => (this.errors[key] ? html`<p class="problem" role="alert" data-testid="workshop-error">${this.errors[key]}</p>` : nothing))}
        <bw-cautions></bw-cautions>
      </section>
      ${this.renderLimits(workshop)}
    </div>`;
  }
}

declare global {
  interface HTMLElementTagNameMap {
    'bw-workshop-view': BwWorkshopView;
  }
}
