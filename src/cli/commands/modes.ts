import { analyzeBar } from '../../modes/index.ts';
import { InputError } from '../../fileFormats/index.ts';
import { fixed, formatTable, numberOption, parseOptions, toJson, type Command } from '../command.ts';
import { readBarFile } from '../readBarFile.ts';
import { sessionSummary } from '../readSession.ts';
import { calibratedAnalysis, calibrationNote } from '../../session/index.ts';

/** `barwright modes BAR`: the bar's bending, torsion and lateral modes (contract). */
export const modesCommand: Command = {
  name: 'modes',
  summary: 'vibration modes of a bar: bending partials, ratios, nodes, torsion and lateral modes',
  usage: 'barwright modes BAR [--modes N] [--theory timoshenko|euler-bernoulli] [--shapes] [--session SESSION [--lots LOTS]] [--json]',
  async run(args, io) {
    const { values, positionals } = parseOptions(args, {
      modes: { type: 'string' },
      theory: { type: 'string' },
      shapes: { type: 'boolean' },
      session: { type: 'string' },
      lots: { type: 'string' },
      json: { type: 'boolean' },
    });
    if (values.lots !== undefined && values.session === undefined) throw new InputError('command line', '--lots', 'goes with --session (the lot of the session’s bar)');
    if (positionals.length !== 1) throw new InputError('command line', 'BAR', 'give exactly one bar file');
    const modes = numberOption(values.modes, 'modes', (n) => (Number.isInteger(n) && n >= 1 && n <= 30 ? null : 'must be a whole number from 1 to 30')) ?? 4;
    const theory = values.theory ?? 'timoshenko';
    if (theory !== 'timoshenko' && theory !== 'euler-bernoulli') throw new InputError('command line', '--theory', `must be timoshenko or euler-bernoulli (got "${theory}")`);
    const bar = await readBarFile(positionals[0]!, io);
    // Once the bar has measurements, its session's calibrated model predicts its partials (one truth with next-cut).
    const calibrated = values.session === undefined ? null : await sessionSummary(values.session, values.lots, io);
    if (calibrated && theory !== 'timoshenko') throw new InputError('command line', '--theory', 'a session calibrates the timoshenko model: leave --theory out with --session');
    const analysis = calibrated ? calibratedAnalysis(bar, calibrated.summary, { modes, theory, shapes: values.shapes ?? false }) : analyzeBar(bar, { modes, theory, shapes: values.shapes ?? false });
    if (values.json) {
      io.stdout(toJson(analysis));
      return 0;
    }
    const lines: string[] = [];
    lines.push(`${bar.label ?? positionals[0]}: ${theory} theory, ${analysis.mesh.elements} elements`);
    if (calibrated) lines.push(`Calibrated: ${calibrationNote(calibrated.summary, values.session!)}`);
    lines.push('');
    lines.push('Bending (vertical) — the tuned partials');
    lines.push(
      formatTable([
        ['partial', 'Hz', 'ratio', 'nodes from left end (mm)'],
        ...analysis.bending.map((m) => [String(m.mode), fixed(m.hz, 2), fixed(m.ratio, 4), (m.nodes_mm ?? []).map((x) => fixed(x, 1)).join(', ')]),
      ]),
    );
    for (const [title, family] of [
      ['Torsion', analysis.torsion],
      ['Lateral bending', analysis.lateral],
    ] as const) {
      lines.push('', title);
      lines.push(formatTable([['mode', 'Hz', 'ratio to fundamental'], ...family.map((m) => [String(m.mode), fixed(m.hz, 1), fixed(m.ratio, 3)])]));
    }
    lines.push('');
    lines.push(analysis.warnings.length ? analysis.warnings.map((w) => `warning: ${w}`).join('\n') : 'No torsion or lateral mode within 50 cents of partials 1–3.');
    io.stdout(lines.join('\n'));
    return 0;
  },
};
