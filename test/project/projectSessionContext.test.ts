// A bar's session in the project: the air temperature and caliper readings go with a round, the
// time a cut was finished is kept until the next round records it, readings are shown at the
// instrument's playing temperature, bar and tube drift apart per °C, and lots keep what finished
// bars taught (validated on load, by name in the message).
import { readFileSync } from 'node:fs';
import { resolve } from 'node:path';
import { describe, expect, it } from 'vitest';
import {
  barCalibrationInputs,
  barLotPrior,
  barTemperature,
  lastReadingAtPlayingHz,
  markCutDone,
  parseProjectFile,
  projectLots,
  recordLotLearning,
  recordStep,
  serializeProjectFile,
  setAdvice,
  setBarLot,
  temperatureDrift,
  updateInstrument,
  withStationThickness,
  type LotBarRecord,
  type ProjectFile,
} from '../../src/index.ts';
import { thrown } from './thrownInputError.ts';

const demoText = readFileSync(resolve(import.meta.dirname, '../../fixtures/demo.project.json'), 'utf8');
const demo = (): ProjectFile => parseProjectFile(JSON.parse(demoText), 'demo');
const bar = (project: ProjectFile, id: string) => project.bars.find((entry) => entry.id === id)!;


/** The message a project file is refused with on load. */
function refusal(value: unknown): string {
  try {
    parseProjectFile(value, 'shop.project.json');
  } catch (error) {
    return (error as Error).message;
  }
  return 'accepted';
}

/** Invented lot records (demo data): E in GPa at a density of 1000 kg/m³. */
function record(barId: string, note: string, E_GPa: number): LotBarRecord {
  return { bar: barId, note, learnt_at: '2025-03-03T12:00:00Z', steps: 5, E_GPa, G_GPa: E_GPa / 15, density_kg_m3: 1000, E_uncertainty_percent: 0.4, G_uncertainty_percent: 2, correction_per_depth: [-0.05, -0.07, -0.08], correction_sigma: [0.004, 0.004, 0.004], arch_depth: 0.6 };
}

/** Step k's fundamental (read at `celsius`) moved to the playing temperature, in cents from 442 Hz. */
function centsAtPlaying(project: ProjectFile, k: number, celsius: number): number {
  const a4 = bar(project, 'bar-A4');
  const temperature = barTemperature(project, a4)!;
  expect(temperature.readingC[k]).toBe(celsius);
  return 1200 * Math.log2(a4.session.steps[k]!.measured_hz[0]! / 442) + temperature.shiftCents[k]!;
}

describe('a round in the project', () => {
  it('records the air temperature and caliper readings with it, and refuses an air temperature out of range by name', () => {
    const project = recordStep(demo(), 'bar-A4', [440, 1758, 4400], { at: '2025-04-01T10:00:00.000Z', airTemperatureC: 27, measuredThicknessMm: [[100, 20.5], [200, 18.25]] });
    const step = bar(project, 'bar-A4').session.steps.at(-1)!;
    expect(step.air_temperature_c).toBe(27);
    expect(step.measured_thickness_mm).toEqual([[100, 20.5], [200, 18.25]]);
    // Round-trips through the project file unchanged.
    expect(parseProjectFile(JSON.parse(serializeProjectFile(project)), 'again')).toEqual(project);
    const error = thrown(() => recordStep(demo(), 'bar-A4', [440], { at: '2025-04-01T10:00:00.000Z', airTemperatureC: 75 }));
    expect(error.field).toBe('air_temperature_c');
    expect(error.rule).toMatch(/outside −30 to 60 °C/);
  });

  it('records the twisting and sideways modes heard with it, kept through the project file; refuses one at or below the fundamental or at 20 kHz by the session file’s rule', () => {
    const project = recordStep(demo(), 'bar-A4', [440, 1758, 4400], { at: '2025-04-01T10:00:00.000Z', torsionHz: 1320.5, lateralHz: 2210 });
    const step = bar(project, 'bar-A4').session.steps.at(-1)!;
    expect(step.measured_torsion_hz).toBe(1320.5);
    expect(step.measured_lateral_hz).toBe(2210);
    expect(parseProjectFile(JSON.parse(serializeProjectFile(project)), 'again')).toEqual(project);
    // Without them, the step has neither field (files without them behave as before).
    const plain = bar(recordStep(demo(), 'bar-A4', [440], { at: '2025-04-01T10:00:00.000Z' }), 'bar-A4').session.steps.at(-1)!;
    expect('measured_torsion_hz' in plain || 'measured_lateral_hz' in plain).toBe(false);
    const low = thrown(() => recordStep(demo(), 'bar-A4', [440, 1758], { at: '2025-04-01T10:00:00.000Z', torsionHz: 440 }));
    expect(low.field).toBe('measured_torsion_hz');
    expect(low.rule).toBe('440 Hz must lie above the fundamental (440 Hz) and below 20 000 Hz');
    const high = thrown(() => recordStep(demo(), 'bar-A4', [440, 1758], { at: '2025-04-01T10:00:00.000Z', lateralHz: 20_000 }));
    expect(high.field).toBe('measured_lateral_hz');
  });

  it('keeps when an advised cut was finished and its checkpoints until the next round, which records the time; a re-strike does not', () => {
    const project = demo();
    const a2 = bar(project, 'bar-A2');
    const after = withStationThickness(a2.current, 12, a2.current.profile_mm![12]![1] - 0.5, 6);
    const checkpoints = [{ x_mm: 100, thickness_mm: 14 }, { x_mm: 180, thickness_mm: 9.5 }, { x_mm: 260, thickness_mm: 14 }];
    const advised = setAdvice(project, 'bar-A2', { status: 'cut', bar_after: after, predicted_hz: [112, 447, 1110], checkpoints }, '2025-04-01T10:00:00.000Z');
    const cut = markCutDone(advised, 'bar-A2', '2025-04-01T10:05:00.000Z');
    expect(bar(cut, 'bar-A2').cut_finished_at).toBe('2025-04-01T10:05:00.000Z');
    expect(bar(cut, 'bar-A2').checkpoints).toEqual(checkpoints);
    const struck = recordStep(cut, 'bar-A2', [113, 450, 1112], { at: '2025-04-01T10:08:00.000Z', measuredThicknessMm: [[180, 9.7]] });
    const warm = bar(struck, 'bar-A2').session.steps.at(-1)!;
    expect(warm.cut_finished_at).toBe('2025-04-01T10:05:00.000Z');
    expect(warm.measured_thickness_mm).toEqual([[180, 9.7]]);
    // The checkpoints stay with the cut they belong to (asked for only while the bar is cut since its
    // last round), so removing this round brings them back; the next marked cut replaces them.
    expect(bar(struck, 'bar-A2').checkpoints).toEqual(checkpoints);
    const again = recordStep(struck, 'bar-A2', [113.2, 450.5, 1113], { at: '2025-04-01T10:20:00.000Z' });
    expect(bar(again, 'bar-A2').session.steps.at(-1)!.cut_finished_at).toBeUndefined();
  });
});

