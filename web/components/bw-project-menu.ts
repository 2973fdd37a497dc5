// Project controls: which stored project is open, its name, a new project (empty, of a chosen
// kind, or a copy of the demo), a copy of this one, deleting one (restorable from "Recently
// deleted"), export to a file and import from one (a file that fails validation is refused with
// the rule it breaks; a name already stored is never added silently beside it). Names and the
// new project's fields are checked here by the library's rules before anything is sent up.
// Fires `project-open`, `project-rename`, `project-create`, `project-demo`, `project-duplicate`,
// `project-delete`, `project-restore`, `project-export`, `project-import` (the shell shows what an
// import answers).
import { LitElement, html, css, nothing } from 'lit';
import { customElement, property, state } from 'lit/decorators.js';
import { checkProjectName, emptyProject, isInputError, materialPresets, projectKinds, type ProjectFile, type ProjectKind } from '../../src/index.ts';
import type { ProjectSummary } from '../storage/projectDatabase.ts';
import { sharedStyles } from '../styles/sharedStyles.ts';
import { formatWhen } from '../format.ts';

/** Detail of `project-import`: the file, and the maker's answer when its name is already stored. */
export interface ProjectImportDetail {
  text: string;
  fileName: string;
  choice?: 'copy' | 'replace';
}

/** Detail of `project-create`: the new project, checked, without an id yet. */
export interface ProjectCreateDetail {
  project: Omit<ProjectFile, 'id'>;
}

/** `<bw-project-menu .projects .binned project-id rename-error>` */
@customElement('bw-project-menu')
export class BwProjectMenu extends LitElement {
  static override styles = [
    sharedStyles,
    css`
      :host {
        display: block;
      }
      details.project {
        position: relative;
      }
      details.project > summary {
        border: 2px solid var(--bw-action);
        border-radius: 8px;
        padding: 0.3rem 0.8rem;
        list-style: none;
        gap: 0.4rem;
        max-width: 22rem;
        white-space: nowrap;
      }
      details.project > summary::-webkit-details-marker {
        display: none;
      }
      details.project > summary .name {
        color: var(--bw-ink);
        font-weight: 600;
        overflow: hidden;
        text-overflow: ellipsis;
        white-space: nowrap;
        max-width: 16rem;
      }
      @media (max-width: 1099px) {
        details.project > summary {
          padding: 0.3rem 0.6rem;
        }
        details.project > summary .name {
          max-width: 8rem;
        }
        details.project > summary .word {
          display: none;
        }
      }
      .menu {
        position: absolute;
        right: 0;
        top: calc(100% + 0.3rem);
        z-index: 10;
        background: var(--bw-panel);
        border: 1px solid var(--bw-line);
        border-radius: 10px;
        box-shadow: 0 6px 20px rgb(0 0 0 / 0.18);
        padding: 0.8rem;
        display: grid;
        grid-template-columns: minmax(0, 1fr);
        gap: 0.7rem;
        width: min(28rem, calc(100vw - 1.5rem));
        box-sizing: border-box;
        max-height: calc(100vh - 5rem);
        overflow-y: auto;
      }
      .field {
        display: grid;
        grid-template-columns: minmax(0, 1fr);
        gap: 0.15rem;
        min-width: 0;
      }
      .field input,
      .field select {
        width: 100%;
        min-width: 0;
        box-sizing: border-box;
      }
      .pair {
        display: grid;
        grid-template-columns: minmax(0, 1fr) minmax(0, 1fr);
        gap: 0.5rem;
      }
      fieldset {
        min-width: 0;
      }
      .buttons {
        display: flex;
        flex-wrap: wrap;
        gap: 0.4rem;
      }
      fieldset {
        border: 1px solid var(--bw-line-soft);
        border-radius: 8px;
        margin: 0;
        padding: 0.5rem 0.7rem 0.7rem;
        display: grid;
        gap: 0.5rem;
      }
      legend {
        font-weight: 700;
        padding: 0 0.3rem;
      }
      .field-error {
        color: var(--bw-problem-ink);
        font-size: 0.9rem;
        margin: 0;
      }
      ul.binned {
        list-style: none;
        margin: 0;
        padding: 0;
        display: grid;
        gap: 0.3rem;
      }
      ul.binned li {
        display: flex;
        gap: 0.5rem;
        align-items: center;
        justify-content: space-between;
      }
      input[type='file'] {
        position: absolute;
        opacity: 0;
        width: 1px;
        height: 1px;
      }
    `,
  ];

