// The session file: the contract's example parses; every rule broken is named by field and rule;
// the log only ever grows, and any rewrite is reported.
import { readFileSync } from 'node:fs';
import fc from 'fast-check';
import { describe, expect, it } from 'vitest';
import { isInputError } from '../../src/fileFormats/InputError.ts';
import { parseSessionFile, sessionTargetHz } from '../../src/fileFormats/sessionFile.ts';
import { appendSessionStep, sessionLogChanges, sessionLogOnlyExtends } from '../../src/fileFormats/sessionLogEdits.ts';

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

/** The contract's example session (contract.md, `barwright next-cut`). */
const contractExample = {
  format: 'barwright.session',
  version: 1,
  target: { hz: 349.23, ratios: [1, 4, 10], tolerance_cents: [2, 5, 15] },
  limits: { min_thickness_mm: 6 },
  steps: [{ bar, measured_hz: [362.1, 1421.0, 3350.2] }],
};

function ruleOf(value: unknown): string {
  try {
    parseSessionFile(value, 's.json');
  } catch (error) {
    if (isInputError(error)) return error.message;
    throw error;
  }
  return 'accepted';
}

function withChange(change: (session: Record<string, any>) => void): Record<string, any> {
  const copy = structuredClone(contractExample) as Record<string, any>;
  change(copy);
  return copy;
}

