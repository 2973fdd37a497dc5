// `barwright next-cut --theory solid` on the workshop's session: what it prints of the wood and the
// grain, and a bad reading of another mode refused with its field and rule.
import { readFile } from 'node:fs/promises';
import { describe, expect, it } from 'vitest';
import type { CommandIo } from '../../src/cli/command.ts';
import { main } from '../../src/cli/main.ts';

function capture(files: Record<string, string>): CommandIo & { out: string[]; err: string[] } {
  const out: string[] = [];
  const err: string[] = [];
  return {
    out,
    err,
    stdout: (t) => out.push(t),
    stderr: (t) => err.push(t),
    readText: async (p) => (p in files ? files[p]! : readFile(p, 'utf8')),
    readBytes: async (p) => new Uint8Array(await readFile(p)),
    writeFile: async () => undefined,
  };
}

const demo = 'fixtures/f3-workshop.session.json';

/** The workshop's session with the last step's twisting mode read at `hz`. */
async function withTorsion(hz: number): Promise<string> {
  const session = JSON.parse(await readFile(demo, 'utf8')) as { steps: Record<string, unknown>[] };
  session.steps[session.steps.length - 1]!.measured_torsion_hz = hz;
  return JSON.stringify(session);
}

describe('barwright next-cut --theory solid', () => {
  it('prints the wood fitted on the solid model and, with a twisting mode read, the grain (a number of degrees within 0–90, no NaN)', async () => {
    // The solid model puts this bar's first twisting mode at 349 Hz with the file's wood (quarter-sawn); 380 Hz reads as rings turned toward flat-sawn.
    const io = capture({ 'twist.session.json': await withTorsion(380) });
    expect(await main(['next-cut', 'twist.session.json', '--theory', 'solid'], io)).toBe(0);
    const text = io.out.join('\n');
    expect(text).toMatch(/Wood fitted on the solid model to the bar now: E along the grain \d+\.\d\d GPa, shear moduli ×\d\.\d\d/);
    const grain = /growth rings at (\d+)° to the thickness/.exec(text);
    expect(grain).not.toBeNull();
    expect(Number(grain![1])).toBeGreaterThanOrEqual(0);
    expect(Number(grain![1])).toBeLessThanOrEqual(90);
    expect(text).not.toMatch(/NaN|Infinity/);
  }, 600_000);

  it('--json carries the solid report beside the contract fields', async () => {
    const io = capture({});
    expect(await main(['next-cut', demo, '--theory', 'solid', '--json'], io)).toBe(0);
    const result = JSON.parse(io.out.join('')) as { status: string; solid: { E_L_GPa: number; shear_scale: number; fit_residual_cents: number[]; grain: unknown; solid_solves: number } };
    expect(result.status).toBe('cut');
    expect(result.solid.E_L_GPa).toBeGreaterThan(5);
    expect(result.solid.E_L_GPa).toBeLessThan(30);
    expect(result.solid.fit_residual_cents).toHaveLength(3);
    expect(result.solid.grain).toBeNull();
    expect(result.solid.solid_solves).toBeGreaterThanOrEqual(2);
  }, 600_000);

  it('a twisting mode read below the fundamental is refused, naming the step and the rule', async () => {
    const io = capture({ 'bad.session.json': await withTorsion(150) });
    expect(await main(['next-cut', 'bad.session.json', '--theory', 'solid'], io)).toBe(2);
    expect(io.err.join('\n')).toMatch(/steps\[2\]\.measured_torsion_hz: 150 Hz must lie above the fundamental \(189\.13 Hz\)/);
  }, 60_000);
});