describe('readings at the playing temperature', () => {
  it('moves a reading taken at 27 °C to the demo’s 22 °C by the wood default, −2 cents per °C (common practice)', () => {
    const project = recordStep(demo(), 'bar-A4', [440, 1758, 4400], { at: '2025-04-01T10:00:00.000Z', airTemperatureC: 27 });
    const a4 = bar(project, 'bar-A4');
    const temperature = barTemperature(project, a4)!;
    expect(temperature.playingC).toBe(22);
    expect(temperature.from).toBe('default');
    // Warmer than playing, wood reads flat: 5 °C × 2 cents = +10 cents at 22 °C.
    expect(temperature.shiftCents[0]).toBeCloseTo(10, 9);
    const moved = lastReadingAtPlayingHz(project, a4)!;
    [440, 1758, 4400].forEach((hz, n) => expect(moved[n]).toBeCloseTo(hz * 2 ** (10 / 1200), 9));
    // The playing temperature is the instrument's: at 20 °C the same reading moves 14 cents.
    const cooler = updateInstrument(project, { air_temperature_c: 20 });
    expect(barTemperature(cooler, bar(cooler, 'bar-A4'))!.shiftCents[0]).toBeCloseTo(14, 9);
    expect(barCalibrationInputs(cooler, bar(cooler, 'bar-A4'))!.session.target.playing_temperature_c).toBe(20);
    expect(barTemperature(demo(), bar(demo(), 'bar-A4'))).toBeNull();
    expect(barCalibrationInputs(demo(), bar(demo(), 'bar-A4'))).toBeNull();
  });

  it('says how far bar and tube drift apart per °C: the tube by the closed form of the speed of sound, the wood by its default', () => {
    const drift = temperatureDrift(demo());
    // f ∝ c ∝ √(273.15 + T): (1200 / ln 2) / (2 (273.15 + T)) cents per °C (closed form), about +2.93 at 22 °C.
    const tube = 1200 / Math.LN2 / (2 * (273.15 + 22));
    expect(drift.tubeCentsPerC).toBeCloseTo(tube, 12);
    expect(drift.instrument.barCentsPerC).toBe(-2);
    expect(drift.instrument.from).toBe('default');
    expect(drift.instrument.apartCentsPerC).toBeCloseTo(tube + 2, 12);
    expect(drift.learnt).toEqual([]);
  });

  it('learns a bar’s own coefficient from the unchanged bar struck at 15 and 25 °C, and lists it beside its tube', () => {
    // A simulated bar moving −1.9 cents per °C (unknown to the tool), in tune at 22 °C.
    const own = -1.9;
    const atPlaying = [442, 1768, 4420];
    const heardAt = (celsius: number) => atPlaying.map((hz) => hz * 2 ** ((own * (celsius - 22)) / 1200));
    let project = recordStep(demo(), 'bar-A4', heardAt(15), { at: '2025-04-01T08:00:00.000Z', airTemperatureC: 15 });
    project = recordStep(project, 'bar-A4', heardAt(25), { at: '2025-04-01T15:00:00.000Z', airTemperatureC: 25 });
    const temperature = barTemperature(project, bar(project, 'bar-A4'))!;
    expect(temperature.from).toBe('learnt');
    // Noise-free readings: the fit recovers the slope far inside the 0.2 cents per °C.
    expect(Math.abs(temperature.centsPerC - own)).toBeLessThan(0.2);
    // Both readings land on the targets at the playing temperature (within 0.5 cent: the learnt slope is pooled with the prior).
    for (const [k, celsius] of [15, 25].entries()) expect(Math.abs(centsAtPlaying(project, k, celsius))).toBeLessThan(0.5);
    const [learnt] = temperatureDrift(project).learnt;
    expect(learnt!.note).toBe('A4');
    expect(learnt!.apartCentsPerC).toBeCloseTo(1200 / Math.LN2 / (2 * (273.15 + 22)) - temperature.centsPerC, 12);
  });
});

