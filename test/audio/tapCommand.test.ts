import { readFileSync } from 'node:fs';
import { resolve } from 'node:path';
import { describe, expect, it } from 'vitest';
import { main } from '../../src/cli/main.ts';
import type { CommandIo } from '../../src/cli/command.ts';
import { cents } from '../../src/pitch/index.ts';
import { demoRecordings, renderDemoRecording } from './demoRecordings.ts';

const root = resolve(import.meta.dirname, '../..');

/** Runs the CLI in-process against the repository's files, capturing its output. */
async function run(args: string[]): Promise<{ code: number; stdout: string; stderr: string }> {
  let stdout = '';
  let stderr = '';
  const io: CommandIo = {
    stdout: (text) => (stdout += text),
    stderr: (text) => (stderr += text),
    readText: async (path) => readFileSync(resolve(root, path), 'utf8'),
    readBytes: async (path) => new Uint8Array(readFileSync(resolve(root, path))),
    writeFile: async () => {
      throw new Error('tap writes no files');
    },
  };
  const code = await main(args, io);
  return { code, stdout, stderr };
}

describe('demo recordings in fixtures/wav', () => {
  it('are exactly what test/audio/demoRecordings.ts renders', () => {
    for (const recording of demoRecordings) {
      expect(Buffer.compare(readFileSync(resolve(root, recording.path)), Buffer.from(renderDemoRecording(recording))), recording.path).toBe(0);
    }
  });
});

describe('barwright tap', () => {
  it('prints the contract JSON: sample rate, duration, partials ascending with hz, level_db, decay_s', async () => {
    const recording = demoRecordings[0]!;
    const { code, stdout } = await run(['tap', recording.path, '--json']);
    expect(code).toBe(0);
    const report = JSON.parse(stdout);
    expect(report.sample_rate).toBe(44100);
    expect(report.duration_s).toBe(1.2);
    expect(report.partials).toHaveLength(recording.scene.partials.length);
    report.partials.forEach((partial: { hz: number; level_db: number; decay_s: number }, i: number) => {
      const truth = recording.scene.partials[i]!;
      // Rounded output (0.001 Hz): 0.2 cent is still the bound.
      expect(Math.abs(cents(partial.hz, truth.hz))).toBeLessThan(0.2);
      expect(Math.abs(partial.decay_s / truth.decayS - 1)).toBeLessThan(0.1);
      expect(Object.keys(partial)).toEqual(['hz', 'level_db', 'decay_s']);
    });
  });

  it('with --expect labels bending partials and other modes from the bar file (analyzeBar)', async () => {
    const { code, stdout } = await run(['tap', 'fixtures/wav/f4-practice-strike.wav', '--expect', 'fixtures/f4-practice.bar.json', '--json']);
    expect(code).toBe(0);
    const report = JSON.parse(stdout);
    expect(report.partials.map((p: { mode: number | null }) => p.mode)).toEqual([1, null, 2, null, 3]);
    expect(report.partials.map((p: { other_mode: string | null }) => p.other_mode)).toEqual([null, 'torsion 1', null, 'lateral 1', null]);
  });

  it('reads the first channel of a 24-bit stereo file and limits the count with --partials', async () => {
    const { code, stdout } = await run(['tap', 'fixtures/wav/c7-blank-strike.wav', '--partials', '2', '--json']);
    expect(code).toBe(0);
    const report = JSON.parse(stdout);
    expect(report.channels).toBe(2);
    expect(report.partials.map((p: { hz: number }) => Math.round(p.hz))).toEqual([2398, 5455]);
  });

  it('prints a table with note names at the chosen A4', async () => {
    const { code, stdout } = await run(['tap', 'fixtures/wav/c7-blank-strike.wav', '--a4', '442']);
    expect(code).toBe(0);
    expect(stdout).toContain('nearest note (A4 = 442)');
    expect(stdout).toMatch(/2398\.099\s+D7 \+27\.7/);
    expect(stdout).not.toMatch(/NaN|Infinity/);
  });

  it('exits 2 with a one-line message on bad input', async () => {
    const cases: [string[], RegExp][] = [
      [['tap', 'fixtures/wav/missing.wav'], /^fixtures\/wav\/missing\.wav: file: file not found/],
      [['tap', 'fixtures/f4-practice.bar.json'], /^fixtures\/f4-practice\.bar\.json: file: not a readable WAV file/],
      [['tap', 'fixtures/wav/c7-blank-strike.wav', '--partials', '0'], /^command line: --partials: must be a whole number/],
      [['tap', 'fixtures/wav/c7-blank-strike.wav', '--a4', 'x'], /^command line: --a4: "x" is not a number/],
      [['tap'], /^command line: WAV: give exactly one WAV recording/],
    ];
    for (const [args, message] of cases) {
      const { code, stderr } = await run(args);
      expect(code, args.join(' ')).toBe(2);
      expect(stderr.trim().split('\n')).toHaveLength(1);
      expect(stderr).toMatch(message);
    }
  });
});
