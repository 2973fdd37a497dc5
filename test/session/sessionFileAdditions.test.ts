// The session file's turn-2 additions (contract: target.playing_temperature_c; per step
// air_temperature_c, cut_finished_at and measured_thickness_mm): each validated with a message
// naming the field and the rule; old files — barwright's older caliper field included — load
// unchanged and, without the new fields, behave exactly as before.
import { readFileSync } from 'node:fs';
import { describe, expect, it } from 'vitest';
import { isInputError } from '../../src/fileFormats/InputError.ts';
import { parseSessionFile } from '../../src/fileFormats/sessionFile.ts';
import { appendSessionStep } from '../../src/fileFormats/sessionLogEdits.ts';
import { nextCut } from '../../src/session/nextCut.ts';

const bar = {
  format: 'barwright.bar',
  version: 1,
  length_mm: 380,
  section: { shape: 'rect', width_mm: 55, thickness_mm: 22 },
  profile_mm: [
    [0, 22],
    [80, 22],
    [140, 11],
    [190, 8],
    [240, 11],
    [300, 22],
    [380, 22],
  ],
  material: { E_GPa: 12.0, G_GPa: 0.95, density_kg_m3: 750 },
};

/** The contract's example session (contract.md, `barwright next-cut`): none of the turn-2 fields. */
const contractExample = {
  format: 'barwright.session',
  version: 1,
  target: { hz: 349.23, ratios: [1, 4, 10], tolerance_cents: [2, 5, 15] },
  limits: { min_thickness_mm: 6 },
  steps: [{ bar, measured_hz: [362.1, 1421.0, 3350.2] }],
};

function withTwoSteps(change: (session: Record<string, any>) => void): Record<string, any> {
  const copy = structuredClone(contractExample) as Record<string, any>;
  copy.steps[0].recorded_at = '2025-03-03T09:00:00Z';
  copy.steps.push({ bar, measured_hz: [360, 1415, 3340], recorded_at: '2025-03-03T10:00:00Z', cut: { made: 'as-done' } });
  change(copy);
  return copy;
}

function ruleOf(value: unknown): string {
  try {
    parseSessionFile(value, 's.json');
  } catch (error) {
    if (isInputError(error)) return error.message;
    throw error;
  }
  return 'accepted';
}

