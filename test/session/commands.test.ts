// `barwright next-cut` and `barwright characterize` against the contract: one JSON document with
// --json, a readable report without, exit 2 with a one-line message naming file, field and rule.
import { readFile } from 'node:fs/promises';
import { describe, expect, it } from 'vitest';
import type { CommandIo } from '../../src/cli/command.ts';
import { main } from '../../src/cli/main.ts';
import { parseBarFile } from '../../src/fileFormats/barFile.ts';

function capture(files: Record<string, string> = {}): CommandIo & { out: string[]; err: string[]; written: Record<string, string> } {
  const out: string[] = [];
  const err: string[] = [];
  const written: Record<string, string> = {};
  return {
    out,
    err,
    written,
    stdout: (t) => out.push(t),
    stderr: (t) => err.push(t),
    readText: async (p) => (p in files ? files[p]! : p in written ? written[p]! : readFile(p, 'utf8')),
    readBytes: async (p) => new Uint8Array(await readFile(p)),
    writeFile: async (p, data) => {
      written[p] = typeof data === 'string' ? data : new TextDecoder().decode(data);
    },
  };
}

const demo = 'fixtures/f3-workshop.session.json';

describe('barwright next-cut', () => {
  it('--json prints exactly one JSON document with the contract fields', async () => {
    const io = capture();
    expect(await main(['next-cut', demo, '--json'], io)).toBe(0);
    expect(io.out).toHaveLength(1);
    expect(io.err).toEqual([]);
    const result = JSON.parse(io.out[0]!);
    expect(result.status).toBe('cut');
    expect(Object.keys(result)).toEqual(expect.arrayContaining(['status', 'bar_after', 'predicted_hz', 'calibrated_material']));
    expect(Object.keys(result.calibrated_material).sort()).toEqual(['E_GPa', 'G_GPa', 'density_kg_m3']);
    expect(() => parseBarFile(result.bar_after)).not.toThrow();
    expect(io.out[0]).not.toMatch(/NaN|Infinity/);
  });

  it('prints a table, the cut, the sketch and the cautions without --json', async () => {
    const io = capture();
    expect(await main(['next-cut', demo], io)).toBe(0);
    const text = io.out.join('\n');
    expect(text).toMatch(/Status: cut/);
    expect(text).toMatch(/station mm\s+now mm\s+after mm\s+remove mm/);
    expect(text).toMatch(/caution: Power tools/);
    expect(text).toMatch(/caution: Fine hardwood dust/);
    expect(text).not.toMatch(/NaN|Infinity/);
  });

  it('writes the bar after the cut with --out, and refuses to replace an existing file', async () => {
    const io = capture({ 'taken.bar.json': '{}' });
    expect(await main(['next-cut', demo, '--out', 'step4.bar.json'], io)).toBe(0);
    expect(() => parseBarFile(JSON.parse(io.written['step4.bar.json']!))).not.toThrow();
    const refused = capture({ 'taken.bar.json': '{}' });
    expect(await main(['next-cut', demo, '--out', 'taken.bar.json'], refused)).toBe(2);
    expect(refused.err).toEqual(['command line: --out: taken.bar.json already exists; choose another name or add --force to replace it']);
    expect(refused.written).toEqual({});
  });

  it('exits 2 with one line naming the file, the field and the rule', async () => {
    const session = JSON.parse(await readFile(demo, 'utf8'));
    session.steps[1].measured_hz[2] = -5;
    const io = capture({ 'bad.session.json': JSON.stringify(session) });
    expect(await main(['next-cut', 'bad.session.json'], io)).toBe(2);
    expect(io.err).toEqual(['bad.session.json: steps[1].measured_hz[2]: must be greater than 0 Hz (got -5)']);
    const missing = capture();
    expect(await main(['next-cut', 'no-such.session.json'], missing)).toBe(2);
    expect(missing.err[0]).toBe('no-such.session.json: file: file not found');
  });
});

describe('barwright characterize', () => {
  // An invented C5 blank of the demo keyboard, 280 × 50 × 21 mm, weighed at 299 g.
  const blank = 'c5.bar.json';
  const files = { [blank]: JSON.stringify({ format: 'barwright.bar', version: 1, label: 'C5 blank', length_mm: 280, section: { shape: 'rect', width_mm: 50, thickness_mm: 21 }, material: { preset: 'demo-tropical-hardwood' } }) };

  it('--json prints one document with the material, its uncertainty and the fit', async () => {
    const io = capture(files);
    expect(await main(['characterize', blank, '--partials', '1119.7,2724.8,4627.9', '--mass-g', '299', '--json'], io)).toBe(0);
    expect(io.out).toHaveLength(1);
    const result = JSON.parse(io.out[0]!);
    // The partials were made from E = 19.0 GPa, G = 1.21 GPa by the closed-form Timoshenko
    // frequency equation (test/reference/huangFreeFree.ts) and rounded to 0.1 Hz.
    expect(result.material.E_GPa).toBeCloseTo(19.0, 1);
    expect(result.material.G_GPa).toBeCloseTo(1.21, 1);
    expect(result.density_from).toBe('mass');
    expect(result.consistent).toBe(true);
    expect(result.bar.material.E_GPa).toBe(result.material.E_GPa);
  });

  it('prints a table without --json and names a bad option', async () => {
    const io = capture(files);
    expect(await main(['characterize', blank, '--partials', '1119.7,2724.8'], io)).toBe(0);
    expect(io.out.join('\n')).toMatch(/E \(GPa\)\s+\d+\.\d{3}/);
    const bad = capture(files);
    expect(await main(['characterize', blank, '--partials', '1119.7,abc'], bad)).toBe(2);
    expect(bad.err).toEqual(['command line: --partials[1]: "abc" is not a frequency above 0 Hz']);
    const none = capture(files);
    expect(await main(['characterize', blank], none)).toBe(2);
    expect(none.err[0]).toMatch(/^command line: --partials: give the tapped partials in Hz/);
  });
});
