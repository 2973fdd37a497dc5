// The workbench's storage (IndexedDB through fake-indexeddb): autosave, reload, two tabs on one
// project, failed saves and imports leaving stored data intact.
import 'fake-indexeddb/auto';
import { readFileSync } from 'node:fs';
import { resolve } from 'node:path';
import { afterEach, describe, expect, it } from 'vitest';
import { emptyProject, recordStep, renameProject, type ProjectFile } from '../../src/index.ts';
import { ProjectDatabase, SaveConflict } from '../../web/storage/projectDatabase.ts';
import { ProjectKeeper } from '../../web/storage/ProjectKeeper.ts';

const demoText = readFileSync(resolve(import.meta.dirname, '../../fixtures/demo.project.json'), 'utf8');
const loadDemo = async () => JSON.parse(demoText) as unknown;
let counter = 0;
const open: ProjectKeeper[] = [];

/** A keeper ("tab") on a named database and channel; several share one name like tabs share a browser. */
function tab(name: string, saveDelayMs = 5): ProjectKeeper {
  const keeper = new ProjectKeeper({ databaseName: name, channelName: name, saveDelayMs });
  open.push(keeper);
  return keeper;
}

function freshName(): string {
  counter += 1;
  return `barwright-test-${counter}-${Date.now()}`;
}

/** Waits until `condition` holds (state changes arrive asynchronously), or fails after 2 s. */
async function until(condition: () => boolean): Promise<void> {
  const start = Date.now();
  while (!condition()) {
    if (Date.now() - start > 2000) throw new Error('condition not reached within 2 s');
    await new Promise((resolve) => setTimeout(resolve, 5));
  }
}

afterEach(async () => {
  for (const keeper of open.splice(0)) await keeper.close();
});

describe('project storage', () => {
  it('stores the demo on first start and keeps every change across a reload', async () => {
    const name = freshName();
    const first = tab(name);
    await first.start(loadDemo);
    expect(first.state.project?.name).toMatch(/Demo workshop/);
    const revision = first.state.project!.revision;
    expect(first.edit((project) => recordStep(project, 'bar-A4', [771, 1962, 3478], { at: '2025-04-01T10:00:00.000Z' })).ok).toBe(true);
    await until(() => !first.state.unsaved);
    expect(first.state.project!.revision).toBe(revision + 1);
    expect(first.state.lastSavedAt).not.toBeNull();
    await first.close();

    const again = tab(name);
    await again.start(async () => {
      throw new Error('the demo must not be loaded twice');
    });
    const a4 = again.state.project!.bars.find((bar) => bar.id === 'bar-A4')!;
    expect(a4.session.steps.map((step) => step.measured_hz)).toEqual([[771, 1962, 3478]]);
    expect(again.state.project!.revision).toBe(revision + 1);
  });

  it('refuses a save based on an old revision and keeps the newer stored project', async () => {
    const name = freshName();
    const database = await ProjectDatabase.open(name);
    const stored = await database.add(JSON.parse(demoText) as ProjectFile);
    const saved = await database.save(renameProject(stored, 'First tab'), stored.revision);
    await expect(database.save(renameProject(stored, 'Second tab'), stored.revision)).rejects.toBeInstanceOf(SaveConflict);
    expect((await database.load(stored.id))!.name).toBe('First tab');
    expect((await database.snapshots(stored.id)).map((snapshot) => snapshot.revision)).toEqual([stored.revision]);
    expect(saved.revision).toBe(stored.revision + 1);
    database.close();
  });

  it('shows another tab’s save in a tab without changes, and warns a tab with changes', async () => {
    const name = freshName();
    const one = tab(name);
    await one.start(loadDemo);
    // Tab two waits longer before saving, so tab one's save lands first.
    const two = tab(name, 400);
    await two.start(loadDemo);
    expect(two.state.project!.id).toBe(one.state.project!.id);

    one.edit((project) => renameProject(project, 'Renamed in tab one'));
    await until(() => two.state.project?.name === 'Renamed in tab one');
    expect(two.state.notice).toMatch(/Another tab saved this project/);

    // Tab two holds an unsaved change while tab one saves: nothing is overwritten silently.
    two.edit((project) => renameProject(project, 'Tab two’s name'));
    one.edit((project) => renameProject(project, 'Tab one again'));
    await until(() => two.state.conflict !== null);
    const database = await ProjectDatabase.open(name);
    expect((await database.load(one.state.project!.id))!.name).toBe('Tab one again');
    await two.resolveConflict('copy');
    const names = (await database.list()).map((entry) => entry.name).sort();
    expect(names).toEqual(['Tab one again', 'Tab two’s name (copy)']);
    database.close();
  });

  it('refuses a corrupt import with its rule and changes nothing', async () => {
    const name = freshName();
    const keeper = tab(name);
    await keeper.start(loadDemo);
    const before = JSON.stringify(keeper.state.project);
    const broken = JSON.parse(demoText);
    broken.bars[0].blank.length_mm = 'long';
    const outcome = await keeper.importText(JSON.stringify(broken), 'broken.project.json');
    expect(outcome.ok).toBe(false);
    if (outcome.ok) return;
    expect(outcome.error.message).toMatch(/^broken\.project\.json: bars\[0\]\.blank\.length_mm: /);
    expect((await keeper.importText('not json at all', 'junk.json')).ok).toBe(false);
    expect(JSON.stringify(keeper.state.project)).toBe(before);
    expect(keeper.state.projects).toHaveLength(1);
  });

  it('imports a good file as a new project beside the open one', async () => {
    const name = freshName();
    const keeper = tab(name);
    await keeper.start(loadDemo);
    const exported = keeper.exportText();
    // Same name as the stored demo: kept beside it under a free name.
    const outcome = await keeper.importText(exported, 'copy.project.json', 'copy');
    expect(outcome.ok).toBe(true);
    expect(keeper.state.projects).toHaveLength(2);
    expect(keeper.state.project!.bars).toEqual(JSON.parse(exported).bars);
  });

  it('keeps the stored project when a change cannot be saved', async () => {
    const name = freshName();
    const keeper = tab(name);
    await keeper.start(loadDemo);
    const id = keeper.state.project!.id;
    keeper.edit((project) => {
      const broken = structuredClone(project);
      broken.bars[0]!.session.steps[0]!.measured_hz[0] = Number.NaN;
      return broken;
    });
    await until(() => keeper.state.saveProblem !== null);
    expect(keeper.state.saveProblem).toMatch(/Not saved: .*NaN.*The last saved version is kept/);
    const database = await ProjectDatabase.open(name);
    const stored = await database.load(id);
    expect(Number.isFinite(stored!.bars[0]!.session.steps[0]!.measured_hz[0])).toBe(true);
    database.close();
  });
});

