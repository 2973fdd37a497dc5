import { analyzeRecording, type TapReport, expectedModesOf } from '../../audio/index.ts';
import { analyzeBar } from '../../modes/index.ts';
import { hzToNote, cents } from '../../pitch/index.ts';
import { checkA4, InputError } from '../../fileFormats/index.ts';
import { fixed, formatTable, numberOption, parseOptions, toJson, type Command, type CommandIo } from '../command.ts';
import { readBarFile } from '../readBarFile.ts';

async function readRecording(path: string, io: CommandIo): Promise<Uint8Array> {
  try {
    return await io.readBytes(path);
  } catch (error) {
    const code = (error as { code?: string }).code;
    throw new InputError(path, 'file', code === 'ENOENT' ? 'file not found' : `cannot be read (${code ?? String(error)})`);
  }
}

function signed(value: number, decimals: number): string {
  const text = fixed(value, decimals);
  return value > 0 && Number(text) !== 0 ? `+${text}` : text === `-${fixed(0, decimals)}` ? fixed(0, decimals) : text;
}

/** The human-readable table of a tap report. */
function tapTable(report: TapReport, path: string, a4Hz: number, labelled: boolean): string {
  const lines = [
    `${path}: ${report.sample_rate} Hz, ${report.channels} channel${report.channels === 1 ? '' : 's'}${report.channels > 1 ? ' (first analysed)' : ''}, ${fixed(report.duration_s, 2)} s, strike at ${fixed(report.strike_s, 3)} s`,
    '',
  ];
  if (report.partials.length === 0) {
    lines.push('No partials found: strike the bar harder or record closer.');
    return lines.join('\n');
  }
  const header = ['Hz', `nearest note (A4 = ${a4Hz})`, 'level dB', 'decay s (60 dB)'];
  if (labelled) header.push('mode', 'predicted Hz', 'cents vs predicted');
  const rows = report.partials.map((p) => {
    const note = hzToNote(p.hz, a4Hz);
    const row = [fixed(p.hz, 3), `${note.name} ${signed(note.cents, 1)}`, fixed(p.level_db, 1), fixed(p.decay_s, 3)];
    if (labelled) {
      const name = p.mode !== null && p.mode !== undefined ? `bending ${p.mode}` : (p.other_mode ?? '—');
      const predicted = p.predicted_hz ?? null;
      row.push(name, predicted === null ? '—' : fixed(predicted, 2), predicted === null ? '—' : signed(cents(p.hz, predicted), 1));
    }
    return row;
  });
  lines.push(formatTable([header, ...rows]));
  return lines.join('\n');
}

/** `barwright tap WAV`: the partials of a recorded strike (contract). */
export const tapCommand: Command = {
  name: 'tap',
  summary: 'partials of a recorded strike (WAV): frequency, level, decay; labelled against a bar file',
  usage: 'barwright tap WAV [--expect BAR] [--partials N] [--a4 HZ] [--json]',
  async run(args, io) {
    const { values, positionals } = parseOptions(args, {
      expect: { type: 'string' },
      partials: { type: 'string' },
      a4: { type: 'string' },
      json: { type: 'boolean' },
    });
    if (positionals.length !== 1) throw new InputError('command line', 'WAV', 'give exactly one WAV recording');
    const maxPartials = numberOption(values.partials, 'partials', (n) => (Number.isInteger(n) && n >= 1 && n <= 40 ? null : 'must be a whole number from 1 to 40')) ?? 8;
    const a4Hz = checkA4(numberOption(values.a4, 'a4') ?? 440, 'command line', '--a4');
    const expected = values.expect !== undefined ? expectedModesOf(analyzeBar(await readBarFile(values.expect, io))) : undefined;
    const path = positionals[0]!;
    const report = analyzeRecording(await readRecording(path, io), { maxPartials, expected }, path);
    io.stdout(values.json ? toJson(report) : tapTable(report, path, a4Hz, expected !== undefined));
    return 0;
  },
};
