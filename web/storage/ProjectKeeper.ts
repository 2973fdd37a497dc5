// Keeps the open project: applies the maker's edits, autosaves each change to IndexedDB shortly
// after it is made, and handles the other tabs. A save is based on a revision; if another tab
// saved first, nothing is overwritten and the maker chooses what to keep. A failed save or
// import leaves the stored data as it was.
import { InputError, duplicateProject, isInputError, parseProjectFile, readProjectFileText, renameProject, serializeProjectFile, uniqueProjectName, type ProjectFile } from '../../src/index.ts';
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
  /** Deleted projects that can still be restored (newest first). */
  binned: { id: string; name: string; deleted_at: string }[];
  /** The project deleted last in this tab, offered for an immediate undo, or null. */
  lastDeleted: { id: string; name: string } | null;
  /** Storage is open and holds no project (all deleted): the maker starts one. */
  noProject: boolean;
}

/** Outcome of an edit or import. */
export type KeeperResult = { ok: true } | { ok: false; error: InputError };

/**
 * Outcome of an import: done, refused (the rule broken), or waiting for the maker's choice because
 * a stored project already has the file's name (`suggested` is the free name a copy would get).
 */
export type ImportResult = KeeperResult | { ok: false; error: InputError; nameTaken: { name: string; suggested: string; storedId: string } };

/** What to do with an imported project whose name is taken: keep both (the import renamed), or replace the stored one (which goes to the bin). */
export type ImportChoice = 'copy' | 'replace';

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
/** Key of the setting that says the demo was offered once (it is not added again after every project is deleted). */
const demoOfferedKey = 'demoOffered';

