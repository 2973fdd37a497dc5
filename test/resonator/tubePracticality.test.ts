// Impractical resonator tubes: shorter than their bore, longer than the frame, with remedies whose
// numbers are checked against the closed-tube formula L = c/(4f) − k·d/2 they come from.
import { readFileSync } from 'node:fs';
import { resolve } from 'node:path';
import { describe, expect, it } from 'vitest';
import {
  closedTubeResonator,
  largestBoreNotShorterThanIt,
  parseProjectFile,
  projectResonatorTubes,
  projectTubeListCsv,
  setResonatorBore,
  setResonatorFrame,
  speedOfSoundDryAir,
  tubePracticality,
  tubeSet,
  updateRegister,
  InputError,
  type ProjectFile,
} from '../../src/index.ts';

const demoText = readFileSync(resolve(import.meta.dirname, '../../fixtures/demo.project.json'), 'utf8');
const demo = (): ProjectFile => parseProjectFile(JSON.parse(demoText), 'demo');
const k = 0.6133; // Levine & Schwinger (1948): unflanged end correction per unit radius.

/** Numbers in mm found in a text. */
const mmIn = (text: string) => [...text.matchAll(/([\d.]+) mm/g)].map((match) => Number(match[1]));

describe('a tube shorter than its bore', () => {
  it('is flagged, with the largest bore that keeps it at least as long as its bore (closed form)', () => {
    // The demo's C7 at A4 = 442 (2102.52 Hz), 40 mm bore, 22 °C: L = c/(4f) − 0.6133 · 20 mm.
    const c = speedOfSoundDryAir(22);
    const hz = 442 * 2 ** (27 / 12);
    const quarterWave = c / (4 * hz);
    const length = quarterWave - k * 0.02;
    expect(length * 1000).toBeCloseTo(28.68, 1);
    const [warning] = tubePracticality({ lengthM: length, innerDiameterM: 0.04, quarterWaveM: quarterWave, endCorrectionFactor: k, openEnd: 'unflanged' });
    expect(warning!.kind).toBe('shorter-than-bore');
    expect(warning!.message).toMatch(/28\.7 mm long, shorter than its 40\.0 mm bore/);
    const [largest, lengthThen] = mmIn(warning!.remedies[0]!);
    // At the largest bore d, the tube is exactly d long: λ/4 − k·d/2 = d.
    const d = largestBoreNotShorterThanIt(quarterWave, k);
    expect(quarterWave - (k * d) / 2).toBeCloseTo(d, 12);
    expect(largest).toBeCloseTo(d * 1000, 1);
    expect(largest! <= d * 1000).toBe(true);
    expect(lengthThen).toBeCloseTo(d * 1000, 1);
    // And the sizing itself agrees: that bore gives a tube as long as the bore.
    const sized = closedTubeResonator({ hz, innerDiameterMm: largest!, temperatureC: 22 });
    expect(sized.length_mm).toBeGreaterThanOrEqual(largest!);
  });

  it('a tube as long as its bore or longer passes', () => {
    const quarterWave = 0.2;
    const d = largestBoreNotShorterThanIt(quarterWave, k);
    expect(tubePracticality({ lengthM: quarterWave - (k * d * 0.999) / 2, innerDiameterM: d * 0.999, quarterWaveM: quarterWave, endCorrectionFactor: k, openEnd: 'unflanged' })).toEqual([]);
  });
});

describe('a tube longer than the frame', () => {
  it('is flagged with a fold, a flanged top, a wider bore and a deeper frame, each in numbers', () => {
    // The demo's A2 (110.5 Hz) with an 88 mm bore at 22 °C is about 752 mm; the frame takes 740.
    const c = speedOfSoundDryAir(22);
    const quarterWave = c / (4 * 110.5);
    const length = quarterWave - k * 0.044;
    const [warning] = tubePracticality({ lengthM: length, innerDiameterM: 0.088, quarterWaveM: quarterWave, endCorrectionFactor: k, openEnd: 'unflanged' }, { maxLengthM: 0.74 });
    expect(warning!.kind).toBe('longer-than-frame');
    expect(warning!.remedies[0]).toMatch(/U-bend/);
    // Flanged top: δ grows from 0.6133 r to 0.8216 r (Norris & Sheng 1989): (0.8216 − 0.6133) · 44 mm = 9.2 mm.
    expect(mmIn(warning!.remedies[1]!)[0]).toBeCloseTo(0.2083 * 44, 1);
    // Wider bore: λ/4 − k·d/2 = 0.740 m → d = 2 (λ/4 − 0.740) / k.
    const bore = mmIn(warning!.remedies[2]!)[0]!;
    expect(bore).toBeCloseTo((2 * (quarterWave - 0.74) * 1000) / k, 0);
    expect(quarterWave - (k * bore) / 2000).toBeLessThanOrEqual(0.74 + 1e-9);
    // A deeper frame: the tube's length rounded up to whole mm.
    const frame = mmIn(warning!.remedies[3]!)[0]!;
    expect(frame).toBeGreaterThanOrEqual(length * 1000);
    expect(frame).toBeLessThan(length * 1000 + 1);
    // A flanged tube is not offered the flanged top again.
    const flanged = tubePracticality({ lengthM: length, innerDiameterM: 0.088, quarterWaveM: quarterWave, endCorrectionFactor: 0.8216, openEnd: 'flanged' }, { maxLengthM: 0.5 });
    expect(flanged[0]!.remedies.some((remedy) => /flanged/.test(remedy))).toBe(false);
    // Within the frame: nothing.
    expect(tubePracticality({ lengthM: length, innerDiameterM: 0.088, quarterWaveM: quarterWave, endCorrectionFactor: k, openEnd: 'unflanged' }, { maxLengthM: 0.8 })).toEqual([]);
  });
});

