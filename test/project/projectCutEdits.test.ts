// Marking an advised cut as made (whole or in part), taking the mark back, and removing a round
// as the exact inverse of recording it.
import { readFileSync } from 'node:fs';
import { resolve } from 'node:path';
import { describe, expect, it } from 'vitest';
import { markCutDone, parseProjectFile, setBarBlank, partOfCut, recordStep, removeLastStep, serializeProjectFile, setAdvice, thicknessAtMm, undoMarkedCut, withStationThickness, type ProjectFile } from '../../src/index.ts';
import { thrown } from './thrownInputError.ts';

const demoText = readFileSync(resolve(import.meta.dirname, '../../fixtures/demo.project.json'), 'utf8');
const demo = (): ProjectFile => parseProjectFile(JSON.parse(demoText), 'demo');
const at = '2025-04-01T10:00:00.000Z';
const later = '2025-04-01T10:20:00.000Z';
const bar = (project: ProjectFile, id: string) => project.bars.find((entry) => entry.id === id)!;


/** The demo's A2 with an advised cut of 0.6 mm at station 12, and the shape that cut leaves. */
function advised() {
  const project = demo();
  const a2 = bar(project, 'bar-A2');
  const station = a2.current.profile_mm![12]!;
  const after = withStationThickness(a2.current, 12, station[1] - 0.6, 1);
  const withAdvice = setAdvice(project, 'bar-A2', { status: 'cut', bar_after: after, predicted_hz: [112, 447, 1110], checkpoints: [{ x_mm: station[0], thickness_mm: station[1] - 0.6 }] }, at);
  return { project: withAdvice, now: a2.current, after, station };
}

describe('a round removed and entered again', () => {
  it('is stored as it was the first time: cut as planned, with the prediction the cut was made for, and its checkpoints back', () => {
    const { project } = advised();
    const cut = markCutDone(project, 'bar-A2', at);
    const first = recordStep(cut, 'bar-A2', [113, 450, 1112], { at: later, predictedHz: [90, 300, 800] });
    const removed = removeLastStep(first, 'bar-A2', '2025-04-01T10:21:00.000Z');
    // The bar is back where the mark left it: expecting the advised sound, checkpoints waiting.
    expect(bar(removed, 'bar-A2').expected_hz).toEqual([112, 447, 1110]);
    expect(bar(removed, 'bar-A2').checkpoints).toEqual(bar(cut, 'bar-A2').checkpoints);
    const again = recordStep(removed, 'bar-A2', [113, 450, 1112], { at: '2025-04-01T10:22:00.000Z', predictedHz: [90, 300, 800] });
    const step = bar(again, 'bar-A2').session.steps.at(-1)!;
    const original = bar(first, 'bar-A2').session.steps.at(-1)!;
    expect(step.cut).toEqual({ made: 'as-planned' });
    expect(step.predicted_hz).toEqual([112, 447, 1110]);
    expect({ ...step, recorded_at: '' }).toEqual({ ...original, recorded_at: '' });
    expect(() => serializeProjectFile(again)).not.toThrow();
  });

  it('after a hand cut stays a hand cut', () => {
    const { project } = advised();
    const round = recordStep(project, 'bar-A2', [117, 455, 1110], { at: later });
    const removed = removeLastStep(round, 'bar-A2', later);
    expect(bar(removed, 'bar-A2').expected_hz).toBeUndefined();
    expect(bar(removed, 'bar-A2').session.steps).toHaveLength(bar(project, 'bar-A2').session.steps.length);
  });
});

