import { describe, expect, it } from 'vitest';
import fc from 'fast-check';
import {
  calibrateEndCorrection,
  closedTube,
  closedTubeHz,
  closedTubeResonator,
  detuneCents,
  detuneCentsPerDegree,
  endCorrection,
  oddHarmonics,
  reinforcedPartials,
  speedOfSound,
  speedOfSoundCramer,
  speedOfSoundDryAir,
  tubeListCsv,
  tubeSet,
} from '../../src/resonator/index.ts';
import { InputError } from '../../src/fileFormats/InputError.ts';

const air20 = { temperatureC: 20 };

describe('speed of sound', () => {
  it('follows the dry-air formula c = 331.3 √(1 + T/273.15) (brief; standard acoustics texts)', () => {
    expect(speedOfSoundDryAir(0)).toBe(331.3);
    // 343.2 m/s at 20 °C as quoted in the brief and the contract's example (to 0.05 m/s: the
    // quoted value has one decimal).
    expect(speedOfSound(air20)).toBeCloseTo(343.2, 1);
    // Linearised slope ≈ 0.606 m/s per K near 0 °C (reference-values.md, "≈ 331.3 + 0.606 T"):
    // the derivative 331.3 / (2 · 273.15) = 0.6064 at 0 °C.
    expect((speedOfSoundDryAir(0.5) - speedOfSoundDryAir(-0.5)) / 1).toBeCloseTo(0.6064, 3);
  });

  it('rises about 0.37 % from dry to saturated air at 20 °C (Cramer, JASA 93 (1993) 2510; reference-values.md, computed)', () => {
    const rise = speedOfSound({ temperatureC: 20, relativeHumidityPercent: 100 }) / speedOfSound(air20) - 1;
    // Tolerance 0.01 %: the reference quotes two significant figures.
    expect(rise).toBeGreaterThan(0.0036);
    expect(rise).toBeLessThan(0.0038);
    // Cramer's dry air at 0 °C is 331.45 m/s (from memory; 0.05 m/s covers the CO₂ fraction chosen).
    expect(speedOfSoundCramer(0, 0)).toBeCloseTo(331.45, 1);
  });

  it('rejects air outside its range', () => {
    expect(() => speedOfSound({ temperatureC: 80 })).toThrow(InputError);
    expect(() => speedOfSound({ temperatureC: 20, relativeHumidityPercent: 120 })).toThrow(InputError);
    expect(() => speedOfSound({ temperatureC: Number.NaN })).toThrow(InputError);
  });
});

describe('end correction', () => {
  it('is 0.6133 r unflanged (Levine & Schwinger 1948) and 0.8216 r flanged (Norris & Sheng 1989, from memory)', () => {
    expect(endCorrection(0.025)).toBeCloseTo(0.6133 * 0.025, 15);
    expect(endCorrection(0.025, 'flanged')).toBeCloseTo(0.8216 * 0.025, 15);
  });
});

describe('closed-bottom tube', () => {
  it('matches a worked example computed by hand', () => {
    // F4 at A4 = 442 in a 50 mm bore, unflanged, 22 °C:
    //   f   = 442 · 2^(−4/12)                 = 442 · 0.7937005   = 350.8156 Hz
    //   c   = 331.3 · √(1 + 22/273.15)         = 331.3 · 1.0394911 = 344.3834 m/s
    //   λ/4 = c / (4 f) = 344.3834 / 1403.2625                      = 245.4162 mm
    //   δ   = 0.6133 · 25 mm                                         =  15.3325 mm
    //   L   = λ/4 − δ = 245.4162 − 15.3325                           = 230.0837 mm
    //   resonances f, 3f, 5f = 350.82, 1052.45, 1754.08 Hz
    const tube = closedTube({ targetHz: 442 * 2 ** (-4 / 12), innerDiameterM: 0.05, air: { temperatureC: 22 } });
    // Tolerance 0.001 mm: the hand steps carry 7 significant figures.
    expect(tube.lengthM * 1000).toBeCloseTo(230.0837, 3);
    expect(tube.endCorrectionM * 1000).toBeCloseTo(15.3325, 4);
    expect(tube.speedOfSoundMS).toBeCloseTo(344.3834, 3);
    expect(tube.harmonicsHz.map((h) => Number(h.toFixed(2)))).toEqual([350.82, 1052.45, 1754.08]);
  });

  it('resonates where it was tuned: f_k = (2k − 1) c / (4 (L + δ)) inverts the sizing (closed form)', () => {
    fc.assert(
      fc.property(fc.double({ min: 100, max: 1500, noNaN: true }), fc.double({ min: 0.02, max: 0.09, noNaN: true }), fc.double({ min: 5, max: 35, noNaN: true }), (hz, diameter, temperatureC) => {
        const air = { temperatureC };
        let tube;
        try {
          tube = closedTube({ targetHz: hz, innerDiameterM: diameter, air });
        } catch (error) {
          // Too wide a bore for a high note is refused, never sized.
          expect(error).toBeInstanceOf(InputError);
          return;
        }
        expect(closedTubeHz(tube.lengthM, tube.endCorrectionM, air) / hz).toBeCloseTo(1, 12);
        expect(tube.harmonicsHz[1]! / tube.harmonicsHz[0]!).toBeCloseTo(3, 12);
      }),
    );
  });

  it('lists odd harmonics and which bar partials they reinforce', () => {
    expect(oddHarmonics(100, 4)).toEqual([100, 300, 500, 700]);
    // Brief §2 "Air columns": 3 f reinforces a 1 : 3 bar's second partial; nothing meets 4 f or 10 f.
    const tube = closedTube({ targetHz: 523.25, innerDiameterM: 0.04, air: air20 });
    expect(reinforcedPartials(tube.harmonicsHz, [523.25, 3 * 523.25]).map((r) => [r.resonance, r.partial])).toEqual([[1, 1], [2, 2]]);
    expect(reinforcedPartials(tube.harmonicsHz, [523.25, 4 * 523.25, 10 * 523.25]).map((r) => r.partial)).toEqual([1]);
  });

  it('refuses a bore too wide for its note', () => {
    expect(() => closedTube({ targetHz: 4000, innerDiameterM: 0.06, air: air20 }, 'command line')).toThrow(/^command line: inner diameter: a 60.0 mm bore is too wide/);
  });
});

