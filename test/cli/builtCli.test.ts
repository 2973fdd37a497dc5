// The command line as the `barwright` bin runs it: the plain-JavaScript build in build/cli/ (made
// by the project's `prepare` script, scripts/buildCli.mjs), started as a real process. It prints
// exactly what the TypeScript sources print in-process; it is self-contained (no TypeScript loader,
// no package from node_modules at run time, the keyboard worker threads included); and the
// launcher rebuilds a build older than the sources, or says in one line what to run.
import { spawnSync } from 'node:child_process';
import { cpSync, existsSync, mkdirSync, mkdtempSync, readFileSync, readdirSync, rmSync, symlinkSync, utimesSync, writeFileSync } from 'node:fs';
import { tmpdir } from 'node:os';
import { join } from 'node:path';
import { fileURLToPath } from 'node:url';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { main } from '../../src/cli/main.ts';
import { captureIo } from './captureIo.ts';

const root = fileURLToPath(new URL('../../', import.meta.url));
const launcher = join(root, 'src/cli/barwright.mjs');
const scratch = mkdtempSync(join(tmpdir(), 'barwright-cli-'));

/** Runs `node <args>` in the repository (or `cwd`) and returns what it printed. */
function node(args: string[], cwd = root): { status: number | null; stdout: string; stderr: string } {
  const result = spawnSync(process.execPath, args, { cwd, encoding: 'utf8', timeout: 300_000 });
  return { status: result.status, stdout: result.stdout, stderr: result.stderr };
}

/** The same command in-process, from the TypeScript sources (the reference). */
async function fromSources(args: string[]): Promise<{ status: number; stdout: string; stderr: string }> {
  const io = captureIo();
  const status = await main(args, io);
  const joinLines = (lines: string[]) => lines.map((line) => (line.endsWith('\n') ? line : `${line}\n`)).join('');
  return { status, stdout: joinLines(io.out), stderr: joinLines(io.err) };
}

/** A three-bar keyboard (C6–D6) cut from the demo keyboard, small enough to plan in seconds. */
function smallKeyboardFile(): string {
  const demo = JSON.parse(readFileSync(join(root, 'fixtures/demo.keyboard.json'), 'utf8')) as Record<string, unknown>;
  const keyboard = {
    ...demo,
    name: 'Three bars of the demo keyboard',
    range: { lowest: 'C6', highest: 'D6' },
    sections: [{ from: 'C6', to: 'D6', width_mm: 38, thickness_mm: 17 }],
    tuning: [{ from: 'C6', to: 'D6', ratios: [1, 4], tolerance_cents: [2, 6] }],
    pitch: { a4_hz: 442, offsets_cents: {} },
  };
  delete (keyboard as { bar_materials?: unknown }).bar_materials;
  delete (keyboard as { resonators?: unknown }).resonators;
  delete (keyboard as { blanks?: unknown }).blanks;
  const path = join(scratch, 'three.keyboard.json');
  writeFileSync(path, `${JSON.stringify(keyboard, null, 2)}\n`);
  return path;
}

beforeAll(() => {
  // One launcher run makes sure build/cli is there and current (it rebuilds it otherwise).
  const first = node([launcher, '--help']);
  expect(first.status).toBe(0);
}, 120_000);

afterAll(() => rmSync(scratch, { recursive: true, force: true }));

