// The project file: the demo validates and round-trips, every bad field is named with its rule,
// older versions migrate, and nothing non-finite is ever written.
import { readFileSync } from 'node:fs';
import { resolve } from 'node:path';
import { describe, expect, it } from 'vitest';
import {
  InputError,
  checkProjectFile,
  exportBarFile,
  exportSessionFile,
  migrateProjectFile,
  parseBarFile,
  parseProjectFile,
  parseSessionFile,
  readProjectFileText,
  serializeProjectFile,
  type ProjectFile,
} from '../../src/index.ts';

const demoPath = resolve(import.meta.dirname, '../../fixtures/demo.project.json');
const demoText = readFileSync(demoPath, 'utf8');
const demo = (): Record<string, any> => JSON.parse(demoText);

function problem(value: unknown): InputError {
  try {
    parseProjectFile(value, 'test.project.json');
  } catch (error) {
    if (error instanceof InputError) return error;
    throw error;
  }
  throw new Error('expected the project to be refused');
}

/** Writes a current-version project in the version-1 layout (the inverse of the 1 → 2 migration). */
function asVersion1(project: ProjectFile): Record<string, unknown> {
  const names: Record<string, string> = { 'not-started': 'new', rough: 'cut', tuning: 'tuning', done: 'finished' };
  const { instrument, bars, id: _id, revision: _revision, saved_at: _saved, ...rest } = structuredClone(project);
  const { a4_hz, resonator_end: _end, ...instrumentRest } = instrument;
  return {
    ...rest,
    version: 1,
    a4_hz,
    instrument: instrumentRest,
    bars: bars.map(({ current, state, design: _design, advice: _advice, updated_at: _updated, ...bar }) => ({ ...bar, shape: current, status: names[state] })),
  };
}

describe('project file', () => {
  it('reads the demo project and writes it back unchanged', () => {
    const project = readProjectFileText(demoText, 'demo.project.json');
    expect(project.format).toBe('barwright.project');
    expect(project.version).toBe(2);
    expect(project.instrument.a4_hz).toBe(442);
    const again = readProjectFileText(serializeProjectFile(project), 'again');
    expect(again).toEqual(project);
  });

  it('exports every bar and session in the contract formats the CLI parses', () => {
    const project = parseProjectFile(demo(), 'demo');
    for (const bar of project.bars) {
      expect(() => parseBarFile(exportBarFile(bar), `${bar.note}.bar.json`)).not.toThrow();
      const session = exportSessionFile(bar);
      expect(session.format).toBe('barwright.session');
      expect(() => parseSessionFile(session, `${bar.note}.session.json`)).not.toThrow();
    }
  });

  it('names the field and the rule of a profile thicker than its blank, and the bar it belongs to', () => {
    const value = demo();
    value.bars[0].current.profile_mm[3][1] = 30;
    const error = problem(value);
    expect(error.field).toBe('bars[0].current.profile_mm[3]');
    expect(error.rule).toMatch(/exceeds the blank's 24 mm/);
    expect(error.rule).toMatch(/bar A2/);
  });

  it('counts further problems after the first', () => {
    const value = demo();
    value.bars[1].blank.length_mm = -5;
    value.bars[2].session.steps[0].measured_hz[0] = 0;
    const check = checkProjectFile(value, 'two.json');
    expect(check.ok).toBe(false);
    if (check.ok) return;
    expect(check.errors.map((error) => error.field)).toEqual(expect.arrayContaining(['bars[1].blank.length_mm', expect.stringMatching(/^bars\[2\]\.session\.steps\[0\]\.measured_hz/)]));
    expect(problem(value).rule).toMatch(/and \d+ more problem/);
  });

  it('refuses what is not a project, a newer version, broken references and duplicate ids', () => {
    expect(problem({ format: 'barwright.bar', version: 1 }).field).toBe('format');
    const newer = demo();
    newer.version = 3;
    expect(problem(newer).rule).toMatch(/newer than this barwright reads/);
    const missingRegister = demo();
    missingRegister.bars[0].register = 'nowhere';
    expect(problem(missingRegister).field).toBe('bars[0].register');
    const twice = demo();
    twice.bars[1].id = twice.bars[0].id;
    expect(problem(twice).rule).toMatch(/used twice/);
    const badNote = demo();
    badNote.bars[0].note = 'H2';
    expect(problem(badNote).field).toBe('bars[0].note');
    const badA4 = demo();
    badA4.instrument.a4_hz = 1000;
    expect(problem(badA4).field).toBe('instrument.a4_hz');
    expect(() => readProjectFileText('{ not json', 'broken.json')).toThrow(/broken\.json: \(file\): is not valid JSON/);
  });

  it('never writes NaN or infinite numbers', () => {
    const project = parseProjectFile(demo(), 'demo');
    project.bars[0]!.session.steps[0]!.measured_hz[1] = Number.NaN;
    expect(() => serializeProjectFile(project, 'save')).toThrow(/bars\[0\]\.session\.steps\[0\]\.measured_hz\[1\]: is NaN/);
    project.bars[0]!.session.steps[0]!.measured_hz[1] = Number.POSITIVE_INFINITY;
    expect(() => serializeProjectFile(project, 'save')).toThrow(/is Infinity/);
  });

  it('migrates a version-1 file to the current version without touching the input', () => {
    const current = parseProjectFile(demo(), 'demo');
    const old = asVersion1(current);
    const frozen = JSON.stringify(old);
    const migrated = parseProjectFile(old, 'old.project.json');
    expect(JSON.stringify(old)).toBe(frozen);
    expect(migrated.version).toBe(2);
    expect(migrated.revision).toBe(0);
    expect(migrated.instrument.a4_hz).toBe(442);
    expect(migrated.instrument.resonator_end).toBe('unflanged');
    expect(migrated.bars.map((bar) => bar.state)).toEqual(current.bars.map((bar) => bar.state));
    expect(migrated.bars.map((bar) => bar.current)).toEqual(current.bars.map((bar) => bar.current));
    expect(migrated.bars.map((bar) => bar.session)).toEqual(current.bars.map((bar) => bar.session));
    // The same name always gives the same id (a stable hash), so re-importing finds it.
    expect(parseProjectFile(asVersion1(current), 'again').id).toBe(migrated.id);
    expect(migrateProjectFile(old, 'x')).not.toBe(old);
  });
});
