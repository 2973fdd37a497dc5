// Adding, removing, ordering and naming bars: each edit returns a new valid project (the input
// unchanged), a suggested blank follows the physics it claims, and refusals name the field and rule.
import { readFileSync } from 'node:fs';
import { resolve } from 'node:path';
import { describe, expect, it } from 'vitest';
import {
  chimeLengthMm,
  projectChimeSet,
  addBar,
  addBarsFromPlan,
  addBarsInRange,
  analyzeBar,
  barMaterialFamily,
  barName,
  barTargetHz,
  describePlannedBar,
  emptyProject,
  keyboardFileFromProject,
  moveBar,
  noteToHz,
  parseProjectFile,
  registerForNote,
  removeBar,
  renameBar,
  restoreBar,
  serializeProjectFile,
  sortBarsByPitch,
  suggestBlank,
  type KeyboardPlan,
  type ProjectFile,
} from '../../src/index.ts';
import { thrown } from './thrownInputError.ts';

const demoText = readFileSync(resolve(import.meta.dirname, '../../fixtures/demo.project.json'), 'utf8');
const demo = (): ProjectFile => parseProjectFile(JSON.parse(demoText), 'demo');
const at = '2025-04-01T10:00:00.000Z';
const notes = (project: ProjectFile) => project.bars.map((bar) => bar.note);


/** The project survives the file format unchanged (the schema accepts every edit's result). */
function roundTrips(project: ProjectFile): void {
  expect(parseProjectFile(JSON.parse(serializeProjectFile(project)), 'round trip')).toEqual(project);
}

