// Collision warnings from the solid model, with the trade's beating distance in Hz.
import { describe, expect, it } from 'vitest';
import { readFileSync } from 'node:fs';
import { analyzeBar, collisionDistanceHz, collisionWarnings } from '../../src/modes/index.ts';
import { parseBarFile } from '../../src/fileFormats/index.ts';

describe('the beating distance (common practice, from memory: 6 Hz below 1 kHz, 15 Hz below 2 kHz, 30 Hz above)', () => {
  it('steps at 1 and 2 kHz', () => {
    expect([collisionDistanceHz(999), collisionDistanceHz(1000), collisionDistanceHz(1999), collisionDistanceHz(2000)]).toEqual([6, 15, 15, 30]);
  });

  it('flags a mode inside the distance and not one just outside, whatever the cents (Hz rule, not cents)', () => {
    // 5.9 Hz from 200 Hz is 50.3 cents (outside the old 50-cent window) yet inside 6 Hz: flagged.
    expect(collisionWarnings([200, 800, 1800], [{ family: 'torsion', mode: 1, hz: 205.9 }])).toHaveLength(1);
    // 16 Hz from 1800 Hz is 15.3 cents yet outside 15 Hz: not flagged.
    expect(collisionWarnings([200, 800, 1800], [{ family: 'lateral', mode: 1, hz: 1816 }])).toEqual([]);
    expect(collisionWarnings([200, 800, 1800], [{ family: 'lateral', mode: 1, hz: 1814 }])[0]).toMatch(/^lateral mode 1 is 13 cents from bending partial 3 \(14\.0 Hz apart; closer than 15 Hz can beat\)$/);
  });
});

describe('a collision the line model cannot see', () => {
  // The deep-arch F4 practice bar (fixtures/f4-practice.bar.json: 380 mm, arch to 8 mm), narrowed
  // to 46.7 mm. Width moves the lateral modes and hardly the vertical ones; this width was found
  // by bisecting the solid model's lateral mode 1 onto its partial 2 (barwright's own solid
  // results, 2026-12: solid lateral 1 ≈ 955.5 Hz, partial 2 ≈ 956.1 Hz; line model lateral 1 ≈
  // 1026.6 Hz against its partial 2 at 982.6 Hz, 77 cents and 44 Hz apart).
  const file = JSON.parse(readFileSync(new URL('../../fixtures/f4-practice.bar.json', import.meta.url), 'utf8'));
  const bar = parseBarFile({ ...file, section: { ...file.section, width_mm: 46.7 } }, 'narrow F4');

  it('the line model places lateral mode 1 clear of every tuned partial and warns of nothing', () => {
    const line = analyzeBar(bar, { modes: 3 });
    const lateral = line.lateral[0]!.hz;
    const partial2 = line.bending[1]!.hz;
    expect(Math.abs(1200 * Math.log2(lateral / partial2))).toBeGreaterThan(50);
    expect(line.warnings.filter((w) => w.startsWith('lateral mode 1'))).toEqual([]);
  });

  it('the solid model puts lateral mode 1 within 6 Hz of partial 2 and warns', () => {
    const solid = analyzeBar(bar, { modes: 3, theory: 'solid' });
    const lateral = solid.lateral.find((m) => m.mode === 1)!.hz;
    const partial2 = solid.bending[1]!.hz;
    expect(Math.abs(lateral - partial2)).toBeLessThan(6);
    expect(solid.warnings.some((w) => /^lateral mode 1 is \d+ cents from bending partial 2 \(\d+\.\d Hz apart; closer than 6 Hz can beat\)$/.test(w))).toBe(true);
  });
});
