import { readFileSync } from 'node:fs';
import { describe, expect, it } from 'vitest';
import { keyboardNotes } from '../../src/instrument/keyboardNotes.ts';
import { parseKeyboardFile, readKeyboardFileText } from '../../src/fileFormats/keyboardFile.ts';

const demoText = readFileSync(new URL('../../fixtures/demo.keyboard.json', import.meta.url), 'utf8');
const demo = (): Record<string, any> => JSON.parse(demoText);

/** The message parseKeyboardFile throws for a changed demo file. */
function problem(change: (file: Record<string, any>) => void): string {
  const file = demo();
  change(file);
  try {
    parseKeyboardFile(file, 'k.json');
  } catch (error) {
    return (error as Error).message;
  }
  return 'no error';
}

describe('keyboard file', () => {
  it('reads the demo keyboard: 52 notes A2–C7 at A4 = 442 Hz', () => {
    const notes = keyboardNotes(readKeyboardFileText(demoText, 'demo.keyboard.json'));
    expect(notes).toHaveLength(52);
    expect(notes[0]!.name).toBe('A2');
    expect(notes[51]!.name).toBe('C7');
    // Equal temperament f = 442 · 2^((m − 69)/12) (MIDI 1.0): A2 = 110.5 Hz exactly, A4 = 442.
    expect(notes[0]!.target_hz).toBeCloseTo(110.5, 10);
    expect(notes.find((n) => n.name === 'A4')!.target_hz).toBeCloseTo(442, 10);
    // C7 carries a +2 cent offset: 442 · 2^(27/12) · 2^(2/1200).
    expect(notes[51]!.target_hz).toBeCloseTo(442 * 2 ** (27 / 12) * 2 ** (2 / 1200), 9);
    // Schedules by register.
    expect(notes.find((n) => n.name === 'D3')!.width_mm).toBe(60);
    // Tuning by register as common practice has it (from memory): 1:4:10 to E4, 1:4 to C6, then the fundamental.
    expect(notes.find((n) => n.name === 'E4')!.ratios).toEqual([1, 4, 10]);
    expect(notes.find((n) => n.name === 'F4')!.ratios).toEqual([1, 4]);
    expect(notes.find((n) => n.name === 'C6')!.ratios).toEqual([1, 4]);
    expect(notes.find((n) => n.name === 'C#6')!.ratios).toEqual([1]);
    expect(notes[51]!.ratios).toEqual([1]);
    expect(notes[0]!.min_thickness_mm).toBeCloseTo(6, 12); // quarter of 24 mm
    expect(notes[0]!.material_from).toBe('bar');
    expect(notes[1]!.material).toEqual({ preset: 'demo-tropical-hardwood' });
    expect(notes.find((n) => n.name === 'C4')!.resonator_inner_diameter_mm).toBe(58);
  });

  it('tunes by register as common practice has it when the file gives no tuning (from memory), cut to its range', () => {
    const file = demo();
    delete file.tuning;
    expect(parseKeyboardFile(file, 'k.json').tuning).toEqual([
      { from: 'A2', to: 'E4', ratios: [1, 4, 10], tolerance_cents: [2, 5, 15] },
      { from: 'F4', to: 'C6', ratios: [1, 4], tolerance_cents: [2, 5] },
      { from: 'C#6', to: 'C7', ratios: [1], tolerance_cents: [2] },
    ]);
    // The demo keyboard follows it.
    expect(parseKeyboardFile(demo(), 'k.json').tuning).toEqual(parseKeyboardFile(file, 'k.json').tuning);
    const high = { ...file, range: { lowest: 'F5', highest: 'C8' }, sections: [{ from: 'F5', to: 'C8', width_mm: 36, thickness_mm: 18 }], bar_materials: {}, pitch: { a4_hz: 442 }, resonators: undefined };
    expect(parseKeyboardFile(high, 'k.json').tuning.map((t) => [t.from, t.to, t.ratios.length])).toEqual([
      ['F5', 'C6', 2],
      ['C#6', 'C8', 1],
    ]);
  });

  it('reads its workshop section with the workshop file’s rules, naming the field', () => {
    const file = { ...demo(), workshop: { name: 'our shop', tools: [{ kind: 'drum', radius_mm: 15 }], cord_holes: { diameter_mm: 5, clearance_mm: 2 } } };
    expect(parseKeyboardFile(file, 'k.json').workshop).toEqual(file.workshop);
    expect(problem((f) => (f.workshop = { tools: [{ kind: 'drum', radius_mm: 15 }], cord_holes: { diameter_mm: 50, clearance_mm: 2 } }))).toBe('k.json: workshop.cord_holes.diameter_mm: must be from 0 to 20 mm (got 50)');
  });

  it('names the file, the field and the rule for each kind of mistake', () => {
    expect(problem((f) => (f.format = 'keyboard'))).toBe('k.json: format: must be "barwright.keyboard" (got "keyboard")');
    expect(problem((f) => (f.version = 2))).toBe('k.json: version: must be 1 (got 2)');
    expect(problem((f) => (f.range.lowest = 'H2'))).toMatch(/^k\.json: range\.lowest: "H2" is not a note name/);
    expect(problem((f) => (f.range.highest = 'G2'))).toBe('k.json: range.highest: G2 is below the lowest note A2');
    expect(problem((f) => (f.sections[1].from = 'E3'))).toBe('k.json: sections[1].from: E3 does not follow sections[0].to (expected D3)');
    expect(problem((f) => (f.sections[0].from = 'B2'))).toBe("k.json: sections[0].from: B2 must be the keyboard's lowest note A2");
    expect(problem((f) => f.sections.pop())).toBe("k.json: sections[5].to: the spans stop before the keyboard's highest note C7");
    expect(problem((f) => (f.sections[6].to = 'D7'))).toBe("k.json: sections[6].to: D7 lies above the keyboard's highest note C7");
    expect(problem((f) => (f.sections[2].width_mm = -5))).toBe('k.json: sections[2].width_mm: must be greater than 0 mm (got -5)');
    expect(problem((f) => (f.sections[2].min_thickness_mm = 30))).toBe("k.json: sections[2].min_thickness_mm: 30 mm must be greater than 0 and less than the blank's 22 mm");
    expect(problem((f) => (f.tuning[0].ratios = [1, 10, 4]))).toBe('k.json: tuning[0].ratios[2]: ratio 4 must be greater than the one before (10)');
    expect(problem((f) => (f.tuning[0].ratios = [2, 4]))).toBe("k.json: tuning[0].ratios[0]: the fundamental's ratio must be 1 (got 2)");
    expect(problem((f) => (f.tuning[1].tolerance_cents = [2]))).toBe('k.json: tuning[1].tolerance_cents: must list one tolerance per ratio (2)');
    expect(problem((f) => (f.pitch.a4_hz = 1000))).toBe('k.json: pitch.a4_hz: A4 reference 1000 Hz is outside 300–600 Hz');
    expect(problem((f) => (f.pitch.offsets_cents = { D8: 3 }))).toBe("k.json: pitch.offsets_cents.D8: D8 lies outside the keyboard's range");
    expect(problem((f) => (f.pitch.offsets_cents = { 'A#3': 3, Bb3: 1 }))).toBe('k.json: pitch.offsets_cents.Bb3: names the same note as A#3');
    expect(problem((f) => (f.pitch.offsets_cents = { C4: 80 }))).toBe('k.json: pitch.offsets_cents.C4: an offset of 80 cents is more than a quarter tone');
    expect(problem((f) => (f.material = { preset: 'cardboard' }))).toMatch(/^k\.json: material\.preset: unknown preset "cardboard"/);
    expect(problem((f) => (f.bar_materials.A2.E_GPa = 0))).toBe('k.json: bar_materials.A2.E_GPa: must be greater than 0 GPa (got 0)');
    expect(problem((f) => (f.limits.max_slope = 0))).toBe('k.json: limits.max_slope: must be greater than 0 and at most 10 (got 0)');
    expect(problem((f) => (f.limits.depth = 3))).toMatch(/^k\.json: limits\.depth: is not a keyboard limit/);
    expect(problem((f) => (f.colour = 'red'))).toMatch(/^k\.json: colour: is not a keyboard-file field/);
    expect(problem((f) => (f.resonators.open_end = 'closed'))).toBe('k.json: resonators.open_end: must be "unflanged" or "flanged" (got "closed")');
    expect(problem((f) => (f.resonators.diameters[0].inner_diameter_mm = 'wide'))).toBe('k.json: resonators.diameters[0].inner_diameter_mm: must be a number (got "wide")');
    expect(problem((f) => (f.blanks.lengths_mm = { A2: -1 }))).toBe('k.json: blanks.lengths_mm.A2: must be greater than 0 mm (got -1)');
    expect(() => readKeyboardFileText('{ nope', 'k.json')).toThrow(/^k\.json: JSON: not valid JSON/);
  });

  it('reads flats and sharps alike and spells the output as asked', () => {
    const file = demo();
    file.spelling = 'flat';
    file.sections[0].to = 'Db3';
    const notes = keyboardNotes(parseKeyboardFile(file, 'k.json'));
    expect(notes[1]!.name).toBe('Bb2');
    expect(notes.find((n) => n.name === 'Db3')!.width_mm).toBe(62);
    expect(notes.find((n) => n.name === 'D3')!.width_mm).toBe(60);
  });
});