describe('part of an advised cut', () => {
  it('takes the share of every depth off, and the next round records it as planned with the part in its note', () => {
    const { project, now, after, station } = advised();
    const half = markCutDone(project, 'bar-A2', at, { percent: 50 });
    const shape = bar(half, 'bar-A2').current;
    // Halfway between the thickness now and after, at the cut station and elsewhere (linear in the share).
    expect(thicknessAtMm(shape, station[0])).toBeCloseTo(station[1] - 0.3, 9);
    for (const x of [0, 37.5, 150, now.length_mm]) expect(thicknessAtMm(shape, x)).toBeCloseTo((thicknessAtMm(now, x) + thicknessAtMm(after, x)) / 2, 3);
    expect(bar(half, 'bar-A2').expected_hz).toBeUndefined();
    expect(bar(half, 'bar-A2').checkpoints).toEqual([{ x_mm: station[0], thickness_mm: Number((station[1] - 0.3).toFixed(2)) }]);
    const round = recordStep(half, 'bar-A2', [113, 450, 1112], { at: later });
    expect(bar(round, 'bar-A2').session.steps.at(-1)!.cut).toEqual({ made: 'as-planned', note: 'part of the advised cut: 50 % of each depth' });
    expect(bar(round, 'bar-A2').session.steps.at(-1)!.bar).toEqual(shape);
    // Removed and entered again: the part made comes back with it.
    const removed = removeLastStep(round, 'bar-A2', later);
    expect(bar(removed, 'bar-A2').cut_note).toBe('part of the advised cut: 50 % of each depth');
    expect(() => serializeProjectFile(round)).not.toThrow();
  });

  it('refuses a share outside 10–100 % and a shortening cut made in part', () => {
    const { project, now } = advised();
    expect(thrown(() => markCutDone(project, 'bar-A2', at, { percent: 5 })).rule).toBe('must lie within 10–100 %');
    expect(thrown(() => markCutDone(project, 'bar-A2', at, { percent: 150 })).rule).toBe('must lie within 10–100 %');
    const shorter = { ...now, length_mm: now.length_mm - 2, profile_mm: [[0, 20], [now.length_mm - 2, 20]] as [number, number][] };
    expect(thrown(() => partOfCut(now, shorter, 0.5)).rule).toMatch(/shortens the bar/);
    // The whole share is the advised shape itself, the zero share the bar now (at every station).
    const { after } = advised();
    for (const [x] of after.profile_mm!) {
      expect(thicknessAtMm(partOfCut(now, after, 1), x)).toBeCloseTo(thicknessAtMm(after, x), 9);
      expect(thicknessAtMm(partOfCut(now, after, 0), x)).toBeCloseTo(thicknessAtMm(now, x), 9);
    }
  });
});

describe('taking back "I made this cut"', () => {
  it('puts the bar back with its advice, and the lots as they were; refused once a round was recorded', () => {
    const { project } = advised();
    const before = { bar: structuredClone(bar(project, 'bar-A2')), lots: structuredClone(project.lots) };
    const cut = markCutDone(project, 'bar-A2', at);
    const undone = undoMarkedCut(cut, before, later);
    expect({ ...bar(undone, 'bar-A2'), updated_at: '' }).toEqual({ ...bar(project, 'bar-A2'), updated_at: '' });
    expect(undone.lots).toEqual(project.lots);
    const struck = recordStep(cut, 'bar-A2', [113, 450, 1112], { at: later });
    expect(thrown(() => undoMarkedCut(struck, before, later)).rule).toMatch(/remove that round first/);
  });
});

describe('a blank beyond what any blank can be', () => {
  it('is refused by the edit with the field and its range (width 100000 mm, E 1 000 000 GPa)', () => {
    const project = demo();
    const blank = bar(project, 'bar-E3').blank;
    const section = blank.section;
    if (section.shape !== 'rect') throw new Error('the demo E3 is a rectangular bar');
    const wide = thrown(() => setBarBlank(project, 'bar-E3', { ...blank, section: { ...section, width_mm: 100000 } }, at));
    expect([wide.field, wide.rule]).toEqual(['section.width_mm', 'must lie within 5–300 mm']);
    const stiff = thrown(() => setBarBlank(project, 'bar-E3', { ...blank, material: { E_GPa: 1e6, G_GPa: 1, density_kg_m3: 900 } }, at));
    expect([stiff.field, stiff.rule]).toEqual(['material.E_GPa', 'must lie within 0.5–450 GPa']);
    expect(() => setBarBlank(project, 'bar-E3', blank, at)).not.toThrow();
  });
});
