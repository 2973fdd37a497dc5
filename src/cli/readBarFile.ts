import { parseBarFile, type BarFile } from '../fileFormats/index.ts';
import { readJsonFile, type CommandIo } from './command.ts';

/** Reads and validates a bar file; errors name the file, the field and the rule (exit 2). */
export async function readBarFile(path: string, io: CommandIo): Promise<BarFile> {
  return parseBarFile(await readJsonFile(path, io), path);
}
