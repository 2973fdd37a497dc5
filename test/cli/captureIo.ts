// A CommandIo for running the CLI in-process in tests: reads the repository's files, captures
// stdout/stderr line by line, and keeps written files in memory (or writes them to disk).
import { readFile, writeFile } from 'node:fs/promises';
import type { CommandIo } from '../../src/cli/command.ts';

/** Captured output of one or more in-process CLI runs. */
export interface CapturedIo extends CommandIo {
  out: string[];
  err: string[];
  /** Files written, as text, when writes stay in memory. */
  files: Map<string, string>;
}

/** A CommandIo that records what a command prints; `writes: 'disk'` lets it write real files. */
export function captureIo({ writes = 'memory' }: { writes?: 'memory' | 'disk' } = {}): CapturedIo {
  const out: string[] = [];
  const err: string[] = [];
  const files = new Map<string, string>();
  return {
    out,
    err,
    files,
    stdout: (text) => out.push(text),
    stderr: (text) => err.push(text),
    readText: (path) => readFile(path, 'utf8'),
    readBytes: async (path) => new Uint8Array(await readFile(path)),
    writeFile: async (path, data) => {
      if (writes === 'disk') await writeFile(path, data);
      else files.set(path, typeof data === 'string' ? data : new TextDecoder().decode(data));
    },
  };
}