  @property({ attribute: false }) projects: ProjectSummary[] = [];
  /** Deleted projects that can still be restored. */
  @property({ attribute: false }) binned: { id: string; name: string; deleted_at: string }[] = [];
  @property({ attribute: 'project-id' }) projectId = '';
  /** Why the last rename was refused (from the keeper), if it was. */
  @property({ attribute: 'rename-error' }) renameError = '';

  @state() private creating = false;
  @state() private nameError = '';
  @state() private createError = '';
  @state() private draft = { name: '', kind: 'wooden-keyboard' as ProjectKind, lowest: 'C4', highest: 'C7', a4: '442', preset: '' };

  private send(name: string, detail?: unknown): void {
    // Choosing anything but a new name closes the menu: the page shows what happened.
    if (name !== 'project-rename') {
      const menu = this.renderRoot.querySelector('details');
      if (menu) menu.open = false;
    }
    this.dispatchEvent(new CustomEvent(name, { detail, bubbles: true, composed: true }));
  }

  /** Opens the menu on the new-project form (e.g. from the page shown when no project is left). */
  openCreate(): void {
    this.creating = true;
    const menu = this.renderRoot.querySelector('details');
    if (menu) menu.open = true;
    void this.updateComplete.then(() => this.renderRoot.querySelector<HTMLInputElement>('#new-name')?.focus());
  }

  private otherNames(): string[] {
    return this.projects.filter((project) => project.id !== this.projectId).map((project) => project.name);
  }

  private rename(text: string): void {
    try {
      const name = checkProjectName(text, this.otherNames());
      this.nameError = '';
      this.send('project-rename', { name });
    } catch (error) {
      if (!isInputError(error)) throw error;
      this.nameError = `Name ${error.rule}`;
    }
  }

  private create(): void {
    const draft = this.draft;
    try {
      const project = emptyProject({
        id: 'new',
        name: draft.name,
        kind: draft.kind,
        lowestNote: draft.lowest,
        highestNote: draft.highest,
        a4Hz: Number(draft.a4.replace(',', '.')),
        ...(draft.preset ? { materialPreset: draft.preset } : {}),
        otherNames: this.projects.map((summary) => summary.name),
      });
      const { id: _id, ...rest } = project;
      this.createError = '';
      this.creating = false;
      this.send('project-create', { project: rest } satisfies ProjectCreateDetail);
    } catch (error) {
      if (!isInputError(error)) throw error;
      this.createError = `${error.field === 'a4_hz' ? 'A4' : error.field === 'name' ? 'Name' : error.field === 'lowest note' ? 'Lowest note' : error.field === 'highest note' ? 'Highest note' : error.field}: ${error.rule}`;
    }
  }

  private async onFile(event: Event): Promise<void> {
    const input = event.target as HTMLInputElement;
    const file = input.files?.[0];
    input.value = '';
    if (!file) return;
    const text = await file.text();
    this.send('project-import', { text, fileName: file.name } satisfies ProjectImportDetail);
  }

  private renderCreate() {
    const draft = this.draft;
    const metal = draft.kind === 'chimes' || draft.kind === 'metal-bars';
    const presets = materialPresets.filter((preset) => (metal ? preset.kind === 'metal' : preset.kind !== 'metal'));
    const set = (key: keyof typeof draft) => (event: Event) => (this.draft = { ...this.draft, [key]: (event.target as HTMLInputElement | HTMLSelectElement).value });
    return html`<fieldset data-testid="new-project-form">
      <legend>New empty project</legend>
      <div class="field"><label for="new-name">Name</label><input id="new-name" type="text" maxlength="200" autocomplete="off" .value=${draft.name} @input=${set('name')} /></div>
      <div class="field">
        <label for="new-kind">What it builds</label>
        <select id="new-kind" @change=${(event: Event) => (this.draft = { ...this.draft, kind: (event.target as HTMLSelectElement).value as ProjectKind, preset: '' })}>
          ${Object.entries(projectKinds).map(([kind, value]) => html`<option value=${kind} ?selected=${kind === draft.kind}>${value.label}</option>`)}
        </select>
      </div>
      <div class="pair">
        <div class="field"><label for="new-lowest">Lowest note</label><input id="new-lowest" type="text" autocomplete="off" .value=${draft.lowest} @input=${set('lowest')} /></div>
        <div class="field"><label for="new-highest">Highest note</label><input id="new-highest" type="text" autocomplete="off" .value=${draft.highest} @input=${set('highest')} /></div>
      </div>
      <div class="pair">
        <div class="field"><label for="new-a4">A4 reference (Hz)</label><input id="new-a4" inputmode="decimal" autocomplete="off" .value=${draft.a4} @input=${set('a4')} /></div>
        <div class="field">
          <label for="new-material">${metal ? 'Metal' : 'Timber'}</label>
          <select id="new-material" @change=${set('preset')}>
            <option value="">Usual for this kind</option>
            ${presets.map((preset) => html`<option value=${preset.name} ?selected=${preset.name === draft.preset}>${preset.label}</option>`)}
          </select>
        </div>
      </div>
      ${this.createError ? html`<p class="field-error" role="alert" data-testid="new-project-error">✕ ${this.createError}</p>` : nothing}
      <div class="buttons">
        <button class="primary" @click=${() => this.create()} data-testid="create-project">Start this project</button>
        <button @click=${() => ((this.creating = false), (this.createError = ''))}>Cancel</button>
      </div>
      <p class="muted" style="margin:0">Notes from A0 to C8. Bars are added on the Keyboard view.</p>
    </fieldset>`;
  }

