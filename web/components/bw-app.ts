// The workbench shell: header with the project controls and the always-visible reference strip,
// the view tabs, and the open view. Owns the ProjectKeeper (storage, autosave, other tabs) and
// applies the edits the views send up.
import { LitElement, html, css, nothing } from 'lit';
import { customElement, state } from 'lit/decorators.js';
import { registerOf, type ProjectFile } from '../../src/index.ts';
import { KeeperController } from '../controllers/KeeperController.ts';
import { ProjectKeeper, type ImportResult } from '../storage/ProjectKeeper.ts';
import { newProjectId } from '../storage/projectDatabase.ts';
import { sharedStyles } from '../styles/sharedStyles.ts';
import { NavigateEvent, ProjectEditEvent, type ViewName } from '../events.ts';
import type { BwProjectMenu, ProjectCreateDetail, ProjectImportDetail } from './bw-project-menu.ts';
import './bw-project-menu.ts';
import './bw-status-strip.ts';
import { SaveBeforeUpdateEvent } from '../offline/appUpdates.ts';
import { loadView, preloadViews } from '../viewModules.ts';
import './bw-keyboard-view.ts';
import './bw-update-notice.ts';

/** Loads the demo project of the invented workshop (bundled with the app). */
async function loadDemo(): Promise<unknown> {
  const module = await import('../../fixtures/demo.project.json');
  return structuredClone(module.default);
}

const views: { name: ViewName; label: string; needsBar: boolean; inNav?: false }[] = [
  { name: 'keyboard', label: 'Keyboard', needsBar: false },
  { name: 'shape', label: 'Shape', needsBar: true },
  { name: 'tuning', label: 'Tuning', needsBar: true },
  { name: 'resonators', label: 'Resonators', needsBar: false },
  { name: 'template', label: 'Template', needsBar: true },
  { name: 'chimes', label: 'Chime set', needsBar: false },
  { name: 'workshop', label: 'Workshop', needsBar: false },
  { name: 'plan-print', label: 'Templates of the plan', needsBar: false, inNav: false },
];

/** Reads `#/view/barId` from the address. */
function readRoute(): { view: ViewName; barId: string } {
  const [, view, barId] = location.hash.split('/');
  const known = views.find((candidate) => candidate.name === view);
  return { view: known ? known.name : 'keyboard', barId: barId ? decodeURIComponent(barId) : '' };
}

/** `<bw-app>` */
@customElement('bw-app')
export class BwApp extends LitElement {
  static override styles = [
    sharedStyles,
    css`
      :host {
        display: block;
        min-height: 100vh;
      }
      /* Laptop: brand, reference strip and project on one row, the view tabs below.
         Tablet (below 1100 px): one line — tabs in the middle, scrolling sideways inside
         themselves, the strip in two short lines, the project button at the end. */
      header {
        background: var(--bw-panel);
        border-bottom: 3px solid var(--bw-action);
        padding: 0.5rem 1.2rem 0;
        position: sticky;
        top: 0;
        z-index: 5;
      }
      .header-row {
        display: grid;
        grid-template-columns: auto minmax(0, 1fr) auto;
        grid-template-areas: 'brand strip menu' 'nav nav nav';
        gap: 0.4rem 1.4rem;
        align-items: center;
      }
      .brand {
        grid-area: brand;
        font-size: 1.5rem;
        font-weight: 800;
        letter-spacing: 0.02em;
        color: var(--bw-action);
        margin: 0;
        white-space: nowrap;
      }
      .brand span {
        color: var(--bw-ink-muted);
        font-weight: 500;
        font-size: 1rem;
      }
      .strip {
        grid-area: strip;
      }
      bw-project-menu {
        grid-area: menu;
        justify-self: end;
      }
      nav {
        grid-area: nav;
        display: flex;
        gap: 0.3rem;
        align-self: end;
        overflow-x: auto;
        overscroll-behavior-x: contain;
        scrollbar-width: thin;
        /* Soft edges where more tabs lie beyond the box (scroll shadows). */
        background:
          linear-gradient(to right, var(--bw-panel) 30%, transparent) left / 1.5rem 100% no-repeat local,
          linear-gradient(to left, var(--bw-panel) 30%, transparent) right / 1.5rem 100% no-repeat local,
          radial-gradient(farthest-side at 0 50%, rgb(0 0 0 / 0.22), transparent) left / 0.6rem 100% no-repeat scroll,
          radial-gradient(farthest-side at 100% 50%, rgb(0 0 0 / 0.22), transparent) right / 0.6rem 100% no-repeat scroll;
      }
      nav button {
        border-radius: 8px 8px 0 0;
        border-bottom-width: 0;
        flex: 0 0 auto;
        white-space: nowrap;
      }
      nav button[aria-current='page'] {
        background: var(--bw-action);
        color: var(--bw-action-ink);
      }
      @media (max-width: 1099px) {
        header {
          padding: 0.35rem 0.75rem 0;
        }
        .header-row {
          grid-template-columns: minmax(0, 1fr) auto auto;
          grid-template-areas: 'nav strip menu';
          gap: 0 0.7rem;
        }
        .brand {
          display: none;
        }
        nav {
          padding-top: 0.35rem;
        }
        nav button {
          padding: 0.5rem 0.75rem;
        }
      }
      main {
        padding: 1rem 1.2rem 3rem;
        max-width: 1500px;
        margin: 0 auto;
        min-width: 0;
      }
      @media (max-width: 1099px) {
        main {
          padding: 0.8rem 0.75rem 3rem;
        }
      }
      .welcome {
        max-width: 40rem;
        margin: 2rem auto;
      }
      .banner {
        margin: 0.6rem 1.2rem 0;
        padding: 0.7rem 1rem;
        border-radius: 8px;
        display: flex;
        gap: 0.6rem;
        align-items: center;
        flex-wrap: wrap;
      }
      .banner.conflict,
      .banner.failed {
        background: var(--bw-problem-ground);
        color: var(--bw-problem-ink);
        border: 2px solid var(--bw-problem-ink);
      }
      .banner.notice {
        background: var(--bw-action-soft);
        color: var(--bw-ink);
      }
      .banner.choice {
        background: var(--bw-caution-ground);
        color: var(--bw-caution-ink);
        border: 2px solid var(--bw-caution-ink);
      }
      @media print {
        /* On paper the page is only as long as what it prints (100vh is a whole sheet there). */
        :host {
          min-height: 0;
        }
        header,
        .banner {
          display: none;
        }
        main {
          padding: 0;
          max-width: none;
        }
      }
    `,
  ];

