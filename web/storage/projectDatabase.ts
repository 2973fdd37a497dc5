// The workbench's IndexedDB storage (idb): projects by id, earlier revisions kept as snapshots,
// and small settings. Every save is one transaction that checks the revision it was based on,
// so two tabs never overwrite each other silently, and a failed save leaves the stored project
// exactly as it was.
import { openDB, type DBSchema, type IDBPDatabase } from 'idb';
import { InputError, parseProjectFile, serializeProjectFile, type ProjectFile } from '../../src/index.ts';

/** Name of the workbench's database. */
export const databaseName = 'barwright-workbench';

/** Snapshots kept per project (older ones are dropped). */
export const snapshotsKept = 25;

interface WorkbenchSchema extends DBSchema {
  projects: { key: string; value: ProjectFile };
  snapshots: { key: number; value: { projectId: string; revision: number; saved_at: string | null; project: ProjectFile }; indexes: { byProject: string } };
  settings: { key: string; value: string };
  bin: { key: string; value: DeletedProject };
}

/** A deleted project, kept so the deletion can be undone for a while (binDays). */
export interface DeletedProject {
  id: string;
  name: string;
  deleted_at: string;
  project: ProjectFile;
}

/** Days a deleted project stays restorable. */
export const binDays = 30;

/** A project as listed in the project picker. */
export interface ProjectSummary {
  id: string;
  name: string;
  revision: number;
  saved_at: string | null;
  bars: number;
}

/** A save was refused because the stored project moved on (another tab saved first). */
export class SaveConflict extends Error {
  constructor(readonly stored: ProjectFile) {
    super(`the project was changed elsewhere (stored revision ${stored.revision})`);
    this.name = 'SaveConflict';
  }
}

/** A fresh project id. */
export function newProjectId(): string {
  return `project-${crypto.randomUUID()}`;
}

/** Validates a project and returns a plain, cloned copy safe to store (throws InputError). */
function storable(project: ProjectFile): ProjectFile {
  return JSON.parse(serializeProjectFile(project, 'save')) as ProjectFile;
}

/** The workbench's project storage. */
export class ProjectDatabase {
  private constructor(private readonly database: IDBPDatabase<WorkbenchSchema>) {}

  /** Opens (and creates or upgrades) the database. */
  static async open(name: string = databaseName): Promise<ProjectDatabase> {
    const database = await openDB<WorkbenchSchema>(name, 2, {
      upgrade(db, oldVersion) {
        if (oldVersion < 1) {
          db.createObjectStore('projects', { keyPath: 'id' });
          const snapshots = db.createObjectStore('snapshots', { autoIncrement: true });
          snapshots.createIndex('byProject', 'projectId');
          db.createObjectStore('settings');
        }
        // Version 2: deleted projects, restorable for binDays.
        if (oldVersion < 2) db.createObjectStore('bin', { keyPath: 'id' });
      },
    });
    return new ProjectDatabase(database);
  }

  /** Every stored project, newest save first. */
  async list(): Promise<ProjectSummary[]> {
    const projects = await this.database.getAll('projects');
    return projects
      .map((project) => ({ id: project.id, name: project.name, revision: project.revision, saved_at: project.saved_at, bars: project.bars.length }))
      .sort((a, b) => (b.saved_at ?? '').localeCompare(a.saved_at ?? ''));
  }

  /** A stored project, migrated to the current version and validated; undefined when absent. */
  async load(id: string): Promise<ProjectFile | undefined> {
    const stored = await this.database.get('projects', id);
    return stored ? parseProjectFile(stored, 'stored project') : undefined;
  }

  /**
   * Saves a project edited from revision `baseRevision`. In one transaction: if the stored
   * revision differs, throws SaveConflict and writes nothing; otherwise keeps the stored version
   * as a snapshot and writes the project with revision + 1 and `saved_at` = now. Throws InputError
   * (and writes nothing) when the project does not validate.
   */
  async save(project: ProjectFile, baseRevision: number, now: Date = new Date()): Promise<ProjectFile> {
    const next = storable({ ...project, revision: baseRevision + 1, saved_at: now.toISOString() });
    const transaction = this.database.transaction(['projects', 'snapshots'], 'readwrite');
    const projects = transaction.objectStore('projects');
    const stored = await projects.get(project.id);
    if (stored && stored.revision !== baseRevision) {
      transaction.abort();
      await transaction.done.catch(() => undefined);
      throw new SaveConflict(stored);
    }
    if (!stored && baseRevision !== 0) {
      transaction.abort();
      await transaction.done.catch(() => undefined);
      throw new InputError('save', 'project', 'this project was deleted elsewhere; export it or save it as a copy');
    }
    if (stored) await transaction.objectStore('snapshots').add({ projectId: stored.id, revision: stored.revision, saved_at: stored.saved_at, project: stored });
    await projects.put(next);
    await transaction.done;
    await this.pruneSnapshots(project.id);
    return next;
  }