  protected override render() {
    const open = this.projects.find((project) => project.id === this.projectId);
    const nameError = this.nameError || this.renameError;
    return html`<details class="project">
        <summary data-testid="project-menu" title=${`Project: ${open?.name ?? 'none open'}`} aria-label=${`Project: ${open?.name ?? 'none open'}`}><span class="word">Project</span> ▾ <span class="name">${open?.name ?? 'none open'}</span></summary>
        <div class="menu">
          ${this.projects.length > 0
            ? html`<div class="field">
                <label for="project">Open project</label>
                <select id="project" @change=${(event: Event) => this.send('project-open', { id: (event.target as HTMLSelectElement).value })}>
                  ${this.projects.map((project) => html`<option value=${project.id} ?selected=${project.id === this.projectId}>${project.name} (${project.bars} bars, ${formatWhen(project.saved_at)})</option>`)}
                </select>
              </div>`
            : nothing}
          ${open
            ? html`<div class="field">
                <label for="project-name">Name of this project</label>
                <input id="project-name" type="text" maxlength="200" autocomplete="off" .value=${open.name} aria-invalid=${nameError ? 'true' : 'false'}
                  @change=${(event: Event) => this.rename((event.target as HTMLInputElement).value)} @keydown=${(event: KeyboardEvent) => event.key === 'Enter' && this.rename((event.target as HTMLInputElement).value)} />
                ${nameError ? html`<p class="field-error" role="alert" data-testid="rename-error">✕ ${nameError}</p>` : nothing}
              </div>`
            : nothing}
          ${this.creating
            ? this.renderCreate()
            : html`<div class="buttons">
                <button class="primary" @click=${() => (this.creating = true)} data-testid="new-project">New empty project…</button>
                <button @click=${() => this.send('project-demo')}>New copy of the demo</button>
              </div>`}
          ${open
            ? html`<div class="buttons">
                <button @click=${() => this.send('project-duplicate')} data-testid="duplicate-project">Duplicate this project</button>
                <button @click=${() => this.send('project-delete', { id: open.id })} data-testid="delete-project">Delete this project</button>
              </div>`
            : nothing}
          <div class="buttons">
            <button ?disabled=${!open} @click=${() => this.send('project-export')} data-testid="export">Export file</button>
            <button @click=${() => this.renderRoot.querySelector<HTMLInputElement>('#import-file')?.click()}>Import file…</button>
          </div>
          <label class="visually-hidden" for="import-file">Project file to import</label>
          <input id="import-file" type="file" accept=".json,application/json" @change=${(event: Event) => void this.onFile(event)} />
          ${this.binned.length > 0
            ? html`<fieldset>
                <legend>Recently deleted (kept 30 days)</legend>
                <ul class="binned" data-testid="binned">
                  ${this.binned.map((entry) => html`<li><span>${entry.name} <span class="muted">· ${formatWhen(entry.deleted_at)}</span></span><button @click=${() => this.send('project-restore', { id: entry.id })}>Restore</button></li>`)}
                </ul>
              </fieldset>`
            : nothing}
          <p class="muted" style="margin:0">Every change is saved in this browser as you work. Export a file to keep a copy elsewhere or move to another device.</p>
        </div>
      </details>`;
  }
}

declare global {
  interface HTMLElementTagNameMap {
    'bw-project-menu': BwProjectMenu;
  }
}
