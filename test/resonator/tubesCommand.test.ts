import { describe, expect, it } from 'vitest';
import { main } from '../../src/cli/main.ts';
import type { CommandIo } from '../../src/cli/command.ts';

async function run(args: string[]): Promise<{ code: number; stdout: string; stderr: string }> {
  let stdout = '';
  let stderr = '';
  const io: CommandIo = {
    stdout: (text) => (stdout += text),
    stderr: (text) => (stderr += text),
    readText: async () => {
      throw new Error('tubes reads no files');
    },
    readBytes: async () => {
      throw new Error('tubes reads no files');
    },
    writeFile: async () => {
      throw new Error('tubes writes no files');
    },
  };
  const code = await main(args, io);
  return { code, stdout, stderr };
}

describe('barwright tubes', () => {
  it('prints the contract JSON fields for one note', async () => {
    const { code, stdout } = await run(['tubes', '--note', 'F4', '--a4', '442', '--inner-diameter-mm', '50', '--temp-c', '22', '--json']);
    expect(code).toBe(0);
    const tube = JSON.parse(stdout);
    // Same hand-worked example as resonator.test.ts: L = 230.08 mm, δ = 15.33 mm, c = 344.38 m/s.
    expect(tube.length_mm).toBe(230.1);
    expect(tube.speed_of_sound_m_s).toBe(344.38);
    expect(tube.end_correction_mm).toBe(15.33);
    expect(tube.harmonics_hz).toEqual([350.82, 1052.45, 1754.08]);
    expect(tube.reinforces_partials).toEqual([1]);
  });

  it('defaults to 20 °C and A4 = 440 and accepts --hz', async () => {
    const { stdout } = await run(['tubes', '--hz', '349.23', '--inner-diameter-mm', '50', '--json']);
    const tube = JSON.parse(stdout);
    expect(tube.temp_c).toBe(20);
    expect(tube.speed_of_sound_m_s).toBe(343.21);
    // L = 343.2146 / (4 · 349.23) − 0.6133 · 0.025 = 0.245695 − 0.015333 = 0.230362 m.
    expect(tube.length_mm).toBe(230.4);
  });

  it('says a 1 : 3 bar gets its second partial reinforced by the tube', async () => {
    const { stdout } = await run(['tubes', '--note', 'C5', '--inner-diameter-mm', '40', '--ratios', '1:3', '--json']);
    expect(JSON.parse(stdout).reinforces_partials).toEqual([1, 2]);
  });

  it('applies an end correction calibrated from a measured tube', async () => {
    const { stdout } = await run(['tubes', '--note', 'F4', '--a4', '442', '--inner-diameter-mm', '50', '--temp-c', '22', '--calibrate-length-mm', '230', '--calibrate-hz', '351.1', '--json']);
    const tube = JSON.parse(stdout);
    // δ/r = 0.6087 (worked in resonator.test.ts) → δ = 15.22 mm, L = 245.416 − 15.217 = 230.2 mm.
    expect(tube.end_correction_factor).toBe(0.6087);
    expect(tube.end_correction_mm).toBe(15.22);
    expect(tube.length_mm).toBe(230.2);
  });

  it('writes a whole range as CSV, one row per semitone', async () => {
    const { code, stdout } = await run(['tubes', '--range', 'A2:C7', '--a4', '442', '--inner-diameter-mm', '50', '--csv']);
    expect(code).toBe(0);
    const lines = stdout.trim().split('\r\n');
    expect(lines).toHaveLength(1 + 52);
    expect(lines[1]!.startsWith('A2,110.50,')).toBe(true);
    // C7 at A4 = 442: 442 · 2^(27/12) = 2102.52 Hz.
    expect(lines[52]!.startsWith('C7,2102.52,')).toBe(true);
  });

  it('exits 2 with a one-line message on bad input', async () => {
    const cases: [string[], RegExp][] = [
      [['tubes', '--note', 'H4', '--inner-diameter-mm', '50'], /^command line: --note: "H4" is not a note name/],
      [['tubes', '--note', 'F4'], /^command line: --inner-diameter-mm: the tube's inner diameter is required/],
      [['tubes', '--inner-diameter-mm', '50'], /^command line: --note: give exactly one of/],
      [['tubes', '--note', 'F4', '--inner-diameter-mm=-3'], /^command line: --inner-diameter-mm: must be greater than 0/],
      [['tubes', '--note', 'F4', '--inner-diameter-mm', '50', '--temp-c', '99'], /^command line: --temp-c: 99 °C is outside/],
      [['tubes', '--note', 'C8', '--inner-diameter-mm', '80'], /^command line: C8: inner diameter: a 80\.0 mm bore is too wide/],
      [['tubes', '--hz', '4000', '--inner-diameter-mm', '80'], /^command line: inner diameter: a 80\.0 mm bore is too wide/],
      [['tubes', '--note', 'F4', '--inner-diameter-mm', '50', '--ratios', '4:1'], /^command line: --ratios:/],
      [['tubes', '--note', 'F4', '--inner-diameter-mm', '50', '--humidity-pct', '140'], /^command line: --humidity-pct: 140 % is outside/],
      [['tubes', '--note', 'F4', '--inner-diameter-mm', '50', '--calibrate-hz', '300'], /^command line: --calibrate-hz: calibration needs both/],
    ];
    for (const [args, message] of cases) {
      const { code, stderr } = await run(args);
      expect(code, args.join(' ')).toBe(2);
      expect(stderr).toMatch(message);
    }
  });
});
