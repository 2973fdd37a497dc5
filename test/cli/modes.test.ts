// The `modes` and `materials` commands against the contract: JSON shape, exit codes, messages.
import { describe, expect, it } from 'vitest';
import { main } from '../../src/cli/main.ts';
import { captureIo as capture } from './captureIo.ts';


describe('barwright modes', () => {
  it('prints one JSON document in the contract shape', async () => {
    const io = capture();
    expect(await main(['modes', 'fixtures/f4-practice.bar.json', '--json'], io)).toBe(0);
    expect(io.out).toHaveLength(1);
    const result = JSON.parse(io.out[0]!);
    expect(result.theory).toBe('timoshenko');
    expect(result.bending).toHaveLength(4);
    expect(result.bending[0].ratio).toBe(1);
    expect(result.bending.map((m: { mode: number }) => m.mode)).toEqual([1, 2, 3, 4]);
    for (let i = 1; i < 4; i++) expect(result.bending[i].hz).toBeGreaterThan(result.bending[i - 1].hz);
    expect(result.bending[0].nodes_mm).toHaveLength(2);
    expect(result.torsion[0]).toHaveProperty('hz');
    expect(result.lateral[0]).toHaveProperty('hz');
    expect(Array.isArray(result.warnings)).toBe(true);
    expect(io.out[0]).not.toMatch(/NaN|Infinity/);
  });
  it('honours --modes and --theory', async () => {
    const io = capture();
    expect(await main(['modes', 'fixtures/c5-blank.bar.json', '--modes', '6', '--theory', 'euler-bernoulli', '--json'], io)).toBe(0);
    const result = JSON.parse(io.out[0]!);
    expect(result.theory).toBe('euler-bernoulli');
    expect(result.bending).toHaveLength(6);
  });
  it('prints a table without --json', async () => {
    const io = capture();
    expect(await main(['modes', 'fixtures/c5-blank.bar.json'], io)).toBe(0);
    expect(io.out[0]).toMatch(/partial\s+Hz\s+ratio/);
  });
  it.each([
    [['modes', 'fixtures/missing.bar.json'], 'fixtures/missing.bar.json: file: file not found'],
    [['modes', 'fixtures/c5-blank.bar.json', '--theory', 'plate'], 'command line: --theory: must be timoshenko, euler-bernoulli or solid (got "plate")'],
    [['modes', 'fixtures/c5-blank.bar.json', '--modes', 'x'], 'command line: --modes: "x" is not a number'],
    [['modes'], 'command line: BAR: give exactly one bar file'],
    [['modes', 'fixtures/c5-blank.bar.json', '--wobble'], 'command line: options:'],
    [['sing'], 'command line: command: unknown command "sing"'],
  ])('exits 2 with one line for %j', async (args, message) => {
    const io = capture();
    expect(await main(args, io)).toBe(2);
    expect(io.err).toHaveLength(1);
    expect(io.err[0]).toContain(message);
    expect(io.err[0]!.includes('\n')).toBe(false);
  });
});

describe('barwright modes --theory solid', () => {
  it('prints one JSON document: every family keyed as before plus longitudinal, each mode with kind, line_model_cents and nodal_lines_mm; the material says what was assumed', async () => {
    const io = capture();
    expect(await main(['modes', 'fixtures/f4-practice.bar.json', '--theory', 'solid', '--modes', '3', '--json'], io)).toBe(0);
    expect(io.out).toHaveLength(1);
    expect(io.out[0]).not.toMatch(/NaN|Infinity/);
    const result = JSON.parse(io.out[0]!);
    expect(result.theory).toBe('solid');
    expect(result.bending).toHaveLength(3);
    for (const family of ['bending', 'torsion', 'lateral', 'longitudinal']) {
      expect(Array.isArray(result[family])).toBe(true);
      for (const mode of result[family]) {
        expect(mode.kind).toBe(family);
        expect(typeof mode.line_model_cents).toBe('number');
        expect(Array.isArray(mode.nodal_lines_mm)).toBe(true);
      }
    }
    // The fundamental's nodal lines: two, symmetric about the middle of a symmetric bar.
    const [left, right] = result.bending[0].nodal_lines_mm;
    expect(Math.abs(left + right - 380)).toBeLessThan(1e-6);
    // Measured: the line model is 38 cents sharp of the solid on the fundamental of this deep arch.
    expect(result.bending[0].line_model_cents).toBeGreaterThan(20);
    expect(result.material.assumed).toContain('nu_RT');
    expect(result.material.assumed).not.toContain('G_LR_GPa');
  });
  it('prints a table naming the assumed constants and the sign convention', async () => {
    const io = capture();
    expect(await main(['modes', 'fixtures/f4-practice.bar.json', '--theory', 'solid', '--modes', '3'], io)).toBe(0);
    expect(io.out[0]).toMatch(/solid theory/);
    expect(io.out[0]).toMatch(/Assumed \(not in the bar file\): E_R_GPa/);
    expect(io.out[0]).toMatch(/\+ means the line model is sharp/);
  });
  it('keeps a tube on the line model and says so', async () => {
    const io = capture();
    expect(await main(['modes', 'fixtures/chime-g4.bar.json', '--theory', 'solid', '--json'], io)).toBe(0);
    const result = JSON.parse(io.out[0]!);
    expect(result.theory).toBe('timoshenko');
    expect(result.notes[0]).toMatch(/solid theory models rectangular bars/);
  });
});

describe('barwright materials', () => {
  it('lists every preset with a source for each value', async () => {
    const io = capture();
    expect(await main(['materials', '--json'], io)).toBe(0);
    const { presets } = JSON.parse(io.out[0]!);
    expect(presets.length).toBeGreaterThanOrEqual(8);
    for (const preset of presets) {
      for (const key of ['E', 'G', 'density', 'poisson']) expect(preset.sources[key]).toMatch(/\w/);
      expect(preset.E_GPa).toBeGreaterThan(0);
    }
  });
});
