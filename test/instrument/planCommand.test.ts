import { mkdtemp, readFile, rm, writeFile } from 'node:fs/promises';
import { tmpdir } from 'node:os';
import { join } from 'node:path';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { main } from '../../src/cli/main.ts';
import { parseRfc4180 } from './rfc4180.ts';
import { captureIo } from '../cli/captureIo.ts';

// A small keyboard of the demo workshop's top register (fundamental only: quick to plan).
const smallKeyboard = {
  format: 'barwright.keyboard',
  version: 1,
  name: 'Demo workshop: treble test run',
  range: { lowest: 'G#6', highest: 'C7' },
  pitch: { a4_hz: 442 },
  material: { preset: 'demo-tropical-hardwood' },
  sections: [{ from: 'G#6', to: 'C7', width_mm: 38, thickness_mm: 17 }],
  tuning: [{ from: 'G#6', to: 'C7', ratios: [1], tolerance_cents: [3] }],
  resonators: { air_temperature_c: 22, open_end: 'unflanged', diameters: [{ from: 'G#6', to: 'C7', inner_diameter_mm: 40 }] },
};

const capture = () => captureIo({ writes: 'disk' });

let dir: string;
beforeAll(async () => {
  dir = await mkdtemp(join(tmpdir(), 'plan-'));
  await writeFile(join(dir, 'small.keyboard.json'), JSON.stringify(smallKeyboard));
});
afterAll(() => rm(dir, { recursive: true, force: true }));

describe('barwright plan', () => {
  it('plans a keyboard into --out: plan JSON, RFC 4180 cut list, one SVG template per bar', async () => {
    const io = capture();
    const out = join(dir, 'out');
    expect(await main(['plan', join(dir, 'small.keyboard.json'), '--out', out, '--workers', '2'], io)).toBe(0);
    const text = io.out.join('\n');
    expect(text).toContain('G#6');
    expect(text).toContain('Cautions:');
    expect(io.err.some((line) => line.startsWith('designed C7'))).toBe(true);
    const plan = JSON.parse(await readFile(join(out, 'keyboard-plan.json'), 'utf8'));
    expect(plan.format).toBe('barwright.keyboard-plan');
    expect(plan.notes).toEqual(['G#6', 'A6', 'A#6', 'B6', 'C7']);
    const records = parseRfc4180(await readFile(join(out, 'cut-list.csv'), 'utf8'));
    expect(records).toHaveLength(6);
    for (const name of ['01-Gs6.svg', '02-A6.svg', '03-As6.svg', '04-B6.svg', '05-C7.svg']) expect(await readFile(join(out, 'templates', name), 'utf8')).toContain('<svg');
  }, 120_000);

  it('resumes from the plan in --out: nothing designed again when nothing changed', async () => {
    const io = capture();
    expect(await main(['plan', join(dir, 'small.keyboard.json'), '--out', join(dir, 'out'), '--json'], io)).toBe(0);
    expect(io.out).toHaveLength(1);
    const plan = JSON.parse(io.out[0]!);
    expect(plan.summary.complete).toBe(true);
    // --json prints no progress; and nothing was redone (progress would have said "designed").
    expect(io.err).toEqual([]);
    const io2 = capture();
    expect(await main(['plan', join(dir, 'small.keyboard.json'), '--out', join(dir, 'out')], io2)).toBe(0);
    expect(io2.err.filter((l) => l.startsWith('designed') || l.startsWith('advised'))).toEqual([]);
  }, 120_000);

  it('exits 2 naming the file, the field and the rule', async () => {
    const bad = { ...smallKeyboard, tuning: [{ from: 'A6', to: 'C7', ratios: [1], tolerance_cents: [3] }] };
    await writeFile(join(dir, 'bad.keyboard.json'), JSON.stringify(bad));
    const io = capture();
    const path = join(dir, 'bad.keyboard.json');
    expect(await main(['plan', path], io)).toBe(2);
    expect(io.err).toEqual([`${path}: tuning[0].from: A6 must be the keyboard's lowest note G#6`]);
  });
});
