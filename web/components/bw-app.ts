// The workbench shell: header with the project controls and the always-visible reference strip,
// the view tabs, and the open view. Owns the ProjectKeeper (storage, autosave, other tabs) and
// applies the edits the views send up.
import { LitElement, html, css, nothing } from 'lit';
import { customElement, state } from 'lit/decorators.js';
import { registerOf } from '../../src/index.ts';
import { KeeperController } from '../controllers/KeeperController.ts';
import { ProjectKeeper } from '../storage/ProjectKeeper.ts';
import { sharedStyles } from '../styles/sharedStyles.ts';
import { NavigateEvent, ProjectEditEvent, type ViewName } from '../events.ts';
import type { ProjectImportDetail } from './bw-project-menu.ts';
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
  { name: 'template', label: 'Print', needsBar: true },
  { name: 'chimes', label: 'Chime set', needsBar: false },
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
      header {
        background: var(--bw-panel);
        border-bottom: 3px solid var(--bw-action);
        padding: 0.6rem 1.2rem 0.5rem;
        position: sticky;
        top: 0;
        z-index: 5;
      }
      .header-row {
        display: flex;
        flex-wrap: wrap;
        gap: 0.6rem 1.4rem;
        align-items: center;
        justify-content: space-between;
      }
      .brand {
        font-size: 1.5rem;
        font-weight: 800;
        letter-spacing: 0.02em;
        color: var(--bw-action);
        margin: 0;
      }
      .brand span {
        color: var(--bw-ink-muted);
        font-weight: 500;
        font-size: 1rem;
      }
      nav {
        display: flex;
        gap: 0.3rem;
        flex-wrap: wrap;
        margin-top: 0.5rem;
      }
      nav button {
        border-radius: 8px 8px 0 0;
        border-bottom-width: 0;
      }
      nav button[aria-current='page'] {
        background: var(--bw-action);
        color: var(--bw-action-ink);
      }
      .strip {
        flex: 1 1 24rem;
      }
      main {
        padding: 1rem 1.2rem 3rem;
        max-width: 1500px;
        margin: 0 auto;
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
      @media print {
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
    const outcome = await this.keeper.keeper.importText(detail.text, detail.fileName);
    this.importError = outcome.ok ? '' : outcome.error.message;
    if (outcome.ok) this.navigate('keyboard', '');
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
    if (keeperState.notice) return html`<div class="banner notice" role="status">${keeperState.notice} <button @click=${() => this.keeper.keeper.dismissNotice()}>OK</button></div>`;
    return nothing;
  }

  private renderView() {
    const project = this.keeper.state.project;
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
        return html`<bw-chime-view></bw-chime-view>`;
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
            project-id=${project?.id ?? ''}
            import-error=${this.importError}
            @project-open=${(event: CustomEvent<{ id: string }>) => void this.keeper.keeper.open(event.detail.id)}
            @project-export=${() => this.exportProject()}
            @project-import=${(event: CustomEvent<ProjectImportDetail>) => void this.importProject(event.detail)}
            @project-demo=${() => void this.keeper.keeper.addDemo(loadDemo)}
          ></bw-project-menu>
        </div>
        <nav aria-label="Views">
          ${views.filter((view) => view.inNav !== false).map(
            (view) => html`<button aria-current=${this.route.view === view.name ? 'page' : 'false'} @click=${() => this.navigate(view.name, view.needsBar ? barId : this.route.barId)}>
              ${view.label}${view.needsBar && bar ? html`&nbsp;<span aria-hidden="true">·</span>&nbsp;${bar.note}` : nothing}
            </button>`,
          )}
        </nav>
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