describe('parseSessionFile', () => {
  it('accepts the contract example and keeps its values', () => {
    const log = parseSessionFile(contractExample, 'example');
    expect(log.steps).toHaveLength(1);
    expect(log.steps[0]!.measured_hz).toEqual([362.1, 1421.0, 3350.2]);
    expect(log.limits.min_thickness_mm).toBe(6);
    // Target partials: the fundamental times each ratio.
    expect(sessionTargetHz(log.target)).toEqual([349.23, 4 * 349.23, 10 * 349.23]);
  });

  it('accepts the demo fixture with every optional field barwright adds', () => {
    const value = JSON.parse(readFileSync(new URL('../../fixtures/f3-workshop.session.json', import.meta.url), 'utf8'));
    const log = parseSessionFile(value, 'f3-workshop.session.json');
    expect(log.steps.length).toBeGreaterThanOrEqual(3);
    expect(log.steps[1]!.measured_thickness_mm?.length).toBeGreaterThan(0);
    expect(log.steps[1]!.cut?.made).toBe('as-done');
    // F3 at A4 = 442: 442 · 2^((53 − 69)/12) (MIDI 1.0 numbering, equal temperament).
    expect(sessionTargetHz(log.target)[0]).toBeCloseTo(442 * 2 ** (-16 / 12), 9);
  });

  it('takes a note and A4 instead of hz, and refuses the two when they disagree', () => {
    expect(ruleOf(withChange((s) => (s.target = { note: 'F4', a4: 442, ratios: [1, 4], tolerance_cents: [2, 5] })))).toBe('accepted');
    expect(ruleOf(withChange((s) => (s.target.note = 'G4')))).toMatch(/^s\.json: target\.hz: 349\.23 Hz is -?\d+\.\d cents from G4/);
  });

  it('names the field and the rule for each kind of bad input', () => {
    const cases: [(s: Record<string, any>) => void, RegExp][] = [
      [(s) => (s.format = 'other'), /^s\.json: format: must be "barwright\.session"/],
      [(s) => (s.version = 2), /^s\.json: version: must be 1/],
      [(s) => (s.target.ratios = [1, 4, 3]), /^s\.json: target\.ratios\[2\]: ratios must increase/],
      [(s) => (s.target.ratios = [2, 4, 10]), /^s\.json: target\.ratios\[0\]: the first ratio is the fundamental and must be 1/],
      [(s) => (s.target.tolerance_cents = [2, 5]), /^s\.json: target\.tolerance_cents: needs one tolerance per ratio \(3\)/],
      [(s) => delete s.target.hz, /^s\.json: target: give the fundamental as "hz", or as "note"/],
      [(s) => (s.limits.min_thickness_mm = 'six'), /^s\.json: limits\.min_thickness_mm: must be a number/],
      [(s) => (s.limits.allow_shortening = 'yes'), /^s\.json: limits\.allow_shortening: must be true or false/],
      [(s) => (s.steps[0].measured_hz = [362.1, -3]), /^s\.json: steps\[0\]\.measured_hz\[1\]: must be greater than 0 Hz \(got -3\)/],
      [(s) => (s.steps[0].measured_hz = []), /^s\.json: steps\[0\]\.measured_hz: needs at least 1 measured partial/],
      [(s) => (s.steps[0].bar.profile_mm[3] = [190, 23]), /^s\.json: steps\[0\]\.bar\.profile_mm\[3\]: thickness 23 mm exceeds the blank's 22 mm/],
      [(s) => (s.steps[0].cut = { made: 'roughly' }), /^s\.json: steps\[0\]\.cut\.made: must be "as-planned"/],
      [(s) => (s.steps[0].thickness_measured_mm = [[500, 10]]), /^s\.json: steps\[0\]\.thickness_measured_mm\[0\]: position 500 mm is off the 380 mm bar/],
      [(s) => (s.steps[0].air_temperature_c = 90), /^s\.json: steps\[0\]\.air_temperature_c: 90 °C is outside/],
      [(s) => (s.steps[0].recorded_at = 'yesterday'), /^s\.json: steps\[0\]\.recorded_at: must be a date and time/],
      [(s) => (s.measurement_uncertainty_cents = 0), /^s\.json: measurement_uncertainty_cents: must be greater than 0/],
      [
        (s) => {
          s.steps.push(structuredClone(s.steps[0]));
          s.steps[1].bar.section.width_mm = 60;
        },
        /^s\.json: steps\[1\]\.bar\.section\.width_mm: 60 mm differs from step 1's 55 mm/,
      ],
      [
        (s) => {
          s.steps[0].recorded_at = '2025-03-05T10:00:00Z';
          s.steps.push({ ...structuredClone(s.steps[0]), recorded_at: '2025-03-04T10:00:00Z' });
        },
        /^s\.json: steps\[1\]\.recorded_at: .* is earlier than step 1's/,
      ],
    ];
    for (const [change, rule] of cases) expect(ruleOf(withChange(change))).toMatch(rule);
  });

  it('is idempotent: a parsed log parses to itself (property, random valid measurements)', () => {
    fc.assert(
      fc.property(fc.array(fc.double({ min: 20, max: 20_000, noNaN: true }), { minLength: 1, maxLength: 5 }), fc.double({ min: 0.05, max: 5, noNaN: true }), (hz, uncertainty) => {
        const value = withChange((s) => {
          s.steps[0].measured_hz = hz;
          s.measurement_uncertainty_cents = uncertainty;
        });
        const once = parseSessionFile(value);
        expect(parseSessionFile(JSON.parse(JSON.stringify(once)))).toEqual(once);
      }),
      { numRuns: 50 },
    );
  });
});

describe('a session log is never rewritten silently', () => {
  const step = { bar: structuredClone(bar), measured_hz: [351.0, 1401.0, 3490.0], cut: { made: 'as-planned' } };

  it('appendSessionStep adds one step and leaves the rest exactly as it was, unknown fields included', () => {
    const original = withChange((s) => {
      s.workshop_note = 'kept as is';
      s.steps[0].tuner = 'kept too';
    });
    const frozen = structuredClone(original);
    const grown = appendSessionStep(original, step, 's.json');
    expect(original).toEqual(frozen);
    expect((grown.steps as unknown[]).length).toBe(2);
    expect(grown.workshop_note).toBe('kept as is');
    expect(sessionLogChanges(original, grown)).toEqual([{ kind: 'step-added', step: 2 }]);
    expect(sessionLogOnlyExtends(original, grown)).toBe(true);
  });

  it('refuses a bad new step, naming its place in the log', () => {
    expect(() => appendSessionStep(contractExample, { ...step, measured_hz: [0] }, 's.json')).toThrow(/^s\.json: steps\[1\]\.measured_hz\[0\]: must be greater than 0 Hz/);
  });

  it('reports any change to an earlier step or to the header (property: every single-number edit is caught)', () => {
    const base = appendSessionStep(contractExample, step, 's.json');
    fc.assert(
      fc.property(fc.integer({ min: 0, max: 1 }), fc.integer({ min: 0, max: 2 }), fc.double({ min: 0.001, max: 5, noNaN: true }), (index, partial, delta) => {
        const edited = structuredClone(base) as Record<string, any>;
        edited.steps[index].measured_hz[partial] += delta;
        const changes = sessionLogChanges(base, edited);
        expect(changes).toEqual([{ kind: 'step-changed', step: index + 1 }]);
        expect(sessionLogOnlyExtends(base, edited)).toBe(false);
      }),
      { numRuns: 40 },
    );
    const shortened = structuredClone(base) as Record<string, any>;
    shortened.steps.pop();
    shortened.target.tolerance_cents = [3, 5, 15];
    expect(sessionLogChanges(base, shortened)).toEqual([
      { kind: 'header-changed', field: 'target' },
      { kind: 'step-removed', step: 2 },
    ]);
  });
});
