// Edits of a project: each returns a new valid project, never adds wood, keeps targets in step
// with the instrument, and refuses bad input with the field and the rule.
import { readFileSync } from 'node:fs';
import { resolve } from 'node:path';
import fc from 'fast-check';
import { describe, expect, it } from 'vitest';
import {
  assertNoMaterialAdded,
  barTargetHz,
  comparePartials,
  markCutDone,
  parseProjectFile,
  parseRatioText,
  parseToleranceText,
  recordStep,
  removeLastStep,
  serializeProjectFile,
  setAdvice,
  setBarBlank,
  setBarShape,
  thicknessAtMm,
  updateInstrument,
  updateRegister,
  withSmoothDepthChange,
  withStationThickness,
  withStations,
  type BarFile,
  type ProjectFile,
} from '../../src/index.ts';
import { thrown } from './thrownInputError.ts';

const demoText = readFileSync(resolve(import.meta.dirname, '../../fixtures/demo.project.json'), 'utf8');
const demo = (): ProjectFile => parseProjectFile(JSON.parse(demoText), 'demo');
const at = '2025-04-01T10:00:00.000Z';
const bar = (project: ProjectFile, id: string) => project.bars.find((entry) => entry.id === id)!;


describe('project edits', () => {
  it('records a round against the bar as it is now, without changing the input project', () => {
    const project = demo();
    const before = JSON.stringify(project);
    const next = recordStep(project, 'bar-A4', [770.2, 1960.5, 3475.0], { at, source: 'typed' });
    expect(JSON.stringify(project)).toBe(before);
    const entry = bar(next, 'bar-A4');
    expect(entry.state).toBe('tuning');
    expect(entry.session.steps).toHaveLength(1);
    expect(entry.session.steps[0]!.bar).toEqual(entry.current);
    expect(entry.session.steps[0]!.measured_hz).toEqual([770.2, 1960.5, 3475.0]);
    expect(() => serializeProjectFile(next)).not.toThrow();
    const undone = removeLastStep(next, 'bar-A4', at);
    expect(bar(undone, 'bar-A4').session.steps).toHaveLength(0);
  });

  it('refuses partials that do not rise, naming the partial', () => {
    const error = thrown(() => recordStep(demo(), 'bar-A4', [770, 700], { at }));
    expect(error.field).toBe('partial 2');
    expect(error.rule).toMatch(/higher than partial 1/);
    expect(thrown(() => recordStep(demo(), 'bar-A4', [], { at })).rule).toMatch(/fundamental/);
  });

  it('marks an advised cut done by taking its shape, and never accepts added wood', () => {
    const project = demo();
    const a2 = bar(project, 'bar-A2');
    const after = withStationThickness(a2.current, 12, a2.current.profile_mm![12]![1] - 0.5, 6);
    const advised = setAdvice(project, 'bar-A2', { status: 'cut', bar_after: after, predicted_hz: [112, 447, 1110] }, at);
    const cut = markCutDone(advised, 'bar-A2', at);
    expect(bar(cut, 'bar-A2').current).toEqual(after);
    expect(bar(cut, 'bar-A2').expected_hz).toEqual([112, 447, 1110]);
    // The next round remembers what was expected and that the cut followed the advice.
    const measured = recordStep(cut, 'bar-A2', [113, 450, 1112], { at: '2025-04-02T10:00:00.000Z' });
    const step = bar(measured, 'bar-A2').session.steps.at(-1)!;
    expect(step.predicted_hz).toEqual([112, 447, 1110]);
    expect(step.cut).toEqual({ made: 'as-planned' });
    const thicker = withStationThickness(a2.current, 12, a2.current.profile_mm![12]![1] + 1, 6);
    expect(thrown(() => setAdvice(project, 'bar-A2', { status: 'cut', bar_after: thicker, predicted_hz: [110] }, at)).rule).toMatch(/cannot be put back/);
  });

  it('finds added wood between stations and on a longer bar', () => {
    const blank: BarFile = { format: 'barwright.bar', version: 1, length_mm: 300, section: { shape: 'rect', width_mm: 40, thickness_mm: 20 }, material: { E_GPa: 18, G_GPa: 1.3, density_kg_m3: 1000 } };
    const arched = { ...blank, profile_mm: [[0, 20], [100, 20], [150, 10], [200, 20], [300, 20]] as [number, number][] };
    const filled = { ...blank, profile_mm: [[0, 20], [140, 12], [160, 12], [300, 20]] as [number, number][] };
    expect(() => assertNoMaterialAdded(blank, arched)).not.toThrow();
    expect(() => assertNoMaterialAdded(arched, filled)).toThrow(/more than/);
    expect(() => assertNoMaterialAdded(arched, { ...arched, length_mm: 301, profile_mm: [[0, 20], [301, 20]] })).toThrow(/longer/);
    expect(thicknessAtMm(arched, 125)).toBeCloseTo(15, 12); // linear between stations (closed form)
  });

  it('re-targets every session when A4 or a register changes', () => {
    const moved = updateInstrument(demo(), { a4_hz: 440 });
    for (const entry of moved.bars) expect(entry.session.target.a4).toBe(440);
    expect(barTargetHz(moved, bar(moved, 'bar-A4'))[0]).toBeCloseTo(440, 9);
    const treble = updateRegister(moved, 'treble', { ratios: [1, 3, 6] });
    const c7 = bar(treble, 'bar-C7');
    expect(c7.session.target.ratios).toEqual([1, 3, 6]);
    expect(c7.session.target.tolerance_cents).toEqual([2, 5, 5]);
    expect(() => serializeProjectFile(treble)).not.toThrow();
  });

  it('reads ratios and tolerances the trade writes, refusing others with the rule', () => {
    expect(parseRatioText('1:4:10')).toEqual([1, 4, 10]);
    expect(parseRatioText(' 1 : 3 ')).toEqual([1, 3]);
    expect(thrown(() => parseRatioText('2:4')).rule).toMatch(/must be 1/);
    expect(thrown(() => parseRatioText('1:4:3')).rule).toMatch(/increase/);
    expect(thrown(() => parseRatioText('1:x')).rule).toMatch(/not a positive number/);
    expect(parseToleranceText('2, 5, 15', 3)).toEqual([2, 5, 15]);
    expect(thrown(() => parseToleranceText('2, 5', 3)).rule).toMatch(/one tolerance per ratio/);
  });

  it('lets an unmeasured bar follow its blank, and keeps a measured bar as measured', () => {
    const project = demo();
    const e3 = bar(project, 'bar-E3');
    const longer = setBarBlank(project, 'bar-E3', { ...e3.blank, length_mm: e3.blank.length_mm + 10 }, at);
    const followed = bar(longer, 'bar-E3');
    expect(followed.current.length_mm).toBe(e3.blank.length_mm + 10);
    expect(followed.current.profile_mm!.at(-1)![0]).toBe(e3.blank.length_mm + 10);
    const a2 = bar(project, 'bar-A2');
    const corrected = bar(setBarBlank(project, 'bar-A2', { ...a2.blank, length_mm: a2.blank.length_mm + 1 }, at), 'bar-A2');
    expect(corrected.current).toEqual(a2.current);
    const error = thrown(() => setBarBlank(project, 'bar-E3', { ...e3.blank, section: { shape: 'rect', width_mm: 60, thickness_mm: -1 } }, at));
    expect(error.field).toBe('section.thickness_mm');
  });

  it('starts an uncut blank with stations at most the spacing apart, all at full thickness', () => {
    const a4 = bar(demo(), 'bar-A4');
    const stationed = withStations(a4.current, 10);
    const profile = stationed.profile_mm!;
    expect(profile[0]![0]).toBe(0);
    expect(profile.at(-1)![0]).toBe(a4.current.length_mm);
    for (let i = 1; i < profile.length; i++) expect(profile[i]![0] - profile[i - 1]![0]).toBeLessThanOrEqual(10 + 1e-9);
    expect(profile.every(([, t]) => t === 20)).toBe(true);
    // Stations alone remove nothing: the bar is still not started. The first real cut makes it rough.
    const shaped = setBarShape(demo(), 'bar-A4', stationed, at);
    expect(bar(shaped, 'bar-A4').state).toBe('not-started');
    const cut = setBarShape(shaped, 'bar-A4', withStationThickness(stationed, 15, 18, 5), at);
    expect(bar(cut, 'bar-A4').state).toBe('rough');
  });

  it('moves neighbours by a raised cosine within the spread and leaves the rest (property)', () => {
    const start = withStations(bar(demo(), 'bar-A4').current, 10);
    const count = start.profile_mm!.length;
    fc.assert(
      fc.property(fc.integer({ min: 0, max: count - 1 }), fc.double({ min: -5, max: 40, noNaN: true }), fc.constantFrom(0, 15, 30, 60), (index, thickness, spread) => {
        const moved = withSmoothDepthChange(start, index, thickness, 5, spread);
        const centre = start.profile_mm![index]![0];
        const expectedCentre = Math.round(Math.min(20, Math.max(5, thickness)) * 100) / 100;
        expect(moved.profile_mm![index]![1]).toBeCloseTo(expectedCentre, 9);
        moved.profile_mm!.forEach(([x, t], i) => {
          expect(x).toBe(start.profile_mm![i]![0]);
          expect(t).toBeGreaterThanOrEqual(5 - 1e-9);
          expect(t).toBeLessThanOrEqual(20 + 1e-9);
          const distance = Math.abs(x - centre);
          if (i !== index && (spread === 0 || distance >= spread)) expect(t).toBe(start.profile_mm![i]![1]);
          if (i !== index && spread > 0 && distance < spread) {
            const weight = 0.5 * (1 + Math.cos((Math.PI * distance) / spread));
            // Rounded to 0.01 mm; 0.005 mm is half that step.
            expect(Math.abs(t - Math.min(20, Math.max(5, 20 + weight * (expectedCentre - 20))))).toBeLessThanOrEqual(0.005 + 1e-9);
          }
        });
      }),
      { numRuns: 200 },
    );
  });

  it('compares partials with their targets in signed cents and words', () => {
    // 1200·log2(2^(10/1200)) = 10 cents sharp exactly (closed form).
    const [sharp, flat, near, missing] = comparePartials([440 * 2 ** (10 / 1200), 880 * 2 ** (-7 / 1200), 1320 * 2 ** (1.5 / 1200), null], [440, 880, 1320, 1760], [2, 5, 2, 5]);
    expect(sharp!.cents).toBeCloseTo(10, 9);
    expect(sharp!.verdict).toBe('sharp');
    expect(flat!.cents).toBeCloseTo(-7, 9);
    expect(flat!.verdict).toBe('flat');
    expect(near!.verdict).toBe('in tune');
    expect(missing!.cents).toBeNull();
    expect(missing!.verdict).toBeNull();
  });
});
