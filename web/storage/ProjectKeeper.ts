// Keeps the open project: applies the maker's edits, autosaves each change to IndexedDB shortly
// after it is made, and handles the other tabs. A save is based on a revision; if another tab
// saved first, nothing is overwritten and the maker chooses what to keep. A failed save or
// import leaves the stored data as it was.
import { InputError, isInputError, parseProjectFile, readProjectFileText, serializeProjectFile, type ProjectFile } from '../../src/index.ts';
import { ProjectDatabase, SaveConflict, newProjectId, type ProjectSummary } from './projectDatabase.ts';
import { TabNotices, type TabNotice } from './tabNotices.ts';

/** Everything a view shows about the open project and its saving. */
export interface KeeperState {
  project: ProjectFile | null;
  projects: ProjectSummary[];
  /** Local changes not yet stored. */
  unsaved: boolean;
  saving: boolean;
  /** ISO time of the last successful save of this project, or null. */
  lastSavedAt: string | null;
  /** Why the last save failed (the stored project is unchanged), or null. */
  saveProblem: string | null;
  /** Another tab saved this project while this tab had unsaved changes. */
  conflict: { stored: ProjectFile } | null;
  /** A calm, one-line message (reloaded from another tab, imported, …), or null. */
  notice: string | null;
  /** Set when the database cannot be opened (private mode, blocked storage). */
  storageProblem: string | null;
}

/** Outcome of an edit or import. */
export type KeeperResult = { ok: true } | { ok: false; error: InputError };

/** Options for tests. */
export interface KeeperOptions {
  databaseName?: string;
  channelName?: string;
  /** Delay between a change and its save, ms (short: changes made in a burst share one save). */
  saveDelayMs?: number;
  now?: () => Date;
}

/** Key of the setting holding the project opened last. */
const lastProjectKey = 'lastProjectId';

/** The open project and its storage. */
export class ProjectKeeper {
  state: KeeperState = { project: null, projects: [], unsaved: false, saving: false, lastSavedAt: null, saveProblem: null, conflict: null, notice: null, storageProblem: null };
  private database: ProjectDatabase | null = null;
  private notices: TabNotices | null = null;
  private baseRevision = 0;
  private localVersion = 0;
  private saveTimer: ReturnType<typeof setTimeout> | null = null;
  private saving: Promise<void> | null = null;
  private readonly listeners = new Set<(state: KeeperState) => void>();
  private readonly saveDelayMs: number;
  private readonly now: () => Date;

  constructor(private readonly options: KeeperOptions = {}) {
    this.saveDelayMs = options.saveDelayMs ?? 150;
    this.now = options.now ?? (() => new Date());
  }

  /** Calls `listener` on every change of state; returns an unsubscribe function. */
  subscribe(listener: (state: KeeperState) => void): () => void {
    this.listeners.add(listener);
    return () => this.listeners.delete(listener);
  }

  private set(change: Partial<KeeperState>): void {
    this.state = { ...this.state, ...change };
    for (const listener of this.listeners) listener(this.state);
  }

  /**
   * Opens storage and the project used last; on first start stores and opens the demo project
   * from `loadDemo`.
   */
  async start(loadDemo: () => Promise<unknown>): Promise<void> {
    try {
      this.database = await ProjectDatabase.open(this.options.databaseName);
    } catch (error) {
      this.set({ storageProblem: `This browser refused storage (${error instanceof Error ? error.message : String(error)}); changes will not be kept. Export the project to keep it.` });
      const demo = parseProjectFile(await loadDemo(), 'demo project');
      this.baseRevision = demo.revision;
      this.set({ project: demo });
      return;
    }
    this.notices = new TabNotices((notice) => void this.onNotice(notice), this.options.channelName);
    let projects = await this.database.list();
    if (projects.length === 0) {
      const demo = parseProjectFile(await loadDemo(), 'demo project');
      await this.database.add({ ...demo, revision: 0, saved_at: null }, this.now());
      projects = await this.database.list();
    }
    const lastId = await this.database.setting(lastProjectKey);
    const id = projects.some((project) => project.id === lastId) ? lastId! : projects[0]!.id;
    await this.open(id);
  }

  /** Opens a stored project (saving the open one first). */
  async open(id: string): Promise<void> {
    if (!this.database) return;
    await this.flush();
    const project = await this.database.load(id);
    if (!project) throw new InputError('storage', 'project', `no stored project with id "${id}"`);
    this.baseRevision = project.revision;
    this.localVersion += 1;
    await this.database.setSetting(lastProjectKey, id);
    this.set({ project, projects: await this.database.list(), unsaved: false, lastSavedAt: project.saved_at, saveProblem: null, conflict: null, notice: null });
  }

  /**
   * Applies an edit to the open project. An InputError from the edit is returned (for the view
   * to show beside the field) and nothing changes; otherwise the change is saved shortly.
   */
  edit(change: (project: ProjectFile) => ProjectFile): KeeperResult {
    const project = this.state.project;
    if (!project) return { ok: false, error: new InputError('project', 'project', 'no project is open') };
    let next: ProjectFile;
    try {
      next = change(project);
    } catch (error) {
      if (isInputError(error)) return { ok: false, error };
      throw error;
    }
    this.localVersion += 1;
    this.set({ project: next, unsaved: true, notice: null });
    this.scheduleSave();
    return { ok: true };
  }

  private scheduleSave(): void {
    if (this.saveTimer) clearTimeout(this.saveTimer);
    this.saveTimer = setTimeout(() => {
      this.saveTimer = null;
      void this.saveNow();
    }, this.saveDelayMs);
  }

