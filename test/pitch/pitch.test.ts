import { describe, expect, it } from 'vitest';
import fc from 'fast-check';
import { beatRate, cents, hzToMidi, hzToNote, noteToHz, sharpOrFlat, shiftByCents } from '../../src/pitch/index.ts';
import { InputError, midiToHz, midiToNoteName, parseNote } from '../../src/fileFormats/index.ts';

// Tolerance for closed-form identities evaluated in double precision: a few ulps of the
// logarithms and powers involved, far below any audible difference.
const closedFormCents = 1e-9;

describe('note names ↔ MIDI (MIDI 1.0 anchors: A4 = 69, middle C = C4 = 60)', () => {
  it('places the anchors', () => {
    // MIDI 1.0 specification: A4 = 69, C4 = 60; C-1 = 0 and G9 = 127 bound the MIDI range.
    expect(parseNote('A4').midi).toBe(69);
    expect(parseNote('C4').midi).toBe(60);
    expect(parseNote('C-1').midi).toBe(0);
    expect(parseNote('G9').midi).toBe(127);
  });

  it('reads sharps and flats in ASCII and in music symbols', () => {
    // Closed form: midi = 12 (octave + 1) + letter + alteration.
    expect(parseNote('F#3').midi).toBe(54);
    expect(parseNote('G♭3').midi).toBe(54);
    expect(parseNote('Gb3').midi).toBe(54);
    expect(parseNote('B♭5').midi).toBe(82);
    expect(parseNote('bb5').midi).toBe(82);
    expect(parseNote('C♯4').midi).toBe(61);
    expect(parseNote('Cx4').midi).toBe(62);
    expect(parseNote('Ebb4').midi).toBe(62);
  });

  it('crosses octave boundaries the way the notation does (Cb4 = B3, B#3 = C4)', () => {
    // Scientific pitch notation: the octave number belongs to the letter, not the sounding pitch.
    expect(parseNote('Cb4').midi).toBe(parseNote('B3').midi);
    expect(parseNote('B#3').midi).toBe(60);
  });

  it('names MIDI numbers with sharps or flats and reads them back', () => {
    expect(midiToNoteName(60)).toBe('C4');
    expect(midiToNoteName(61)).toBe('C#4');
    expect(midiToNoteName(61, 'flat')).toBe('Db4');
    expect(midiToNoteName(0)).toBe('C-1');
    fc.assert(
      fc.property(fc.integer({ min: 0, max: 131 }), fc.constantFrom('sharp' as const, 'flat' as const), (midi, spelling) => {
        expect(parseNote(midiToNoteName(midi, spelling)).midi).toBe(midi);
      }),
    );
  });

  it('rejects malformed names with an InputError naming the rule', () => {
    for (const bad of ['H4', 'C', '4', 'C#', 'Cb', 'C##4#', 'C 4', 'F#11', 'A-2', '', 'Bbbb4', 'A4.5']) {
      expect(() => parseNote(bad, 'command line', '--note'), bad).toThrow(InputError);
    }
    expect(() => parseNote('H4', 'command line', '--note')).toThrow(/^command line: --note: "H4" is not a note name in scientific pitch notation/);
  });
});

describe('Hz at any A4', () => {
  it('gives ISO 16 concert pitch and middle C', () => {
    // ISO 16:1975: A4 = 440 Hz. Middle C = 440 · 2^(−9/12) = 261.6256 Hz (closed form).
    expect(noteToHz('A4')).toBe(440);
    expect(noteToHz('C4')).toBeCloseTo(261.625565, 5);
    expect(noteToHz('A5', 442)).toBeCloseTo(884, 10);
    expect(noteToHz('F4', 442)).toBeCloseTo(442 * 2 ** (-4 / 12), 10);
  });

  it('round-trips Hz → MIDI → Hz and finds the nearest note with its cents', () => {
    fc.assert(
      fc.property(fc.double({ min: 20, max: 20000, noNaN: true }), fc.double({ min: 400, max: 470, noNaN: true }), (hz, a4) => {
        expect(midiToHz(hzToMidi(hz, a4), a4) / hz).toBeCloseTo(1, 12);
        const nearest = hzToNote(hz, a4);
        expect(Math.abs(nearest.cents)).toBeLessThanOrEqual(50 + closedFormCents);
        expect(cents(hz, nearest.noteHz)).toBeCloseTo(nearest.cents, 9);
      }),
    );
    const near = hzToNote(442 * 2 ** (5 / 1200), 442);
    expect(near.name).toBe('A4');
    expect(near.cents).toBeCloseTo(5, 9);
  });

  it('gives the A4 = 442 and 443 offsets on 440', () => {
    // reference-values.md (computed): 442 is +7.85 cents on 440; 443 is +11.76.
    expect(cents(442, 440)).toBeCloseTo(7.85, 2);
    expect(cents(443, 440)).toBeCloseTo(11.76, 2);
  });

  it('rejects an implausible A4 reference', () => {
    expect(() => noteToHz('A4', 44)).toThrow(InputError);
    expect(() => noteToHz('A4', Number.NaN)).toThrow(InputError);
  });
});

describe('cents identities (closed form: 1200 · log2 ratio)', () => {
  it('an octave is 1200, a semitone 100, unison 0', () => {
    expect(cents(880, 440)).toBeCloseTo(1200, 12);
    expect(cents(440 * 2 ** (1 / 12), 440)).toBeCloseTo(100, 10);
    expect(cents(440, 440)).toBe(0);
  });

  it('is antisymmetric, additive and inverted by shiftByCents', () => {
    const positive = fc.double({ min: 1, max: 30000, noNaN: true });
    fc.assert(
      fc.property(positive, positive, positive, (a, b, c) => {
        expect(cents(a, b) + cents(b, a)).toBeCloseTo(0, 9);
        expect(cents(a, b) + cents(b, c) - cents(a, c)).toBeCloseTo(0, 8);
        expect(cents(shiftByCents(b, cents(a, b)), b) - cents(a, b)).toBeCloseTo(0, 8);
      }),
    );
  });

  it('says sharp or flat in words', () => {
    expect(sharpOrFlat(3.2)).toBe('sharp');
    expect(sharpOrFlat(-0.4)).toBe('flat');
    expect(sharpOrFlat(0.4, 0.5)).toBe('in tune');
  });
});

describe('beat rate', () => {
  it('is the frequency difference in Hz (closed form: envelope of the sum of two sinusoids)', () => {
    expect(beatRate(441, 440)).toBe(1);
    expect(beatRate(440, 443.5)).toBeCloseTo(3.5, 12);
    // A partial 2 cents sharp of a 1396.9 Hz target beats at 1396.9 · (2^(2/1200) − 1) ≈ 1.614 Hz.
    expect(beatRate(shiftByCents(1396.9, 2), 1396.9)).toBeCloseTo(1.6143, 3);
  });
});