describe('detuning with temperature', () => {
  it('is (1200/ln 2) / (2 (273.15 + T)) cents per °C (closed form of the dry-air formula)', () => {
    // 2.953 cents/°C at 20 °C, i.e. "about 3 cents flat per °C colder" (brief §2).
    expect(detuneCentsPerDegree(20)).toBeCloseTo(2.953, 3);
    // The exact drift over ±0.5 °C agrees with the derivative to 1e-4 cents (second-order term).
    expect(detuneCents(19.5, 20.5)).toBeCloseTo(detuneCentsPerDegree(20), 4);
    expect(detuneCents(20, 10)).toBeLessThan(-29);
  });
});

describe('calibrating the end correction from one measured tube', () => {
  it('recovers δ = c/(4 f) − L and carries δ/r over to the rest of the set', () => {
    // Worked by hand: a 230.0 mm tube of 50 mm bore sounds 351.1 Hz at 22 °C:
    //   c/(4 f) = 344.3834 / 1404.4 = 245.2175 mm → δ = 15.2175 mm → δ/r = 0.60870.
    const calibration = calibrateEndCorrection({ lengthM: 0.23, innerDiameterM: 0.05, measuredHz: 351.1, air: { temperatureC: 22 } });
    expect(calibration.endCorrectionM * 1000).toBeCloseTo(15.2175, 3);
    expect(calibration.factorOfRadius).toBeCloseTo(0.6087, 4);
    // Applied to a 40 mm tube: δ = 0.6087 · 20 mm.
    const tube = closedTube({ targetHz: 700, innerDiameterM: 0.04, air: { temperatureC: 22 }, endCorrectionFactor: calibration.factorOfRadius });
    expect(tube.endCorrectionM * 1000).toBeCloseTo(0.6087 * 20, 2);
  });

  it('round-trips: a tube sized with any δ/r calibrates back to it', () => {
    fc.assert(
      fc.property(fc.double({ min: 150, max: 1200, noNaN: true }), fc.double({ min: 0.3, max: 1.2, noNaN: true }), (hz, factor) => {
        const air = { temperatureC: 18, relativeHumidityPercent: 50 };
        const tube = closedTube({ targetHz: hz, innerDiameterM: 0.03, air, endCorrectionFactor: factor });
        const back = calibrateEndCorrection({ lengthM: tube.lengthM, innerDiameterM: 0.03, measuredHz: hz, air });
        expect(back.factorOfRadius).toBeCloseTo(factor, 9);
      }),
    );
  });

  it('rejects a measurement implying an impossible end correction', () => {
    expect(() => calibrateEndCorrection({ lengthM: 0.3, innerDiameterM: 0.05, measuredHz: 351.1, air: { temperatureC: 22 } })).toThrow(InputError);
  });
});

describe('tube list as CSV', () => {
  it('writes a header and one quoted-as-needed row per tube (RFC 4180)', () => {
    const rows = tubeSet(
      [
        { label: 'A3', targetHz: 221, innerDiameterM: 0.06 },
        { label: 'E4, bright', targetHz: 331.1, innerDiameterM: 0.05 },
      ],
      { air: air20 },
      [1, 3],
    );
    const csv = tubeListCsv(rows, 20);
    const lines = csv.split('\r\n');
    expect(lines[0]).toBe('note,target_hz,inner_diameter_mm,length_mm,end_correction_mm,speed_of_sound_m_s,temp_c,resonance_1_hz,resonance_3_hz,resonance_5_hz,reinforces_partials,cents_per_c,warnings');
    expect(lines).toHaveLength(4);
    expect(lines[3]).toBe('');
    const first = lines[1]!.split(',');
    // L = 343.2146 / 884 − 0.6133 · 0.03 = 0.388252 − 0.018399 = 0.369853 m (closed form).
    expect(first[0]).toBe('A3');
    expect(first[3]).toBe('369.9');
    expect(first[10]).toBe('1 2');
    expect(lines[2]!.startsWith('"E4, bright",331.10,50.0,')).toBe(true);
  });
});

describe('closedTubeResonator (the workbench\'s entry, mm and °C at the edges)', () => {
  it('gives the same tube as closedTube in contract units', () => {
    // Same hand-worked example as above: 230.0837 mm, δ 15.3325 mm, c 344.3834 m/s.
    const tube = closedTubeResonator({ hz: 442 * 2 ** (-4 / 12), innerDiameterMm: 50, temperatureC: 22, end: 'unflanged' });
    expect(tube.length_mm).toBeCloseTo(230.0837, 3);
    expect(tube.end_correction_mm).toBeCloseTo(15.3325, 4);
    expect(tube.speed_of_sound_m_s).toBeCloseTo(344.3834, 3);
    const flanged = closedTubeResonator({ hz: 442 * 2 ** (-4 / 12), innerDiameterMm: 50, temperatureC: 22, end: 'flanged' });
    // Flanged: δ = 0.8216 · 25 = 20.54 mm, so the tube is 5.2075 mm shorter.
    expect(tube.length_mm - flanged.length_mm).toBeCloseTo((0.8216 - 0.6133) * 25, 6);
  });
});