describe('the built command line', () => {
  const commands: string[][] = [
    ['--help'],
    ['modes', 'fixtures/f4-practice.bar.json'],
    ['modes', 'fixtures/f4-practice.bar.json', '--json', '--theory', 'euler-bernoulli'],
    ['tubes', '--note', 'F4', '--a4', '442', '--inner-diameter-mm', '50', '--temp-c', '22'],
    ['tap', 'fixtures/wav/f4-practice-strike.wav', '--expect', 'fixtures/f4-practice.bar.json', '--json'],
    ['next-cut', 'fixtures/f3-workshop.session.json', '--json'],
    ['materials'],
    ['modes', 'fixtures/no-such.bar.json'],
    ['no-such-command'],
  ];
  for (const args of commands) {
    it(`prints what the sources print: barwright ${args.join(' ')}`, async () => {
      const built = node([launcher, ...args]);
      const reference = await fromSources(args);
      expect(built.stdout).toBe(reference.stdout);
      expect(built.stderr).toBe(reference.stderr);
      expect(built.status).toBe(reference.status);
    });
  }

  it('is self-contained: no TypeScript loader and no package from node_modules at run time', () => {
    const copy = join(scratch, 'cli-alone');
    cpSync(join(root, 'build/cli'), copy, { recursive: true });
    const bundles = readdirSync(copy).filter((name) => name.endsWith('.js'));
    expect(bundles.sort()).toEqual(['barwright.js', 'keyboardBarWorker.js']);
    for (const name of bundles) {
      const code = readFileSync(join(copy, name), 'utf8');
      // Only Node's own modules are imported (node:…, or the bare names of built-ins).
      const imported = [...code.matchAll(/^\s*import\s[^'"]*['"]([^'"]+)['"]/gm)].map((match) => match[1]!);
      expect(imported.filter((specifier) => !specifier.startsWith('node:'))).toEqual([]);
      expect(code).not.toMatch(/from ['"]tsx|['"]tsx\/esm/);
    }
    // Run from a folder with no node_modules anywhere above it: a bare import would fail.
    const run = node(['--input-type=module', '-e', `const { main } = await import(${JSON.stringify(join(copy, 'barwright.js'))}); process.exitCode = await main(['modes', ${JSON.stringify(join(root, 'fixtures/f4-practice.bar.json'))}, '--json']);`], scratch);
    expect(run.stderr).toBe('');
    expect(run.status).toBe(0);
    expect((JSON.parse(run.stdout) as { bending: unknown[] }).bending).toHaveLength(4);
  });

  it('plans a keyboard on its own plain-JavaScript worker threads, with the same result as the sources', async () => {
    const keyboard = smallKeyboardFile();
    const args = ['plan', keyboard, '--workers', '2', '--json'];
    const built = node([launcher, ...args]);
    expect(built.stderr).toBe('');
    expect(built.status).toBe(0);
    const reference = await fromSources(args);
    expect(reference.status).toBe(0);
    const plan = JSON.parse(built.stdout) as { notes: string[]; bars: Record<string, unknown> };
    expect(plan.notes).toEqual(['C6', 'C#6', 'D6']);
    // Bars finish in any order on two threads: compare with keys sorted.
    const sorted = (value: unknown): unknown =>
      Array.isArray(value) ? value.map(sorted) : value && typeof value === 'object' ? Object.fromEntries(Object.keys(value).sort().map((key) => [key, sorted((value as Record<string, unknown>)[key])])) : value;
    expect(sorted(plan)).toEqual(sorted(JSON.parse(reference.stdout)));
  }, 300_000);
});

describe('the launcher (src/cli/barwright.mjs)', () => {
  /** A checkout of just what the command line is built from, sharing this one's packages except those left out. */
  function checkout(name: string, { without = [] as string[] } = {}): string {
    const folder = join(scratch, name);
    for (const part of ['src', 'scripts', 'fixtures']) cpSync(join(root, part), join(folder, part), { recursive: true });
    for (const file of ['package.json', 'package-lock.json']) cpSync(join(root, file), join(folder, file));
    mkdirSync(join(folder, 'node_modules'));
    for (const entry of readdirSync(join(root, 'node_modules'))) if (!without.includes(entry)) symlinkSync(join(root, 'node_modules', entry), join(folder, 'node_modules', entry));
    return folder;
  }
  const launch = (folder: string, ...args: string[]) => node([join(folder, 'src/cli/barwright.mjs'), ...args], folder);
  /** Marks a source file as edited `seconds` from now. */
  const touch = (path: string, seconds: number) => utimesSync(path, new Date(Date.now() + seconds * 1000), new Date(Date.now() + seconds * 1000));

  it('builds a missing build, rebuilds one older than the sources (one line on stderr), and is quiet when current', () => {
    const folder = checkout('with-esbuild');
    const first = launch(folder, 'modes', 'fixtures/f4-practice.bar.json', '--json');
    expect(first.status).toBe(0);
    expect(first.stderr).toBe('barwright: the command line was not built yet; built it (build/cli)\n');
    expect(existsSync(join(folder, 'build/cli/keyboardBarWorker.js'))).toBe(true);
    const current = launch(folder, '--help');
    expect(current.stderr).toBe('');
    touch(join(folder, 'src/modes/analyzeBar.ts'), 60);
    const stale = launch(folder, '--help');
    expect(stale.status).toBe(0);
    expect(stale.stderr).toBe('barwright: the sources changed since the command line was built; built it again (build/cli)\n');
    expect(launch(folder, '--help').stderr).toBe('');
  }, 120_000);

  it('without esbuild (npm install --omit=dev): one line saying what to run, or the older build with a warning', () => {
    const folder = checkout('without-esbuild', { without: ['esbuild', '.bin'] });
    const missing = launch(folder, '--help');
    expect(missing.status).toBe(1);
    expect(missing.stdout).toBe('');
    expect(missing.stderr.trimEnd().split('\n')).toHaveLength(1);
    expect(missing.stderr).toMatch(/^barwright: the command line is not built .* run `npm install` without --omit=dev\n$/);
    // The project's own prepare script in that situation: one line, and the install goes on;
    // `npm run build:cli` asked for by hand fails with the same line.
    const prepare = node([join(folder, 'scripts/buildCli.mjs'), '--if-possible'], folder);
    expect(prepare.status).toBe(0);
    expect(prepare.stderr).toBe('barwright: esbuild (a dev dependency) is not installed, so the command line was not built: run `npm install` without --omit=dev\n');
    expect(node([join(folder, 'scripts/buildCli.mjs')], folder).status).toBe(1);
    // A build made earlier (here: copied from this checkout) that the sources have overtaken.
    cpSync(join(root, 'build/cli'), join(folder, 'build/cli'), { recursive: true });
    touch(join(folder, 'src/modes/analyzeBar.ts'), 60);
    const stale = launch(folder, '--help');
    expect(stale.status).toBe(0);
    expect(stale.stdout).toMatch(/^barwright — a tuning workbench/);
    expect(stale.stderr).toBe('barwright: warning: build/cli is older than the sources and esbuild, a dev dependency, is not installed to rebuild it: running the older build (`npm install` without --omit=dev brings it up to date)\n');
  }, 120_000);
});
