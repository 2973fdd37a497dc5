// A project of one's own: started empty, named (never silently like another), copied, its range
// edited; every result a valid project file, every refusal naming the field and the range.
import { readFileSync } from 'node:fs';
import { resolve } from 'node:path';
import { describe, expect, it } from 'vitest';
import {
  addBar,
  checkProjectName,
  duplicateProject,
  emptyProject,
  materialFromPreset,
  notesInRange,
  parseProjectFile,
  projectKinds,
  renameProject,
  serializeProjectFile,
  setInstrumentRange,
  uniqueProjectName,
  type ProjectFile,
} from '../../src/index.ts';
import { thrown } from './thrownInputError.ts';

const demoText = readFileSync(resolve(import.meta.dirname, '../../fixtures/demo.project.json'), 'utf8');
const demo = (): ProjectFile => parseProjectFile(JSON.parse(demoText), 'demo');
const at = '2025-04-01T10:00:00.000Z';


describe('an empty project', () => {
  it('of each kind is a valid project file with one register of the kind’s ratios and no bars', () => {
    for (const kind of Object.keys(projectKinds) as (keyof typeof projectKinds)[]) {
      const project = emptyProject({ id: `p-${kind}`, name: `  My ${kind}  `, kind, lowestNote: 'F3', highestNote: 'C6', a4Hz: 442 });
      expect(project.bars).toEqual([]);
      expect(project.name).toBe(`My ${kind}`);
      expect(project.instrument.registers).toHaveLength(1);
      expect(project.instrument.registers[0]!.ratios).toEqual([...projectKinds[kind].ratios]);
      expect(project.instrument.registers[0]!.family).toBe(projectKinds[kind].family);
      // Round trip through the file format: the schema accepts it unchanged.
      expect(parseProjectFile(JSON.parse(serializeProjectFile(project)), 'round trip')).toEqual(project);
    }
  });

  it('takes the preset’s values as an editable material with its label', () => {
    const material = materialFromPreset('aluminium-6061-t6') as unknown as { E_GPa: number; label: string; G_GPa?: number };
    expect(material.E_GPa).toBeGreaterThan(60);
    expect(material.label).toMatch(/6061/);
    expect(material.G_GPa).toBeUndefined();
    expect(thrown(() => materialFromPreset('balsa')).message).toMatch(/material: preset: “balsa” is not one of the material presets/);
  });

  it('refuses an absurd range, an empty name and an A4 outside 300–600 Hz, naming the range', () => {
    const base = { id: 'p', name: 'Shop', kind: 'wooden-keyboard' as const, lowestNote: 'C4', highestNote: 'C6', a4Hz: 442 };
    expect(thrown(() => emptyProject({ ...base, lowestNote: 'C-1' })).message).toBe('range: lowest note: C-1 is outside A0–C8, the notes a bar can sound');
    expect(thrown(() => emptyProject({ ...base, highestNote: 'E8' })).message).toMatch(/highest note: E8 is outside A0–C8/);
    expect(thrown(() => emptyProject({ ...base, lowestNote: 'C6', highestNote: 'C4' })).message).toBe('range: highest note: C4 is below the lowest note C6');
    expect(thrown(() => emptyProject({ ...base, name: '   ' })).message).toBe('project: name: must hold 1–200 characters (it is empty)');
    expect(thrown(() => emptyProject({ ...base, name: 'x'.repeat(201) })).message).toBe('project: name: must hold 1–200 characters (it has 201)');
    expect(thrown(() => emptyProject({ ...base, a4Hz: 4420 })).message).toMatch(/outside 300–600 Hz/);
    expect(thrown(() => emptyProject({ ...base, name: 'shop ', otherNames: ['Shop'] })).message).toMatch(/“shop” is already the name of another project/);
  });
});

describe('project names', () => {
  it('are never silently the same as another project’s', () => {
    expect(uniqueProjectName('Shop', [])).toBe('Shop');
    expect(uniqueProjectName('Shop', ['shop'])).toBe('Shop (2)');
    expect(uniqueProjectName('Shop', ['Shop', 'Shop (2)'])).toBe('Shop (3)');
    // A copy of "Shop (2)" does not become "Shop (2) (2)".
    expect(uniqueProjectName('Shop (2)', ['Shop', 'Shop (2)'])).toBe('Shop (3)');
    expect(uniqueProjectName('x'.repeat(200), ['x'.repeat(200)])).toHaveLength(200);
    expect(checkProjectName('  Two   spaces ')).toBe('Two spaces');
  });

  it('rename checks the length and the other projects’ names', () => {
    const project = demo();
    expect(renameProject(project, ' Workshop 2 ').name).toBe('Workshop 2');
    expect(thrown(() => renameProject(project, 'Other', ['other'])).rule).toMatch(/already the name of another project/);
    expect(thrown(() => renameProject(project, '')).rule).toBe('must hold 1–200 characters (it is empty)');
  });

  it('a copy keeps every bar and round under a new id and a free name', () => {
    const project = demo();
    const copy = duplicateProject(project, { id: 'project-copy', takenNames: [project.name, `${project.name} (copy)`] });
    expect(copy.id).toBe('project-copy');
    expect(copy.name).toBe(`${project.name} (copy) (2)`);
    expect(copy.bars).toEqual(project.bars);
    expect(copy.revision).toBe(0);
    expect(copy.saved_at).toBeNull();
    copy.bars[0]!.notes = 'changed';
    expect(project.bars[0]!.notes).not.toBe('changed');
  });
});

describe('the range of notes', () => {
  it('lists every semitone, spelt as asked', () => {
    expect(notesInRange('A3', 'C4')).toEqual(['A3', 'A#3', 'B3', 'C4']);
    expect(notesInRange('A3', 'C4', 'flat')).toEqual(['A3', 'Bb3', 'B3', 'C4']);
  });

  it('can be edited, but never so that a keyboard bar falls outside it', () => {
    const project = demo();
    const wider = setInstrumentRange(project, 'F2', 'C7');
    expect(wider.instrument.lowest_note).toBe('F2');
    const refusal = thrown(() => setInstrumentRange(project, 'C3', 'C7'));
    expect(refusal.message).toBe('range: lowest note: A2 would lie outside C3–C7; remove that bar first or choose a wider range');
    expect(thrown(() => setInstrumentRange(project, 'A2', 'C6')).rule).toMatch(/^C7 would lie outside A2–C6/);
  });

  it('an empty project takes bars within its range', () => {
    const project = emptyProject({ id: 'p', name: 'Shop', kind: 'wooden-keyboard', lowestNote: 'C4', highestNote: 'C6', a4Hz: 442 });
    const { project: next } = addBar(project, { note: 'C4', at });
    expect(next.bars.map((bar) => bar.note)).toEqual(['C4']);
    expect(() => serializeProjectFile(next)).not.toThrow();
  });
});
