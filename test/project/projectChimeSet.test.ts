// The chime set kept in the project: schema-checked, given to older files from their chime pieces,
// one computation of a chime's length shared by the set's plan and the project's pieces.
import { readFileSync } from 'node:fs';
import { resolve } from 'node:path';
import { describe, expect, it } from 'vitest';
import {
  addMissingChimePieces,
  chimeLengthMm,
  chimePieces,
  chimeSetPieceRows,
  checkProjectFile,
  emptyProject,
  planChimeSet,
  projectChimeSet,
  readProjectFileText,
  serializeProjectFile,
  setChimeSet,
  updateInstrument,
} from '../../src/index.ts';

const demoText = readFileSync(resolve(import.meta.dirname, '../../fixtures/demo.project.json'), 'utf8');
const demo = () => readProjectFileText(demoText, 'demo.project.json');

describe('the chime set in the project', () => {
  it('gives the demo\'s chime pieces the set\'s lengths: one computation (planChimeSet and chimeLengthMm agree to 0.1 mm)', () => {
    const project = demo();
    const set = projectChimeSet(project);
    const plan = planChimeSet(set);
    for (const row of plan.chimes) expect(chimeLengthMm(set, row.note)).toBe(Math.round(row.length_mm * 10) / 10);
    const rows = chimeSetPieceRows(project, plan.chimes);
    expect(rows.filter((row) => row.piece).map((row) => [row.note, row.piece!.length_mm, row.agrees])).toEqual([
      ['C5', 533.6, true],
      ['E5', 474.6, true],
      ['G5', 434.5, true],
    ]);
    expect(rows.filter((row) => !row.piece).map((row) => row.note)).toEqual(['D5', 'A5', 'C6']);
  });

  it('gives an older file without a chime set one from its chime pieces (notes, stock, the project\'s A4)', () => {
    const raw = JSON.parse(demoText) as Record<string, unknown>;
    delete raw.chime_set;
    const check = checkProjectFile(raw, 'old.project.json');
    expect(check.ok).toBe(true);
    const project = (check as { ok: true; project: ReturnType<typeof demo> }).project;
    expect(project.chime_set?.notes).toEqual(['C5', 'E5', 'G5']);
    expect(project.chime_set?.stock.section).toEqual({ shape: 'tube', outer_diameter_mm: 25.4, wall_mm: 1.6 });
    expect(project.chime_set?.a4_hz).toBe(442);
    // The same stock: every piece is the set's length for its note.
    const rows = chimeSetPieceRows(project, planChimeSet(projectChimeSet(project)).chimes);
    expect(rows.every((row) => row.agrees)).toBe(true);
    // A keyboard-only file gets none.
    const keyboardOnly = JSON.parse(demoText) as { chime_set?: unknown; bars: { register: string }[] };
    delete keyboardOnly.chime_set;
    keyboardOnly.bars = keyboardOnly.bars.filter((bar) => bar.register !== 'chimes');
    const checked = checkProjectFile(keyboardOnly, 'keyboard.project.json');
    expect(checked.ok && checked.project.chime_set).toBeUndefined();
  });

  it('refuses a chime set that breaks the chime-set rules, naming the field', () => {
    const raw = JSON.parse(demoText) as { chime_set: { notes: string[] } };
    raw.chime_set.notes[1] = 'H5';
    const check = checkProjectFile(raw, 'bad.project.json');
    expect(check.ok).toBe(false);
    expect(!check.ok && check.errors[0]!.field).toBe('chime_set.notes[1]');
    expect(() => setChimeSet(demo(), { ...demo().chime_set, stock: { section: { shape: 'tube', outer_diameter_mm: 25.4, wall_mm: 20 }, material: { preset: 'aluminium-6061-t6' } } })).toThrow(/chime set: stock\.section/);
  });

  it('stores an edited set at the project\'s A4, through save and reload; follows the project\'s A4', () => {
    let project = setChimeSet(demo(), { ...demo().chime_set, a4_hz: 440, notes: ['C5', 'D6'] });
    expect(project.chime_set?.a4_hz).toBe(442);
    project = readProjectFileText(serializeProjectFile(project), 'saved');
    expect(project.chime_set?.notes).toEqual(['C5', 'D6']);
    const at443 = updateInstrument(project, { a4_hz: 443 });
    // A4 up by 1 Hz (3.9 cents): every chime about 0.11 % shorter (f ∝ 1/L², so L ∝ f^−½).
    const ratio = chimeLengthMm(projectChimeSet(at443), 'C5') / chimeLengthMm(projectChimeSet(project), 'C5');
    expect(ratio).toBeCloseTo(Math.sqrt(442 / 443), 3);
  });

  it('adds the notes without a piece as pieces cut at the set\'s lengths; a project without a chime register cannot', () => {
    const project = setChimeSet(demo(), { ...demo().chime_set, notes: ['C5', 'E5', 'G5', 'D6'] });
    const { project: next, added } = addMissingChimePieces(project, '2025-04-01T10:00:00.000Z');
    expect(added).toEqual(['D6']);
    const d6 = chimePieces(next).find((bar) => bar.note === 'D6')!;
    expect(d6.blank.length_mm).toBe(chimeLengthMm(projectChimeSet(next), 'D6'));
    expect(d6.session.target.ratios).toEqual([1]);
    expect(addMissingChimePieces(next, '2025-04-01T10:00:00.000Z').added).toEqual([]);
    const keyboard = emptyProject({ id: 'k', name: 'Keys', kind: 'wooden-keyboard', lowestNote: 'C4', highestNote: 'C5', a4Hz: 442 });
    expect(() => addMissingChimePieces(keyboard, 't')).toThrow(/no chime register/);
  });
});