  private readonly keeper = new KeeperController(this, new ProjectKeeper());
  @state() private route = readRoute();
  @state() private importError = '';
  /** An import waiting for the maker's choice (its name is already stored). */
  @state() private pendingImport: { text: string; fileName: string; name: string; suggested: string } | null = null;
  @state() private renameError = '';
  @state() private startProblem = '';

  private readonly onHashChange = () => {
    this.route = readRoute();
  };
  private readonly onPageHide = () => {
    void this.keeper.keeper.flush();
  };
  private readonly onVisibility = () => {
    if (document.visibilityState === 'hidden') void this.keeper.keeper.flush();
  };

  override connectedCallback(): void {
    super.connectedCallback();
    window.addEventListener('hashchange', this.onHashChange);
    window.addEventListener('pagehide', this.onPageHide);
    document.addEventListener('visibilitychange', this.onVisibility);
    this.keeper.keeper.start(loadDemo).catch((error: unknown) => {
      this.startProblem = `The workbench could not open its storage: ${error instanceof Error ? error.message : String(error)}`;
    });
    this.addEventListener('project-edit', (event) => {
      const edit = event as ProjectEditEvent;
      edit.outcome = this.keeper.keeper.edit(edit.change);
    });
    this.addEventListener('navigate', (event) => {
      const navigate = event as NavigateEvent;
      this.navigate(navigate.view, navigate.barId ?? this.route.barId);
    });
    this.addEventListener('bar-pick', (event) => this.navigate(this.route.view, (event as CustomEvent<{ barId: string }>).detail.barId));
    // "Reload to update" (bw-update-notice): every change stored first, or no reload.
    this.addEventListener('save-before-update', (event) => {
      const keeper = this.keeper.keeper;
      (event as SaveBeforeUpdateEvent).saved = keeper.flush().then(() => !keeper.state.unsaved);
    });
    preloadViews();
  }

  override disconnectedCallback(): void {
    super.disconnectedCallback();
    window.removeEventListener('hashchange', this.onHashChange);
    window.removeEventListener('pagehide', this.onPageHide);
    document.removeEventListener('visibilitychange', this.onVisibility);
  }

  /** Keeps the open view's tab in sight when the tabs scroll sideways (tablet). */
  protected override updated(): void {
    const nav = this.renderRoot.querySelector('nav');
    const current = nav?.querySelector<HTMLElement>('[aria-current="page"]');
    if (!nav || !current || nav.scrollWidth <= nav.clientWidth) return;
    const left = current.offsetLeft - nav.offsetLeft;
    if (left < nav.scrollLeft) nav.scrollLeft = left - 16;
    else if (left + current.offsetWidth > nav.scrollLeft + nav.clientWidth) nav.scrollLeft = left + current.offsetWidth - nav.clientWidth + 16;
  }

  private navigate(view: ViewName, barId: string): void {
    const hash = `#/${view}${barId ? `/${encodeURIComponent(barId)}` : ''}`;
    if (location.hash !== hash) history.pushState(null, '', hash);
    this.route = { view, barId };
    window.scrollTo({ top: 0 });
  }