describe('projects of one’s own', () => {
  const emptyShop = (id: string, name: string): ProjectFile => emptyProject({ id, name, kind: 'wooden-keyboard', lowestNote: 'C4', highestNote: 'C6', a4Hz: 442 });

  it('starts an empty project beside the demo, refusing a name already stored', async () => {
    const keeper = tab(freshName());
    await keeper.start(loadDemo);
    const demoName = keeper.state.project!.name;
    const refused = await keeper.create(emptyShop('p-1', ` ${demoName.toUpperCase()} `));
    expect(refused.ok).toBe(false);
    if (!refused.ok) expect(refused.error.rule).toMatch(/already the name of another project/);
    expect(keeper.state.projects).toHaveLength(1);
    expect((await keeper.create(emptyShop('p-1', 'Shop'))).ok).toBe(true);
    expect(keeper.state.project!.name).toBe('Shop');
    expect(keeper.state.project!.bars).toEqual([]);
    expect(keeper.state.projects.map((summary) => summary.name).sort()).toEqual([demoName, 'Shop'].sort());
  });

  it('renames and copies the open project under names no other project has', async () => {
    const keeper = tab(freshName());
    await keeper.start(loadDemo);
    const demoName = keeper.state.project!.name;
    await keeper.create(emptyShop('p-1', 'Shop'));
    const clash = keeper.rename(demoName);
    expect(clash.ok).toBe(false);
    expect(keeper.rename('Shop two').ok).toBe(true);
    await until(() => !keeper.state.unsaved);
    await keeper.duplicate();
    expect(keeper.state.project!.name).toBe('Shop two (copy)');
    // The copy is open now; copying "Shop two" again needs the next free name.
    await keeper.open(keeper.state.projects.find((summary) => summary.name === 'Shop two')!.id);
    await keeper.duplicate();
    expect(keeper.state.projects.map((summary) => summary.name).sort()).toEqual([demoName, 'Shop two', 'Shop two (copy)', 'Shop two (copy) (2)'].sort());
  });

  it('a deleted project goes to the bin: restorable after a reload, under a free name; with none left nothing is added back by itself', async () => {
    const name = freshName();
    const keeper = tab(name);
    await keeper.start(loadDemo);
    const demo = keeper.state.project!;
    await keeper.deleteProject(demo.id);
    expect(keeper.state.project).toBeNull();
    expect(keeper.state.noProject).toBe(true);
    expect(keeper.state.lastDeleted).toEqual({ id: demo.id, name: demo.name });
    expect(keeper.state.binned.map((entry) => entry.name)).toEqual([demo.name]);
    await keeper.close();

    const again = tab(name);
    await again.start(async () => {
      throw new Error('the demo must not come back by itself once the maker deleted it');
    });
    expect(again.state.noProject).toBe(true);
    expect(again.state.binned).toHaveLength(1);
    await again.addDemo(loadDemo);
    // The demo's name is taken again, so the restored one comes back under a free name.
    await again.restore(demo.id);
    expect(again.state.project!.bars).toEqual(demo.bars);
    expect(again.state.project!.name).toBe(`${demo.name} (2)`);
    expect(again.state.binned).toEqual([]);
    expect(again.state.projects).toHaveLength(2);
  });

  it('an import with a stored name waits for a choice: keep both, or replace (the replaced one in the bin)', async () => {
    const keeper = tab(freshName());
    await keeper.start(loadDemo);
    const exported = keeper.exportText();
    const name = keeper.state.project!.name;
    const waiting = await keeper.importText(exported, 'again.project.json');
    expect(waiting.ok).toBe(false);
    expect('nameTaken' in waiting && waiting.nameTaken).toMatchObject({ name, suggested: `${name} (2)` });
    expect(keeper.state.projects).toHaveLength(1);
    expect((await keeper.importText(exported, 'again.project.json', 'copy')).ok).toBe(true);
    expect(keeper.state.projects.map((summary) => summary.name).sort()).toEqual([name, `${name} (2)`].sort());
    expect((await keeper.importText(exported, 'again.project.json', 'replace')).ok).toBe(true);
    expect(keeper.state.projects).toHaveLength(2);
    expect(keeper.state.binned.map((entry) => entry.name)).toEqual([name]);
    expect(keeper.state.project!.name).toBe(name);
  });
});