describe('adding bars', () => {
  it('a new project gets three bars, renamed, one removed and put back, one moved', () => {
    let project = emptyProject({ id: 'p', name: 'Shop', kind: 'wooden-keyboard', lowestNote: 'C4', highestNote: 'C6', a4Hz: 442 });
    for (const note of ['C4', 'E4', 'G4']) project = addBar(project, { note, at }).project;
    expect(notes(project)).toEqual(['C4', 'E4', 'G4']);
    expect(project.bars.map((bar) => bar.id)).toEqual(['bar-C4', 'bar-E4', 'bar-G4']);
    for (const bar of project.bars) {
      expect(bar.state).toBe('not-started');
      expect(bar.session.steps).toEqual([]);
      expect(bar.session.target).toEqual({ note: bar.note, a4: 442, ratios: [1, 4, 10], tolerance_cents: [2, 5, 15], playing_temperature_c: 20 });
      // Advice keeps a quarter of the blank (the designer's default thinnest point).
      expect(bar.session.limits.min_thickness_mm).toBe(5);
    }
    roundTrips(project);

    project = renameBar(project, 'bar-E4', { name: 'E4 from the second board' }, at);
    project = renameBar(project, 'bar-G4', { note: 'F#4' }, at);
    expect(barName(project.bars[1]!)).toBe('E4 from the second board');
    // A bar named after its note follows a new note; its target follows too.
    expect(barName(project.bars[2]!)).toBe('F#4');
    expect(barTargetHz(project, project.bars[2]!)[0]).toBeCloseTo(noteToHz('F#4', 442), 9);

    const before = structuredClone(project);
    const { project: without, removed } = removeBar(project, 'bar-C4');
    expect(project).toEqual(before);
    expect(notes(without)).toEqual(['E4', 'F#4']);
    roundTrips(without);
    expect(notes(restoreBar(without, removed))).toEqual(['C4', 'E4', 'F#4']);

    const moved = moveBar(without, 'bar-G4', 0);
    expect(notes(moved)).toEqual(['F#4', 'E4']);
    expect(notes(sortBarsByPitch(moved))).toEqual(['E4', 'F#4']);
    expect(thrown(() => moveBar(without, 'bar-G4', 5)).message).toBe('project: position: must be a whole number from 1 to 2');
  });

  it('refuses a note outside A0–C8, a note the register already has, and a blank that breaks the bar-file rules', () => {
    const project = demo();
    expect(thrown(() => addBar(project, { note: 'C9', at })).message).toBe('bar: note: C9 is outside A0–C8, the notes a bar can sound');
    expect(thrown(() => addBar(project, { note: 'H3', at })).message).toMatch(/^bar: note: "H3" is not a note name/);
    expect(thrown(() => addBar(project, { note: 'A2', at })).message).toBe('bar: note: Bass (A2–B3) already has a bar A2; rename that one or choose another note');
    // Enharmonic: Bb3 in a register that has A#3 would be the same bar.
    const withSharp = addBar(project, { note: 'A#3', at }).project;
    expect(thrown(() => addBar(withSharp, { note: 'Bb3', at })).rule).toMatch(/already has a bar A#3/);
    const blank = { ...project.bars[0]!.blank, section: { shape: 'rect' as const, width_mm: 50, thickness_mm: -2 } };
    expect(thrown(() => addBar(project, { note: 'B2', blank, at })).message).toMatch(/^blank: section\.thickness_mm: must be greater than 0 mm/);
    expect(thrown(() => addBar(project, { note: 'B2', name: 'x'.repeat(81), at })).message).toBe('bar: name: must hold 1–80 characters (it has 81)');
    expect(thrown(() => renameBar(project, 'bar-A3', { note: 'E3' }, at)).message).toBe('bar: note: Bass (A2–B3) already has a bar E3');
  });

  it('puts a new bar in its register, in pitch order, with a blank scaled from its nearest bar', () => {
    const project = demo();
    expect(registerForNote(project, 50).id).toBe('bass');
    expect(registerForNote(project, 70).id).toBe('middle');
    const { project: next, barId } = addBar(project, { note: 'C3', at });
    expect(notes(next).slice(0, 3)).toEqual(['A2', 'C3', 'E3']);
    const added = next.bars.find((bar) => bar.id === barId)!;
    expect(added.register).toBe('bass');
    // Nearest bass bar is A2 (3 semitones below; E3 is 4 above): 554 mm × 2^(−3/24) = 508.0 mm.
    const a2 = project.bars.find((bar) => bar.note === 'A2')!;
    expect(added.blank.length_mm).toBe(Math.round(a2.blank.length_mm * 2 ** (-3 / 24)));
    expect(added.blank.section).toEqual(a2.blank.section);
    expect(added.current.profile_mm).toBeUndefined();
    roundTrips(next);
  });

  it('the length rule holds for a uniform bar: scaled by 2^(−n/24), it sounds n semitones higher (Euler–Bernoulli: f ∝ 1/L², Blevins 1979, table 8-1)', () => {
    const project = demo();
    // A bass bar four semitones above A3, the register's highest bar.
    const up = suggestBlank(project, 'C#4', 'bass');
    expect(up.scaledFrom).toBe('A3');
    const a3 = project.bars.find((bar) => bar.note === 'A3')!.blank;
    const exact = { ...up.blank, length_mm: a3.length_mm * 2 ** (-4 / 24) };
    const ratio = analyzeBar(exact, { theory: 'euler-bernoulli', modes: 1 }).bending[0]!.hz / analyzeBar(a3, { theory: 'euler-bernoulli', modes: 1 }).bending[0]!.hz;
    // Same mesh density per length: the discrete eigenvalue scales exactly, to rounding.
    expect(1200 * Math.log2(ratio)).toBeCloseTo(400, 6);
    // The suggestion rounds to whole mm: within 2 · 0.5/length of a relative error in pitch (< 5 cents here).
    expect(Math.abs(up.blank.length_mm - exact.length_mm)).toBeLessThanOrEqual(0.5);
  });

  it('a first chime tube gets the chime set\'s length for its note (the one computation: Timoshenko, Cowper\'s κ)', () => {
    const project = emptyProject({ id: 'p', name: 'Chimes', kind: 'chimes', lowestNote: 'C5', highestNote: 'C6', a4Hz: 442 });
    const suggestion = suggestBlank(project, 'G5', 'main');
    expect(suggestion.scaledFrom).toBeNull();
    expect(suggestion.blank.length_mm).toBe(chimeLengthMm(projectChimeSet(project), 'G5'));
    const heard = analyzeBar(suggestion.blank, { theory: 'timoshenko', modes: 1 }).bending[0]!.hz;
    // Rounded to 0.1 mm on ~430 mm: under 1 cent from the note (f ∝ 1/L²).
    expect(Math.abs(1200 * Math.log2(heard / noteToHz('G5', 442)))).toBeLessThan(1);
    // Euler–Bernoulli (no shear, no rotary inertia) hears the same tube sharp: a thin-walled tube is shear-soft (Cowper 1966).
    const bernoulli = analyzeBar(suggestion.blank, { theory: 'euler-bernoulli', modes: 1 }).bending[0]!.hz;
    expect(1200 * Math.log2(bernoulli / heard)).toBeGreaterThan(5);
    expect(1200 * Math.log2(bernoulli / heard)).toBeLessThan(60);
    expect(barMaterialFamily(suggestion.blank)).toBe('metal');
    expect(barMaterialFamily(demo().bars[0]!.blank)).toBe('timber');
  });

  it('adds a whole range, skipping notes the register has', () => {
    const project = demo();
    const { project: next, added, skipped } = addBarsInRange(project, { lowest: 'G2', highest: 'C3', at });
    expect(added).toEqual(['G2', 'G#2', 'A#2', 'B2', 'C3']);
    expect(skipped).toEqual(['A2']);
    expect(notes(next).slice(0, 7)).toEqual(['G2', 'G#2', 'A2', 'A#2', 'B2', 'C3', 'E3']);
    roundTrips(next);
    expect(thrown(() => addBarsInRange(project, { lowest: 'C3', highest: 'C2', at })).message).toBe('range: highest note: C2 is below the lowest note C3');
  });
});

describe('bars from the keyboard plan', () => {
  it('turns each planned note without a bar into a bar with the plan’s blank and its planned undercut', () => {
    // A plan record for E3 built from the demo's own E3 shape (describePlannedBar: the check the
    // keyboard plan stores), then the E3 bar removed: a planned note without a bar.
    const source = demo();
    const e3 = source.bars.find((bar) => bar.note === 'E3')!;
    const target = barTargetHz(source, e3);
    const planned = describePlannedBar(e3.current, { note: 'E3', midi: 52, index: 0, ratios: [1, 4, 10], tolerance_cents: [2, 5, 15], target_hz: target, feasible: false, predicted_hz: target, reason: 'synthetic record for the test' });
    const plan: KeyboardPlan = {
      format: 'barwright.keyboard-plan',
      version: 1,
      name: 'test',
      a4_hz: 442,
      range: { lowest: 'E3', highest: 'E3' },
      notes: ['E3'],
      advice: {},
      schedule: [{ note: 'E3', length_mm: e3.blank.length_mm } as KeyboardPlan['schedule'][number]],
      bars: { E3: { ...planned, fingerprint: 'test' } },
      summary: { bars: 1, designed: 1, in_tolerance: 0, out_of_tolerance: 1, infeasible: 0, advised: 0, complete: true },
      cautions: [],
    };
    const keyboard = keyboardFileFromProject(source, { lowest: 'E3', highest: 'E3', keepBlankLengths: true });
    const project = { ...removeBar(source, e3.id).project, keyboard_plan: { keyboard, plan, planned_at: at } };
    const { project: next, added } = addBarsFromPlan(project, at);
    expect(added).toEqual(['E3']);
    const bar = next.bars.find((candidate) => candidate.note === 'E3')!;
    expect(bar.blank.length_mm).toBe(planned.blank.length_mm);
    expect(bar.blank.section).toEqual({ shape: 'rect', width_mm: planned.blank.width_mm, thickness_mm: planned.blank.thickness_mm });
    expect(bar.current.profile_mm).toBeUndefined();
    expect(bar.design?.bar.profile_mm).toEqual(e3.current.profile_mm);
    expect(bar.design?.reason).toBe('synthetic record for the test');
    expect(notes(next).slice(0, 3)).toEqual(['A2', 'E3', 'A3']);
    roundTrips(next);
    // Run again: nothing left to add.
    expect(addBarsFromPlan(next, at).added).toEqual([]);
    expect(thrown(() => addBarsFromPlan(source, at)).message).toBe('plan: keyboard_plan: there is no keyboard plan yet: plan every bar first');
  });
});