  /** The bar a bar view shows: the one in the address, else the first being tuned, else the first. */
  private barIdFor(): string {
    const project = this.keeper.state.project;
    if (!project) return '';
    if (project.bars.some((bar) => bar.id === this.route.barId)) return this.route.barId;
    return (project.bars.find((bar) => bar.state === 'tuning') ?? project.bars[0])?.id ?? '';
  }

  private exportProject(): void {
    const keeperState = this.keeper.state;
    if (!keeperState.project) return;
    const text = this.keeper.keeper.exportText();
    const blob = new Blob([text], { type: 'application/json' });
    const link = document.createElement('a');
    link.href = URL.createObjectURL(blob);
    link.download = `${keeperState.project.name.replace(/[^\p{L}\p{N}]+/gu, '-').replace(/^-|-$/g, '').toLowerCase() || 'project'}.project.json`;
    document.body.append(link);
    link.click();
    link.remove();
    setTimeout(() => URL.revokeObjectURL(link.href), 10_000);
  }

  private async importProject(detail: ProjectImportDetail): Promise<void> {
    const outcome: ImportResult = await this.keeper.keeper.importText(detail.text, detail.fileName, detail.choice);
    this.pendingImport = null;
    this.importError = '';
    if (!outcome.ok && 'nameTaken' in outcome) this.pendingImport = { text: detail.text, fileName: detail.fileName, name: outcome.nameTaken.name, suggested: outcome.nameTaken.suggested };
    else if (!outcome.ok) this.importError = outcome.error.message;
    if (outcome.ok) this.navigate('keyboard', '');
  }

  private async createProject(project: Omit<ProjectFile, 'id'>): Promise<void> {
    const outcome = await this.keeper.keeper.create({ ...project, id: newProjectId() });
    if (outcome.ok) this.navigate('keyboard', '');
    else this.importError = outcome.error.message;
  }

  private renameProject(name: string): void {
    const outcome = this.keeper.keeper.rename(name);
    this.renameError = outcome.ok ? '' : outcome.error.rule;
  }

  private async deleteProject(id: string): Promise<void> {
    await this.keeper.keeper.deleteProject(id);
    this.navigate('keyboard', '');
  }

  private renderBanner() {
    const keeperState = this.keeper.state;
    if (this.startProblem) return html`<div class="banner failed" role="alert">${this.startProblem}</div>`;
    if (keeperState.storageProblem) return html`<div class="banner failed" role="alert">${keeperState.storageProblem}</div>`;
    if (keeperState.conflict) {
      return html`<div class="banner conflict" role="alert" data-testid="conflict">
        <strong>This project was saved in another tab while this tab had a change not yet saved.</strong>
        Nothing has been overwritten. Choose:
        <button @click=${() => void this.keeper.keeper.resolveConflict('theirs')}>Show the other tab's version</button>
        <button @click=${() => void this.keeper.keeper.resolveConflict('copy')}>Keep this tab's version as a copy</button>
        <button @click=${() => void this.keeper.keeper.resolveConflict('mine')}>Save this tab's version over it</button>
      </div>`;
    }
    if (keeperState.saveProblem) return html`<div class="banner failed" role="alert">${keeperState.saveProblem}</div>`;
    if (this.pendingImport) {
      const pending = this.pendingImport;
      return html`<div class="banner choice" role="alert" data-testid="import-choice">
        <span>A project called <strong>“${pending.name}”</strong> is already stored, so ${pending.fileName} is not imported yet. Choose:</span>
        <button class="primary" @click=${() => void this.importProject({ text: pending.text, fileName: pending.fileName, choice: 'copy' })}>Keep both: import it as “${pending.suggested}”</button>
        <button @click=${() => void this.importProject({ text: pending.text, fileName: pending.fileName, choice: 'replace' })}>Replace the stored one (kept in Recently deleted)</button>
        <button @click=${() => (this.pendingImport = null)}>Cancel</button>
      </div>`;
    }
    if (this.importError) {
      return html`<div class="banner failed" role="alert" data-testid="import-error"><span><strong>Refused.</strong> ${this.importError} Nothing was changed.</span> <button @click=${() => (this.importError = '')}>OK</button></div>`;
    }
    if (keeperState.lastDeleted) {
      const deleted = keeperState.lastDeleted;
      return html`<div class="banner notice" role="status" data-testid="deleted-notice">
        <span>Deleted “${deleted.name}”. It stays in the project menu under Recently deleted for 30 days.</span>
        <button class="primary" @click=${() => void this.keeper.keeper.restore(deleted.id)} data-testid="undo-delete">Undo</button>
        <button @click=${() => this.keeper.keeper.dismissUndo()}>OK</button>
      </div>`;
    }
    if (keeperState.notice) return html`<div class="banner notice" role="status">${keeperState.notice} <button @click=${() => this.keeper.keeper.dismissNotice()}>OK</button></div>`;
    return nothing;
  }

