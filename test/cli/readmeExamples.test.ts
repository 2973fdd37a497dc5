// Every `npx barwright …` example in README.md runs here, in process, and every line the README
// prints under it must come out of the command, in the same order ("…" stands for lines the README
// leaves out). So the README's figures are the program's figures, checked on every `npm test`.
import { mkdtempSync, readFileSync } from 'node:fs';
import { tmpdir } from 'node:os';
import { join } from 'node:path';
import { describe, expect, it } from 'vitest';
import { main } from '../../src/cli/main.ts';
import { captureIo } from './captureIo.ts';

interface Example {
  readonly command: string;
  /** The README's printed output, or null when the example shows none. */
  readonly printed: string[] | null;
}

/** The README's examples: a ```sh block of `npx barwright` lines, and the plain block right after it. */
function readmeExamples(text: string): Example[] {
  const blocks = [...text.matchAll(/```(\w*)\n([\s\S]*?)```/g)].map((match) => ({ language: match[1]!, body: match[2]!, start: match.index, end: match.index + match[0].length }));
  const examples: Example[] = [];
  blocks.forEach((block, index) => {
    if (block.language !== 'sh') return;
    const commands = block.body.split('\n').filter((line) => line.startsWith('npx barwright '));
    const next = blocks[index + 1];
    const printed = next && next.language === '' && text.slice(block.end, next.start).trim() === '' ? next.body.replace(/\n$/, '').split('\n') : null;
    commands.forEach((command, k) => examples.push({ command, printed: k === commands.length - 1 ? printed : null }));
  });
  return examples;
}

/**
 * True when `printed` appears in `actual` in order: lines compared without trailing spaces, blank
 * lines ignored on both sides, "…" standing for any run of lines, and the README free to start its
 * excerpt below the command's first lines (a title).
 */
function appearsInOrder(printedLines: readonly string[], actualLines: readonly string[]): { ok: boolean; missing?: string } {
  const printed = printedLines.filter((line) => line.trim() !== '');
  const actual = actualLines.filter((line) => line.trim() !== '');
  let at = 0;
  let skipping = true;
  for (const line of printed) {
    const wanted = line.trimEnd();
    if (wanted === '…') {
      skipping = true;
      continue;
    }
    if (skipping) {
      while (at < actual.length && actual[at]!.trimEnd() !== wanted) at++;
      skipping = false;
    }
    if (at >= actual.length || actual[at]!.trimEnd() !== wanted) return { ok: false, missing: wanted };
    at++;
  }
  return { ok: true };
}

const readme = readFileSync(new URL('../../README.md', import.meta.url), 'utf8');
const examples = readmeExamples(readme);
/** Options whose value is a file or folder the command writes: sent to a scratch folder instead. */
const outputOptions = new Set(['--out', '--template', '--table']);

describe('README examples', () => {
  it('finds the examples (one per command section)', () => {
    expect(examples.length).toBeGreaterThanOrEqual(9);
  });
  it.each(examples.map((example) => [example.command, example] as const))('%s', async (_, example) => {
    const scratch = mkdtempSync(join(tmpdir(), 'barwright-readme-'));
    const words = example.command.replace(/^npx barwright /, '').split(/\s+/);
    const args = words.map((word, i) => (i > 0 && outputOptions.has(words[i - 1]!) ? join(scratch, word) : word));
    const io = captureIo({ writes: 'disk' });
    const code = await main(args, io);
    expect(io.err.join('\n')).not.toMatch(/internal failure/);
    expect(code).toBe(0);
    if (!example.printed) return;
    // Paths the command prints under the scratch folder read as the README's relative ones.
    const actual = io.out.join('\n').split(`${scratch}/`).join('').split('\n');
    const found = appearsInOrder(example.printed, actual);
    expect(found.missing ? `README line not printed: ${found.missing}\n--- printed:\n${actual.join('\n')}` : '').toBe('');
  }, 180_000);
});