/** The open project and its storage. */
export class ProjectKeeper {
  state: KeeperState = { project: null, projects: [], unsaved: false, saving: false, lastSavedAt: null, saveProblem: null, conflict: null, notice: null, storageProblem: null, binned: [], lastDeleted: null, noProject: false };
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
    if (projects.length === 0 && (await this.database.setting(demoOfferedKey)) === undefined) {
      const demo = parseProjectFile(await loadDemo(), 'demo project');
      await this.database.add({ ...demo, revision: 0, saved_at: null }, this.now());
      projects = await this.database.list();
    }
    await this.database.setSetting(demoOfferedKey, '1');
    this.set({ binned: await this.database.binned(this.now()) });
    if (projects.length === 0) {
      this.set({ projects, noProject: true });
      return;
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
    this.set({ project, projects: await this.database.list(), unsaved: false, lastSavedAt: project.saved_at, saveProblem: null, conflict: null, notice: null, noProject: false });
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
   * is refused with its first problem; nothing stored or open changes. A file whose project name
   * is already stored is never added silently beside it: without `choice` the answer names the
   * clash and the free name a copy would get; `copy` imports it under that name, `replace` moves
   * the stored one to the bin (restorable) and imports the file in its place.
   */
  async importText(text: string, fileName: string, choice?: ImportChoice): Promise<ImportResult> {
    let project: ProjectFile;
    try {
      project = readProjectFileText(text, fileName);
    } catch (error) {
      if (isInputError(error)) return { ok: false, error };
      throw error;
    }
    if (!this.database) return { ok: false, error: new InputError(fileName, '(file)', 'cannot be imported: this browser refused storage') };
    const stored = (await this.database.list()).find((summary) => summary.name.trim().toLocaleLowerCase() === project.name.trim().toLocaleLowerCase());
    if (stored && choice === undefined) {
      const suggested = uniqueProjectName(project.name, this.state.projects.map((summary) => summary.name));
      return { ok: false, error: new InputError(fileName, 'name', `a project called “${stored.name}” is already stored: import this one as “${suggested}”, or replace the stored one`), nameTaken: { name: stored.name, suggested, storedId: stored.id } };
    }
    try {
      let replaced = '';
      if (stored && choice === 'copy') project = { ...project, name: uniqueProjectName(project.name, (await this.database.list()).map((summary) => summary.name)) };
      if (stored && choice === 'replace') {
        if (this.state.project?.id === stored.id) await this.flush();
        await this.database.moveToBin(stored.id, this.now());
        replaced = ` The project it replaces is in “Recently deleted”.`;
      }
      const added = await this.database.add(project, this.now());
      await this.open(added.id);
      this.set({ notice: `Imported “${added.name}” from ${fileName}.${replaced}`, binned: await this.database.binned(this.now()) });
      return { ok: true };
    } catch (error) {
      if (isInputError(error)) return { ok: false, error };
      return { ok: false, error: new InputError(fileName, '(file)', `could not be stored (${error instanceof Error ? error.message : String(error)})`) };
    }
  }

  /** Stores a new project (e.g. an empty one) and opens it; its name must differ from every stored project's. */
  async create(project: ProjectFile): Promise<KeeperResult> {
    if (!this.database) return { ok: false, error: new InputError('project', '(storage)', 'cannot be stored: this browser refused storage') };
    try {
      renameProject(project, project.name, this.state.projects.map((summary) => summary.name));
      const added = await this.database.add(project, this.now());
      await this.open(added.id);
      this.set({ notice: `Started “${added.name}”.` });
      return { ok: true };
    } catch (error) {
      if (isInputError(error)) return { ok: false, error };
      throw error;
    }
  }

  /** Names of the stored projects other than the open one. */
  otherNames(): string[] {
    return this.state.projects.filter((summary) => summary.id !== this.state.project?.id).map((summary) => summary.name);
  }

  /** Renames the open project (1–200 characters, not another stored project's name). */
  rename(name: string): KeeperResult {
    const others = this.otherNames();
    const outcome = this.edit((project) => renameProject(project, name, others));
    if (outcome.ok && this.state.project) {
      const id = this.state.project.id;
      this.set({ projects: this.state.projects.map((summary) => (summary.id === id ? { ...summary, name: this.state.project!.name } : summary)) });
    }
    return outcome;
  }

  /** Stores a copy of the open project (every bar and round) under a free name and opens it. */
  async duplicate(): Promise<void> {
    const project = this.state.project;
    if (!project || !this.database) return;
    await this.flush();
    const copy = duplicateProject(this.state.project ?? project, { id: newProjectId(), takenNames: (await this.database.list()).map((summary) => summary.name) });
    const added = await this.database.add(copy, this.now());
    await this.open(added.id);
    this.set({ notice: `Copied as “${added.name}”; this is the copy.` });
  }

  /**
   * Deletes a stored project: it goes to the bin (restorable for 30 days, and at once with undo).
   * If it was open, the most recently saved other project opens, or none is left open.
   */
  async deleteProject(id: string): Promise<void> {
    if (!this.database) return;
    const wasOpen = this.state.project?.id === id;
    if (wasOpen) {
      if (this.saveTimer) {
        clearTimeout(this.saveTimer);
        this.saveTimer = null;
      }
      if (this.saving) await this.saving;
      // Unsaved changes of the open project are kept with it in the bin.
      if (this.state.unsaved && !this.state.conflict) await this.saveNow();
    }
    const entry = await this.database.moveToBin(id, this.now());
    if (!entry) return;
    const projects = await this.database.list();
    const binned = await this.database.binned(this.now());
    if (wasOpen) {
      this.localVersion += 1;
      if (projects.length > 0) await this.open(projects[0]!.id);
      else this.set({ project: null, projects, unsaved: false, lastSavedAt: null, saveProblem: null, conflict: null, noProject: true });
    }
    this.set({ projects, binned, lastDeleted: { id: entry.id, name: entry.name }, notice: null });
    this.notices?.announceSaved(entry.id, entry.project.revision + 1);
  }

  /** Restores a deleted project from the bin (under a free name if its name was taken meanwhile) and opens it. */
  async restore(id: string): Promise<void> {
    if (!this.database) return;
    const project = await this.database.takeFromBin(id);
    if (!project) return;
    const names = (await this.database.list()).map((summary) => summary.name);
    const added = await this.database.add({ ...project, name: uniqueProjectName(project.name, names) }, this.now());
    await this.open(added.id);
    this.set({ binned: await this.database.binned(this.now()), lastDeleted: null, notice: `Restored “${added.name}”.` });
  }

  /** Clears the offer to undo the last deletion (it stays restorable from the bin). */
  dismissUndo(): void {
    this.set({ lastDeleted: null });
  }

  /** The open project as project-file text (JSON) for export. */
  exportText(): string {
    if (!this.state.project) throw new InputError('export', 'project', 'no project is open');
    return serializeProjectFile(this.state.project, 'export');
  }

  /** Stores a fresh copy of the demo project (under a free name) and opens it. */
  async addDemo(loadDemo: () => Promise<unknown>): Promise<void> {
    if (!this.database) return;
    const demo = parseProjectFile(await loadDemo(), 'demo project');
    const names = (await this.database.list()).map((summary) => summary.name);
    const stored = await this.database.add({ ...demo, id: newProjectId(), name: uniqueProjectName(demo.name, names) }, this.now());
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