  /** No project left (all deleted): start one. */
  private renderWelcome() {
    return html`<section class="panel welcome" aria-labelledby="welcome-heading" data-testid="no-project">
      <h2 id="welcome-heading">No project is open</h2>
      <p>Start a project of your own, empty, or a fresh copy of the demo workshop to try things on. Deleted projects can be restored from the project menu for 30 days.</p>
      <div class="row">
        <button class="primary" @click=${() => this.renderRoot.querySelector<BwProjectMenu>('bw-project-menu')?.openCreate()}>New empty project…</button>
        <button @click=${() => void this.keeper.keeper.addDemo(loadDemo)}>New copy of the demo</button>
      </div>
    </section>`;
  }

  private renderView() {
    const project = this.keeper.state.project;
    if (!project && this.keeper.state.noProject) return this.renderWelcome();
    if (!project) return html`<p role="status">Opening the workbench…</p>`;
    const barId = this.barIdFor();
    // Views other than the keyboard overview come as their own chunks (viewModules.ts).
    void loadView(this.route.view);
    switch (this.route.view) {
      case 'keyboard':
        return html`<bw-keyboard-view .project=${project}></bw-keyboard-view>`;
      case 'shape':
        return html`<bw-shape-view .project=${project} bar-id=${barId}></bw-shape-view>`;
      case 'tuning':
        return html`<bw-tuning-view .project=${project} bar-id=${barId}></bw-tuning-view>`;
      case 'resonators':
        return html`<bw-resonator-view .project=${project}></bw-resonator-view>`;
      case 'template':
        return html`<bw-template-view .project=${project} bar-id=${barId}></bw-template-view>`;
      case 'chimes':
        return html`<bw-chime-view .project=${project}></bw-chime-view>`;
      case 'workshop':
        return html`<bw-workshop-view .project=${project}></bw-workshop-view>`;
      case 'plan-print':
        return html`<bw-plan-print-view .project=${project}></bw-plan-print-view>`;
    }
  }

  protected override render() {
    const keeperState = this.keeper.state;
    const project = keeperState.project;
    const barId = this.barIdFor();
    const bar = project?.bars.find((candidate) => candidate.id === barId);
    const showsBar = views.find((view) => view.name === this.route.view)?.needsBar ?? false;
    const registerId = project && bar && showsBar ? registerOf(project, bar).id : '';
    return html`<header>
        <div class="header-row">
          <p class="brand">barwright <span>workbench</span></p>
          <bw-status-strip class="strip" .project=${project} .keeper=${keeperState} register-id=${registerId}></bw-status-strip>
          <bw-project-menu
            .projects=${keeperState.projects}
            .binned=${keeperState.binned}
            project-id=${project?.id ?? ''}
            rename-error=${this.renameError}
            @project-open=${(event: CustomEvent<{ id: string }>) => void this.keeper.keeper.open(event.detail.id).then(() => this.navigate('keyboard', ''))}
            @project-rename=${(event: CustomEvent<{ name: string }>) => this.renameProject(event.detail.name)}
            @project-create=${(event: CustomEvent<ProjectCreateDetail>) => void this.createProject(event.detail.project)}
            @project-duplicate=${() => void this.keeper.keeper.duplicate()}
            @project-delete=${(event: CustomEvent<{ id: string }>) => void this.deleteProject(event.detail.id)}
            @project-restore=${(event: CustomEvent<{ id: string }>) => void this.keeper.keeper.restore(event.detail.id).then(() => this.navigate('keyboard', ''))}
            @project-export=${() => this.exportProject()}
            @project-import=${(event: CustomEvent<ProjectImportDetail>) => void this.importProject(event.detail)}
            @project-demo=${() => void this.keeper.keeper.addDemo(loadDemo).then(() => this.navigate('keyboard', ''))}
          ></bw-project-menu>
          <nav aria-label="Views">
            ${project
              ? views.filter((view) => view.inNav !== false).map(
                  (view) => html`<button aria-current=${this.route.view === view.name ? 'page' : 'false'} @click=${() => this.navigate(view.name, view.needsBar ? barId : this.route.barId)}>
                    ${view.label}${view.needsBar && bar ? html`&nbsp;<span aria-hidden="true">·</span>&nbsp;${bar.note}` : nothing}
                  </button>`,
                )
              : nothing}
          </nav>
        </div>
      </header>
      ${this.renderBanner()}
      <bw-update-notice></bw-update-notice>
      <main>${this.renderView()}</main>`;
  }
}

declare global {
  interface HTMLElementTagNameMap {
    'bw-app': BwApp;
  }
}
