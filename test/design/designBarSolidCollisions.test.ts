// The solid designer keeps torsion, lateral and longitudinal modes clear of the tuned partials.
import { describe, expect, it } from 'vitest';
import { mkdtempSync, readFileSync, writeFileSync } from 'node:fs';
import { tmpdir } from 'node:os';
import { join } from 'node:path';
import { designBarSolid } from '../../src/design/index.ts';
import { analyzeBar, type BarAnalysis } from '../../src/modes/index.ts';
import { parseBarFile } from '../../src/fileFormats/index.ts';
import { captureIo } from '../cli/captureIo.ts';
import { main } from '../../src/cli/main.ts';

async function run(args: string[]) {
  const io = captureIo({ writes: 'disk' });
  const code = await main(args, io);
  return { code, stdout: io.out.join('\n'), stderr: io.err.join('\n') };
}

// The demo's A2 blank (fixtures/a2-blank.bar.json, 560 × 64 × 25 mm) planed to 52.5 mm wide. Width
// moves the torsion modes (about 7–9 Hz per mm on torsion mode 2 here) and hardly the vertical
// ones; at this width the solid design for 1:4:10 puts torsion mode 2 within 15 Hz of partial 3
// (barwright's own solid runs, 2026-12: 6.3 Hz above it at 64 → 52.5 mm; 96.6 Hz below at 64 mm).
const a2 = JSON.parse(readFileSync(new URL('../../fixtures/a2-blank.bar.json', import.meta.url), 'utf8'));
const narrow = { ...a2, label: 'A2 blank planed narrow', section: { ...a2.section, width_mm: 52.5 } };
const target = { note: 'A2', a4: 442, ratios: '1:4:10' } as const;
const tolerance = [2, 5, 15]; // the defaults for 1:4:10 (common practice)

// The trade's beating distance, written out here on purpose (common practice, from memory; the
// domain brief's "other modes"): 6 Hz below 1 kHz, 15 Hz below 2 kHz, 30 Hz above.
const beatingDistance = (hz: number) => (hz < 1000 ? 6 : hz < 2000 ? 15 : 30);
const otherModes = (analysis: BarAnalysis) => [
  ...analysis.torsion.map((m) => ({ name: `torsion ${m.mode}`, hz: m.hz })),
  ...analysis.lateral.map((m) => ({ name: `lateral ${m.mode}`, hz: m.hz })),
  ...(analysis.longitudinal ?? []).map((m) => ({ name: `longitudinal ${m.mode}`, hz: m.hz })),
];
const cents = (hz: number, reference: number) => 1200 * Math.log2(hz / reference);