  /** Saves pending changes now and waits for it (before switching projects or leaving). */
  async flush(): Promise<void> {
    if (this.saveTimer) {
      clearTimeout(this.saveTimer);
      this.saveTimer = null;
    }
    if (this.saving) await this.saving;
    if (this.state.unsaved && !this.state.conflict) await this.saveNow();
  }

  private async saveNow(): Promise<void> {
    if (this.saving) {
      await this.saving;
      if (this.state.unsaved) this.scheduleSave();
      return;
    }
    const database = this.database;
    const project = this.state.project;
    if (!database || !project || !this.state.unsaved || this.state.conflict) return;
    const version = this.localVersion;
    this.set({ saving: true });
    this.saving = (async () => {
      try {
        const saved = await database.save(project, this.baseRevision, this.now());
        this.baseRevision = saved.revision;
        this.notices?.announceSaved(saved.id, saved.revision);
        const current = this.state.project!;
        const upToDate = version === this.localVersion && current.id === saved.id;
        this.set({
          project: upToDate ? saved : current.id === saved.id ? { ...current, revision: saved.revision, saved_at: saved.saved_at } : current,
          unsaved: !upToDate,
          saving: false,
          lastSavedAt: saved.saved_at,
          saveProblem: null,
        });
        if (!upToDate) this.scheduleSave();
      } catch (error) {
        if (error instanceof SaveConflict) this.set({ saving: false, conflict: { stored: parseProjectFile(error.stored, 'stored project') } });
        else this.set({ saving: false, saveProblem: `Not saved: ${error instanceof Error ? error.message : String(error)}. The last saved version is kept.` });
      } finally {
        this.saving = null;
      }
    })();
    await this.saving;
  }

  private async onNotice(notice: TabNotice): Promise<void> {
    const project = this.state.project;
    if (!this.database) return;
    this.set({ projects: await this.database.list() });
    if (!project || notice.projectId !== project.id || notice.revision <= this.baseRevision) return;
    const stored = await this.database.load(project.id);
    if (!stored) return;
    if (this.state.unsaved || this.saving) {
      this.set({ conflict: { stored } });
      return;
    }
    this.baseRevision = stored.revision;
    this.localVersion += 1;
    const time = stored.saved_at ? new Date(stored.saved_at).toLocaleTimeString() : 'just now';
    this.set({ project: stored, lastSavedAt: stored.saved_at, notice: `Another tab saved this project at ${time}; this tab now shows that version.` });
  }

  /**
   * Settles a conflict: `theirs` shows the other tab's version (this tab's unsaved change is
   * dropped), `copy` keeps this tab's version as a new project beside theirs, `mine` stores this
   * tab's version over theirs (theirs stays among the snapshots).
   */
  async resolveConflict(choice: 'theirs' | 'copy' | 'mine'): Promise<void> {
    const conflict = this.state.conflict;
    const project = this.state.project;
    if (!conflict || !project || !this.database) return;
    if (choice === 'theirs') {
      this.baseRevision = conflict.stored.revision;
      this.localVersion += 1;
      this.set({ project: conflict.stored, unsaved: false, conflict: null, lastSavedAt: conflict.stored.saved_at, notice: 'Showing the version saved in the other tab.' });
      return;
    }
    if (choice === 'copy') {
      const copy = await this.database.add({ ...project, id: newProjectId(), name: `${project.name} (copy)` }, this.now());
      this.set({ conflict: null });
      await this.open(copy.id);
      this.set({ notice: `This tab's version is kept as “${copy.name}”.` });
      return;
    }
    this.baseRevision = conflict.stored.revision;
    this.set({ conflict: null });
    await this.saveNow();
  }

  /**
   * Imports a project file's text as a new project and opens it. A file that does not validate
   * is refused with its first problem; nothing stored or open changes.
   */
  async importText(text: string, fileName: string): Promise<KeeperResult> {
    let project: ProjectFile;
    try {
      project = readProjectFileText(text, fileName);
    } catch (error) {
      if (isInputError(error)) return { ok: false, error };
      throw error;
    }
    if (!this.database) return { ok: false, error: new InputError(fileName, '(file)', 'cannot be imported: this browser refused storage') };
    try {
      const stored = await this.database.add(project, this.now());
      await this.open(stored.id);
      this.set({ notice: `Imported “${stored.name}” from ${fileName}.` });
      return { ok: true };
    } catch (error) {
      if (isInputError(error)) return { ok: false, error };
      return { ok: false, error: new InputError(fileName, '(file)', `could not be stored (${error instanceof Error ? error.message : String(error)})`) };
    }
  }

  /** The open project as project-file text (JSON) for export. */
  exportText(): string {
    if (!this.state.project) throw new InputError('export', 'project', 'no project is open');
    return serializeProjectFile(this.state.project, 'export');
  }

  /** Stores a fresh copy of the demo project and opens it. */
  async addDemo(loadDemo: () => Promise<unknown>): Promise<void> {
    if (!this.database) return;
    const demo = parseProjectFile(await loadDemo(), 'demo project');
    const stored = await this.database.add({ ...demo, id: newProjectId() }, this.now());
    await this.open(stored.id);
  }

  /** Clears the one-line notice. */
  dismissNotice(): void {
    this.set({ notice: null });
  }

  /** Saves what is pending and closes storage and the tab channel. */
  async close(): Promise<void> {
    await this.flush();
    this.notices?.close();
    this.database?.close();
  }
}