  /**
   * Adds a project as a new entry (first start, import, "save as copy"). If its id is taken the
   * project gets a fresh id, so nothing stored is ever replaced. Returns what was stored.
   */
  async add(project: ProjectFile, now: Date = new Date()): Promise<ProjectFile> {
    const transaction = this.database.transaction('projects', 'readwrite');
    const taken = (await transaction.store.getKey(project.id)) !== undefined;
    const next = storable({ ...project, id: taken ? newProjectId() : project.id, revision: 1, saved_at: now.toISOString() });
    await transaction.store.add(next);
    await transaction.done;
    return next;
  }

  /** Removes a project and its snapshots. */
  async remove(id: string): Promise<void> {
    const transaction = this.database.transaction(['projects', 'snapshots'], 'readwrite');
    await transaction.objectStore('projects').delete(id);
    const keys = await transaction.objectStore('snapshots').index('byProject').getAllKeys(id);
    for (const key of keys) await transaction.objectStore('snapshots').delete(key);
    await transaction.done;
  }

  /**
   * Deletes a project but keeps it (its last saved version) in the bin, in one transaction, so the
   * deletion can be undone for binDays. Returns what was kept, or undefined when it was not stored.
   */
  async moveToBin(id: string, now: Date = new Date()): Promise<DeletedProject | undefined> {
    const transaction = this.database.transaction(['projects', 'snapshots', 'bin'], 'readwrite');
    const stored = await transaction.objectStore('projects').get(id);
    if (!stored) {
      transaction.abort();
      await transaction.done.catch(() => undefined);
      return undefined;
    }
    const entry: DeletedProject = { id: stored.id, name: stored.name, deleted_at: now.toISOString(), project: stored };
    await transaction.objectStore('bin').put(entry);
    await transaction.objectStore('projects').delete(id);
    const keys = await transaction.objectStore('snapshots').index('byProject').getAllKeys(id);
    for (const key of keys) await transaction.objectStore('snapshots').delete(key);
    await transaction.done;
    return entry;
  }

  /** Deleted projects still restorable, newest deletion first (older than binDays are dropped first). */
  async binned(now: Date = new Date()): Promise<{ id: string; name: string; deleted_at: string }[]> {
    const cutoff = now.getTime() - binDays * 24 * 3600 * 1000;
    const transaction = this.database.transaction('bin', 'readwrite');
    const entries = await transaction.store.getAll();
    for (const entry of entries) if (Date.parse(entry.deleted_at) < cutoff) await transaction.store.delete(entry.id);
    await transaction.done;
    return entries
      .filter((entry) => Date.parse(entry.deleted_at) >= cutoff)
      .map(({ id, name, deleted_at }) => ({ id, name, deleted_at }))
      .sort((a, b) => b.deleted_at.localeCompare(a.deleted_at));
  }

  /** Takes a deleted project out of the bin (validated), or undefined when it is not there. */
  async takeFromBin(id: string): Promise<ProjectFile | undefined> {
    const transaction = this.database.transaction('bin', 'readwrite');
    const entry = await transaction.store.get(id);
    if (entry) await transaction.store.delete(id);
    await transaction.done;
    return entry ? parseProjectFile(entry.project, 'deleted project') : undefined;
  }

  /** Earlier revisions of a project, newest first. */
  async snapshots(id: string): Promise<{ revision: number; saved_at: string | null; project: ProjectFile }[]> {
    const all = await this.database.getAllFromIndex('snapshots', 'byProject', id);
    return all.map(({ revision, saved_at, project }) => ({ revision, saved_at, project })).sort((a, b) => b.revision - a.revision);
  }

  private async pruneSnapshots(id: string): Promise<void> {
    const transaction = this.database.transaction('snapshots', 'readwrite');
    const keys = await transaction.store.index('byProject').getAllKeys(id);
    const surplus = keys.sort((a, b) => a - b).slice(0, Math.max(0, keys.length - snapshotsKept));
    for (const key of surplus) await transaction.store.delete(key);
    await transaction.done;
  }

  /** A stored setting, or undefined. */
  async setting(key: string): Promise<string | undefined> {
    return this.database.get('settings', key);
  }

  /** Stores a setting. */
  async setSetting(key: string, value: string): Promise<void> {
    await this.database.put('settings', value, key);
  }

  /** Closes the connection. */
  close(): void {
    this.database.close();
  }
}