describe('keeping the other modes clear on the solid model (A2 blank planed to 52.5 mm)', () => {
  it('the arch made for the partials alone (keep_other_modes_clear: false) puts torsion mode 2 within 15 Hz of partial 3 on the solid model, where the line model places it clear: reported, not kept clear', () => {
    const result = designBarSolid(parseBarFile(narrow, 'narrow A2'), { target, keep_other_modes_clear: false });
    expect(result.feasible, result.reason).toBe(true);
    // A fresh solid analysis of the bar it wrote, not the designer's numbers.
    const solid = analyzeBar(result.bar, { theory: 'solid', modes: 3 });
    const partial3 = solid.bending[2]!.hz;
    const torsion2 = solid.torsion.find((m) => m.mode === 2)!.hz;
    expect(partial3).toBeGreaterThan(1000);
    expect(Math.abs(torsion2 - partial3)).toBeLessThanOrEqual(beatingDistance(partial3));
    expect(result.solid.collisions).toMatchObject({ kept_clear: false, holds: false, uncut_end_mm: null, solid_solves: 0 });
    expect(result.solid.collisions.after[0]).toMatchObject({ family: 'torsion', mode: 2, partial: 3, clear: false });
    expect(result.warnings.some((w) => /^on the solid model, torsion mode 2 is \d+ cents from bending partial 3/.test(w))).toBe(true);
    // The line model (Saint-Venant torsion, Timoshenko bending) of the same bar places torsion mode 2 clear of partial 3 and warns of nothing there.
    const line = analyzeBar(result.bar, { modes: 3 });
    const lineTorsion2 = line.torsion.find((m) => m.mode === 2)!.hz;
    console.log(`narrow A2: torsion 2 − partial 3, solid ${(torsion2 - partial3).toFixed(1)} Hz (${solid.torsion.find((m) => m.mode === 2)!.hz.toFixed(1)} / ${partial3.toFixed(1)}); line model ${(lineTorsion2 - line.bending[2]!.hz).toFixed(1)} Hz (${lineTorsion2.toFixed(1)} / ${line.bending[2]!.hz.toFixed(1)})`);
    expect(Math.abs(lineTorsion2 - line.bending[2]!.hz)).toBeGreaterThan(beatingDistance(line.bending[2]!.hz));
    expect(line.warnings.filter((w) => w.startsWith('torsion mode 2'))).toEqual([]);
  }, 180_000);

  it('design --theory solid keeps it clear by narrowing the arch; a fresh solid analysis of the written bar has every other mode beyond the beating distance of every tuned partial and the partials within tolerance', async () => {
    const dir = mkdtempSync(join(tmpdir(), 'barwright-collisions-'));
    const blankPath = join(dir, 'narrow-a2.bar.json');
    const outPath = join(dir, 'designed.bar.json');
    writeFileSync(blankPath, JSON.stringify(narrow));
    const out = await run(['design', blankPath, '--note', 'A2', '--a4', '442', '--ratios', '1:4:10', '--theory', 'solid', '--out', outPath]);
    expect(out.code, out.stderr).toBe(0);
    expect(out.stdout).toMatch(/^Feasible: every partial within tolerance\.$/m);
    const line = out.stdout.split('\n').find((l) => l.startsWith('Other modes:'));
    expect(line).toMatch(/on the arch made for the partials alone torsion mode 2 is \d+\.\d Hz (above|below) partial 3 \(rule: 15 Hz\); keeping the arch \d+\.\d mm from each end \(was \d+\.\d mm, \d+ more solid solves\) clears them; every torsion, lateral and longitudinal mode is clear/);
    const [to, from] = line!.match(/keeping the arch (\d+\.\d) mm from each end \(was (\d+\.\d) mm/)!.slice(1).map(Number);
    expect(to!).toBeGreaterThan(from!);

    const designed = parseBarFile(JSON.parse(readFileSync(outPath, 'utf8')), 'designed');
    const solid = analyzeBar(designed, { theory: 'solid', modes: 3 });
    const tuned = solid.bending.slice(0, 3).map((m) => m.hz);
    // A2 is MIDI 45: f = 442 · 2^((45 − 69)/12) Hz (equal temperament, MIDI 1.0), partials at 1 : 4 : 10.
    const targets = [1, 4, 10].map((ratio) => ratio * 442 * 2 ** ((45 - 69) / 12));
    tuned.forEach((hz, k) => expect(Math.abs(cents(hz, targets[k]!)), `partial ${k + 1}`).toBeLessThanOrEqual(tolerance[k]!));
    const others = otherModes(solid);
    expect(others.some((m) => m.name === 'torsion 2')).toBe(true);
    for (const other of others)
      for (const [k, hz] of tuned.entries()) expect(Math.abs(other.hz - hz), `${other.name} against partial ${k + 1}`).toBeGreaterThan(beatingDistance(hz));
  }, 180_000);

  it('a bar cut already leaves the lever no room: not feasible, and the reason says which mode, how far, and what moves it', async () => {
    // The demo's F3 rough cut (fixtures/f3-rough.bar.json, cut from 90 to 350 mm already) planed to
    // 49 mm wide: lateral mode 2 about 4 Hz above partial 3 (barwright's own solid runs, 2026-12);
    // longer uncut ends cannot undo the cut that is there.
    const rough = JSON.parse(readFileSync(new URL('../../fixtures/f3-rough.bar.json', import.meta.url), 'utf8'));
    const dir = mkdtempSync(join(tmpdir(), 'barwright-collisions-'));
    const blankPath = join(dir, 'narrow-f3.bar.json');
    writeFileSync(blankPath, JSON.stringify({ ...rough, section: { ...rough.section, width_mm: 49 } }));
    const out = await run(['design', blankPath, '--note', 'F3', '--a4', '442', '--ratios', '1:4:10', '--theory', 'solid', '--json']);
    expect(out.code, out.stderr).toBe(0);
    const result = JSON.parse(out.stdout);
    expect(result.feasible).toBe(false);
    expect(result.reason).toMatch(/^the partials are on target, but no arch within the limits keeps every other mode clear of them \(uncut ends tried up to \d+\.\d mm\): lateral mode 2 is \d+\.\d Hz above partial 3 \(rule: 15 Hz\) — it can buzz or beat; the blank's width moves them/);
    expect(result.solid.collisions).toMatchObject({ kept_clear: true, holds: false, uncut_end_mm: null });
    // What it says is so on a fresh analysis of the bar it returns: the partials on target, lateral 2 inside 15 Hz.
    const solid = analyzeBar(parseBarFile(result.bar, 'returned'), { theory: 'solid', modes: 3 });
    const partial3 = solid.bending[2]!.hz;
    expect(Math.abs(solid.lateral.find((m) => m.mode === 2)!.hz - partial3)).toBeLessThanOrEqual(beatingDistance(partial3));
    result.target_hz.forEach((hz: number, k: number) => expect(Math.abs(cents(solid.bending[k]!.hz, hz)), `partial ${k + 1}`).toBeLessThanOrEqual(tolerance[k]!));
  }, 300_000);

  it('--other-modes goes with --theory solid and takes clear or warn', async () => {
    const wrongTheory = await run(['design', 'fixtures/a2-blank.bar.json', '--note', 'A2', '--other-modes', 'warn']);
    expect(wrongTheory.code).toBe(2);
    expect(wrongTheory.stderr).toMatch(/--other-modes: goes with --theory solid/);
    const wrongValue = await run(['design', 'fixtures/a2-blank.bar.json', '--note', 'A2', '--theory', 'solid', '--other-modes', 'ignore']);
    expect(wrongValue.code).toBe(2);
    expect(wrongValue.stderr).toMatch(/--other-modes: must be clear or warn/);
  });
});