describe('which partials a tube reinforces', () => {
  it('a closed tube’s 3f meets a 1 : 3 bar’s second partial; nothing meets a 1 : 4 : 10 bar’s upper partials (odd harmonics only: brief, air columns)', () => {
    const [xylophone] = tubeSet([{ label: 'C5', targetHz: 523.25, innerDiameterM: 0.05 }], { air: { temperatureC: 20 } }, [1, 3]);
    expect(xylophone!.reinforcedPartials).toEqual([1, 2]);
    const [marimba] = tubeSet([{ label: 'C5', targetHz: 523.25, innerDiameterM: 0.05 }], { air: { temperatureC: 20 } }, [1, 4, 10]);
    expect(marimba!.reinforcedPartials).toEqual([1]);
  });
});

describe('the project’s tube list', () => {
  it('warns of the demo’s C7 tube and lists what each tube reinforces', () => {
    const rows = projectResonatorTubes(demo());
    // Keyboard bars only: the chime tubes hang free.
    expect(rows.map((row) => row.note)).toEqual(['A2', 'E3', 'A3', 'C4', 'A4', 'E5', 'C7']);
    const c7 = rows.find((row) => row.note === 'C7')!;
    expect(c7.warnings.map((warning) => warning.kind)).toEqual(['shorter-than-bore']);
    expect(rows.filter((row) => row.warnings.length > 0).map((row) => row.note)).toEqual(['C7']);
    expect(rows.find((row) => row.note === 'A2')!.reinforces).toEqual([{ partial: 1, ratio: 1, resonance: 1 }]);
  });

  it('a 1 : 3 register: the tube also helps partial 2 through its 3f resonance', () => {
    const project = updateRegister(demo(), 'middle', { ratios: [1, 3] });
    const a4 = projectResonatorTubes(project).find((row) => row.note === 'A4')!;
    expect(a4.reinforces).toEqual([
      { partial: 1, ratio: 1, resonance: 1 },
      { partial: 2, ratio: 3, resonance: 2 },
    ]);
  });

  it('a bore too wide for a note gives a row with the warning, not an error', () => {
    const project = setResonatorBore(demo(), 'treble', 120);
    const c7 = projectResonatorTubes(project).find((row) => row.note === 'C7')!;
    expect(c7.tube).toBeNull();
    // λ/4 = 40.95 mm at 22 °C; minus 0.6133 · 60 mm leaves 4.2 mm.
    expect(c7.warnings[0]!.message).toMatch(/4\.2 mm long, shorter than its 120\.0 mm bore/);
  });

  it('with a frame: a tube longer than it is flagged; the CSV carries the warnings', () => {
    const project = setResonatorFrame(demo(), 600);
    const rows = projectResonatorTubes(project);
    expect(rows.filter((row) => row.warnings.some((warning) => warning.kind === 'longer-than-frame')).map((row) => row.note)).toEqual(['A2']);
    const csv = projectTubeListCsv(project).split('\r\n');
    expect(csv[0]!.split(',').at(-1)).toBe('warnings');
    expect(csv).toHaveLength(1 + 7 + 1);
    expect(csv[1]).toMatch(/^A2,110\.50,88\.0,752\.\d,.*,The tube is 752\.\d mm long; the frame takes 600\.0 mm\.$/);
    expect(csv[7]).toMatch(/^C7,.*shorter than its 40\.0 mm bore/);
    expect(setResonatorFrame(project, null).instrument.resonator_max_length_mm).toBeUndefined();
  });

  it('refuses a bore or a frame outside their ranges, with the range in the message', () => {
    const project = demo();
    const message = (action: () => unknown) => {
      try {
        action();
      } catch (error) {
        if (error instanceof InputError) return error.message;
      }
      return '';
    };
    expect(message(() => setResonatorBore(project, 'bass', 4))).toBe('resonators: inner diameter: must lie within 10–250 mm (got 4)');
    expect(message(() => setResonatorBore(project, 'bass', 100000))).toBe('resonators: inner diameter: must lie within 10–250 mm (got 100000)');
    expect(message(() => setResonatorFrame(project, 20))).toBe('resonators: longest tube: must lie within 50–3000 mm (got 20)');
    expect(message(() => setResonatorFrame(project, Number.NaN))).toMatch(/must lie within 50–3000 mm/);
  });
});