describe('lots in the project', () => {
  it('names a bar’s lot on its blank and present shape, keeps what finished bars taught, and gives the next bar the others’ prior', () => {
    let project = setBarLot(demo(), 'bar-A4', ' board-7 ', '2025-04-01T10:00:00.000Z');
    project = setBarLot(project, 'bar-C4', 'board-7', '2025-04-01T10:00:00.000Z');
    expect(bar(project, 'bar-A4').blank.lot).toBe('board-7');
    expect(bar(project, 'bar-A4').current.lot).toBe('board-7');
    // Waiting bars in the keyboard's order (the demo lists C4 before A4).
    expect(projectLots(project)).toEqual([{ name: 'board-7', learntFrom: [], waiting: ['C4', 'A4'], next: null }]);
    project = recordLotLearning(project, 'board-7', record('bar-C4', 'C4', 19.8));
    project = recordLotLearning(project, 'board-7', record('bar-F4', 'F4', 20.2));
    // Learning the same bar again replaces its record.
    project = recordLotLearning(project, 'board-7', record('bar-C4', 'C4', 19.9));
    const [lot] = projectLots(project);
    expect(lot!.learntFrom.map((entry) => entry.note)).toEqual(['F4', 'C4']);
    expect(lot!.waiting).toEqual(['A4']);
    // The next bar starts between the two bars' stiffness (equal density, equal weights: their geometric mean).
    expect(lot!.next!.E_GPa).toBeCloseTo(Math.sqrt(19.9 * 20.2), 6);
    expect(lot!.next!.corrections[1]!.mean).toBeCloseTo(-0.07, 12);
    // A bar's own record is not its prior.
    expect(barLotPrior(project, bar(project, 'bar-C4'))!.bars).toEqual(['bar-F4']);
    expect(barLotPrior(project, bar(project, 'bar-A4'))!.bars).toEqual(['bar-F4', 'bar-C4']);
    expect(parseProjectFile(JSON.parse(serializeProjectFile(project)), 'again')).toEqual(project);
    // Clearing the name.
    expect(bar(setBarLot(project, 'bar-A4', '', '2025-04-01T10:00:00.000Z'), 'bar-A4').blank.lot).toBeUndefined();
    expect(thrown(() => recordLotLearning(project, ' ', record('bar-A4', 'A4', 20))).field).toBe('lot');
  });

  it('refuses a broken lot record, cut time or checkpoint on load with the field named', () => {
    const good = recordLotLearning(demo(), 'board-7', record('bar-C4', 'C4', 19.8));
    const file = JSON.parse(serializeProjectFile(good));
    const badLot = structuredClone(file);
    badLot.lots['board-7'].bars[0].E_GPa = -3;
    expect(refusal(badLot)).toMatch(/lots\.board-7\.bars\[0\]\.E_GPa: must be greater than 0 GPa/);
    const badTime = structuredClone(file);
    badTime.bars[0].cut_finished_at = 'yesterday';
    expect(refusal(badTime)).toMatch(/bars\[0\]\.cut_finished_at/);
    const badPoint = structuredClone(file);
    badPoint.bars[0].checkpoints = [{ x_mm: -5, thickness_mm: 10 }];
    expect(refusal(badPoint)).toMatch(/bars\[0\]\.checkpoints\[0\]\.x_mm: must be 0 mm or more/);
    // A done verdict carries the finished bar's lot record, checked like the lot file's.
    const a2 = bar(good, 'bar-A2');
    const advised = JSON.parse(serializeProjectFile(setAdvice(good, 'bar-A2', { status: 'done', bar_after: a2.current, predicted_hz: [110, 440, 1100], lot_record: record('bar-A2', 'A2', 19) }, '2025-04-01T10:00:00.000Z')));
    expect(parseProjectFile(structuredClone(advised), 'shop.project.json').bars[0]!.advice!.lot_record!.E_GPa).toBe(19);
    advised.bars[0].advice.lot_record.G_uncertainty_percent = 'a lot';
    expect(refusal(advised)).toMatch(/bars\[0\]\.advice\.lot_record\.G_uncertainty_percent/);
  });
});
