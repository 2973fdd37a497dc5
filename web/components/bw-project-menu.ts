// Project controls: which stored project is open, export to a project file, import one (a file
// that fails validation is refused with the rule it breaks, and nothing changes), and a fresh
// copy of the demo. Fires `project-open`, `project-export`, `project-import`, `project-demo`.
import { LitElement, html, css, nothing } from 'lit';
import { customElement, property } from 'lit/decorators.js';
import type { ProjectSummary } from '../storage/projectDatabase.ts';
import { sharedStyles } from '../styles/sharedStyles.ts';
import { formatWhen } from '../format.ts';

/** Detail of `project-import`. */
export interface ProjectImportDetail {
  text: string;
  fileName: string;
}

/** `<bw-project-menu .projects project-id import-error>` */
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
        padding: 0.3rem 0.9rem;
        list-style: none;
        gap: 0.4rem;
        max-width: 26rem;
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
        max-width: 18rem;
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
        gap: 0.6rem;
        width: min(26rem, 92vw);
      }
      .choose {
        display: grid;
        gap: 0.15rem;
      }
      select {
        width: 100%;
      }
      input[type='file'] {
        position: absolute;
        opacity: 0;
        width: 1px;
        height: 1px;
      }
      .problem {
        margin-top: 0.5rem;
        max-width: 60rem;
      }
    `,
  ];

  @property({ attribute: false }) projects: ProjectSummary[] = [];
  @property({ attribute: 'project-id' }) projectId = '';
  /** Why the last import was refused (shown next to the import control). */
  @property({ attribute: 'import-error' }) importError = '';

  private send(name: string, detail?: unknown): void {
    this.dispatchEvent(new CustomEvent(name, { detail, bubbles: true, composed: true }));
  }

  private async onFile(event: Event): Promise<void> {
    const input = event.target as HTMLInputElement;
    const file = input.files?.[0];
    input.value = '';
    if (!file) return;
    const text = await file.text();
    this.send('project-import', { text, fileName: file.name } satisfies ProjectImportDetail);
  }

  protected override render() {
    const open = this.projects.find((project) => project.id === this.projectId);
    return html`<details class="project">
      <summary data-testid="project-menu">Project ▾ <span class="name">${open?.name ?? ''}</span></summary>
      <div class="menu">
        <div class="choose">
          <label for="project">Project</label>
          <select id="project" @change=${(event: Event) => this.send('project-open', { id: (event.target as HTMLSelectElement).value })}>
            ${this.projects.map((project) => html`<option value=${project.id} ?selected=${project.id === this.projectId}>${project.name} (${project.bars} bars, ${formatWhen(project.saved_at)})</option>`)}
          </select>
        </div>
        <button @click=${() => this.send('project-export')} data-testid="export">Export file</button>
        <button @click=${() => this.renderRoot.querySelector<HTMLInputElement>('#import-file')?.click()} aria-describedby="import-problem">Import file…</button>
        <label class="visually-hidden" for="import-file">Project file to import</label>
        <input id="import-file" type="file" accept=".json,application/json" @change=${(event: Event) => void this.onFile(event)} />
        <button @click=${() => this.send('project-demo')}>New copy of the demo</button>
        <p class="muted" style="margin:0">Every change is saved in this browser as you work. Export a file to keep a copy elsewhere or move to another device.</p>
      </div>
      </details>
      ${this.importError
        ? html`<p class="problem" id="import-problem" role="alert" data-testid="import-error"><strong>Import refused.</strong> ${this.importError} Nothing was changed.</p>`
        : html`<span id="import-problem"></span>`}${nothing}`;
  }
}

declare global {
  interface HTMLElementTagNameMap {
    'bw-project-menu': BwProjectMenu;
  }
}
