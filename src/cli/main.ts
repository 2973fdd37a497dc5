import { readFile, writeFile } from 'node:fs/promises';
import { commands } from './commands.ts';
import type { CommandIo } from './command.ts';
import { isInputError } from '../fileFormats/index.ts';

/** The real process's input/output. */
export const processIo: CommandIo = {
  stdout: (text) => process.stdout.write(text.endsWith('\n') ? text : `${text}\n`),
  stderr: (text) => process.stderr.write(text.endsWith('\n') ? text : `${text}\n`),
  readText: (path) => readFile(path, 'utf8'),
  readBytes: async (path) => new Uint8Array(await readFile(path)),
  writeFile: (path, data) => writeFile(path, data),
};

function helpText(): string {
  const lines = ['barwright — a tuning workbench for mallet-percussion bars', '', 'Commands:'];
  for (const command of commands) lines.push(`  ${command.name.padEnd(12)} ${command.summary}`);
  lines.push('', 'Usage:');
  for (const command of commands) lines.push(`  ${command.usage}`);
  lines.push('', 'Lengths in mm, moduli in GPa, density in kg/m³, frequencies in Hz. Exit codes: 0 ok, 2 bad input, 1 internal failure.');
  return lines.join('\n');
}

/**
 * Runs `barwright <command> …` and returns the exit code: 0 success, 2 bad input (one line on
 * stderr naming the file, the field and the rule), 1 internal failure.
 */
export async function main(args: string[], io: CommandIo = processIo): Promise<number> {
  const [name, ...rest] = args;
  if (name === undefined || name === 'help' || name === '--help' || name === '-h') {
    io.stdout(helpText());
    return 0;
  }
  const command = commands.find((c) => c.name === name);
  if (!command) {
    io.stderr(`command line: command: unknown command "${name}" (try: ${commands.map((c) => c.name).join(', ')})`);
    return 2;
  }
  if (rest.includes('--help') || rest.includes('-h')) {
    io.stdout(command.usage);
    return 0;
  }
  try {
    return await command.run(rest, io);
  } catch (error) {
    if (isInputError(error)) {
      io.stderr(error.message);
      return 2;
    }
    io.stderr(`internal failure: ${error instanceof Error ? (error.stack ?? error.message) : String(error)}`);
    return 1;
  }
}