describe('the turn-2 session fields', () => {
  it('accepts each and keeps its value', () => {
    const log = parseSessionFile(
      withTwoSteps((s) => {
        s.target.playing_temperature_c = 24;
        s.steps[1].air_temperature_c = 16.5;
        s.steps[1].cut_finished_at = '2025-03-03T09:40:00Z';
        s.steps[1].measured_thickness_mm = [[190, 7.9]];
      }),
      's.json',
    );
    expect(log.target.playing_temperature_c).toBe(24);
    expect(log.steps[1]).toMatchObject({ air_temperature_c: 16.5, cut_finished_at: '2025-03-03T09:40:00Z', measured_thickness_mm: [[190, 7.9]] });
  });

  it('names the field and the rule for each bad value', () => {
    const cases: [(s: Record<string, any>) => void, string][] = [
      [(s) => (s.target.playing_temperature_c = 'warm'), 's.json: target.playing_temperature_c: must be a number (°C)'],
      [(s) => (s.target.playing_temperature_c = 75), 's.json: target.playing_temperature_c: 75 °C is outside −30 to 60 °C'],
      [(s) => (s.steps[1].air_temperature_c = -40), 's.json: steps[1].air_temperature_c: -40 °C is outside −30 to 60 °C'],
      [(s) => (s.steps[1].cut_finished_at = 'after lunch'), 's.json: steps[1].cut_finished_at: must be a date and time (ISO 8601)'],
      [
        (s) => (s.steps[1].cut_finished_at = '2025-03-03T10:05:00Z'),
        's.json: steps[1].cut_finished_at: 2025-03-03T10:05:00Z is after the reading (recorded_at 2025-03-03T10:00:00Z): the cut is finished before the bar is struck',
      ],
      [
        (s) => (s.steps[1].cut_finished_at = '2025-03-03T08:30:00Z'),
        "s.json: steps[1].cut_finished_at: 2025-03-03T08:30:00Z is earlier than step 1's reading (2025-03-03T09:00:00Z): the cut is made after the bar was last struck",
      ],
      [(s) => (s.steps[1].measured_thickness_mm = [[500, 10]]), 's.json: steps[1].measured_thickness_mm[0]: position 500 mm is off the 380 mm bar'],
      [(s) => (s.steps[1].measured_thickness_mm = [[190, 30]]), "s.json: steps[1].measured_thickness_mm[0]: thickness 30 mm exceeds the blank's 22 mm"],
      [(s) => (s.steps[1].measured_thickness_mm = []), 's.json: steps[1].measured_thickness_mm: must be a non-empty list of [position_mm, thickness_mm] pairs'],
      [
        (s) => {
          s.steps[1].measured_thickness_mm = [[190, 7.9]];
          s.steps[1].thickness_measured_mm = [[190, 7.9]];
        },
        's.json: steps[1].thickness_measured_mm: give the caliper readings once, as measured_thickness_mm (thickness_measured_mm is the older name of the same field)',
      ],
    ];
    for (const [change, message] of cases) expect(ruleOf(withTwoSteps(change))).toBe(message);
  });

  it('reads barwright’s older caliper field into the contract’s, and appends steps leaving the file as it was', () => {
    const old = withTwoSteps((s) => (s.steps[1].thickness_measured_mm = [[190, 7.9]]));
    expect(parseSessionFile(old).steps[1]!.measured_thickness_mm).toEqual([[190, 7.9]]);
    const grown = appendSessionStep(old, { bar, measured_hz: [359, 1410, 3330], air_temperature_c: 21, cut_finished_at: '2025-03-03T10:30:00Z', recorded_at: '2025-03-03T10:45:00Z' });
    expect((grown.steps as unknown[]).slice(0, 2)).toEqual(old.steps);
  });
});

describe('old session files', () => {
  it('load unchanged: the demo fixture, written before the additions, parses with every value kept', () => {
    const raw = JSON.parse(readFileSync(new URL('../../fixtures/f3-workshop.session.json', import.meta.url), 'utf8'));
    const log = parseSessionFile(raw);
    expect(log.steps.map((s) => s.measured_hz)).toEqual(raw.steps.map((s: { measured_hz: number[] }) => s.measured_hz));
    expect(log.steps.map((s) => s.air_temperature_c)).toEqual(raw.steps.map((s: { air_temperature_c?: number }) => s.air_temperature_c));
    expect(log.steps[1]!.measured_thickness_mm).toEqual(raw.steps[1].thickness_measured_mm);
    expect(log.target).toEqual(raw.target);
  });

  it('behave exactly as before without the new fields (pinned regression: the contract example’s advice from the code before them)', () => {
    const result = nextCut(structuredClone(contractExample));
    // Pinned regression: printed by next-cut at commit 82cf8ae (before the turn-2 session fields), full precision.
    expect(result.status).toBe('cut');
    expect(result.predicted_hz).toEqual([351.66279535517447, 1405.0875720569866, 3350.183720231059]);
    expect(result.bar_after.profile_mm!.slice(10, 14)).toEqual([
      [108.106122449, 16.847210884349998],
      [113.069387755, 15.937278911583334],
      [118.032653061, 15.027346938816667],
      [122.995918367, 14.11741496605],
    ]);
    // No temperature recorded: nothing projected, the readings are the readings.
    expect(result.temperature.shift_cents).toBe(0);
    expect(result.readings_at_playing_temperature_hz).toEqual(contractExample.steps[0]!.measured_hz);
  });
});
