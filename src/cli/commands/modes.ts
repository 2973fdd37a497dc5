import { analyzeBar, collisionRuleText, type BarAnalysis, type ModeResult } from '../../modes/index.ts';
import { InputError } from '../../fileFormats/index.ts';
import { fixed, formatTable, numberOption, parseOptions, toJson, type Command } from '../command.ts';
import { readBarFile } from '../readBarFile.ts';
import { sessionSummary } from '../readSession.ts';
import { calibratedAnalysis, calibrationNote } from '../../session/index.ts';

/** `barwright modes BAR`: the bar's bending, torsion and lateral modes (contract). */
export const modesCommand: Command = {
  name: 'modes',
  summary: 'vibration modes of a bar: bending partials, ratios, nodes, torsion and lateral modes (line model or 3D solid)',
  usage: 'barwright modes BAR [--modes N] [--theory timoshenko|euler-bernoulli|solid] [--shapes] [--session SESSION [--lots LOTS]] [--json]',
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
    if (theory !== 'timoshenko' && theory !== 'euler-bernoulli' && theory !== 'solid') throw new InputError('command line', '--theory', `must be timoshenko, euler-bernoulli or solid (got "${theory}")`);
    const bar = await readBarFile(positionals[0]!, io);
    // Once the bar has measurements, its session's calibrated model predicts its partials (one truth with next-cut).
    const calibrated = values.session === undefined ? null : await sessionSummary(values.session, values.lots, io);
    if (calibrated && theory !== 'timoshenko') throw new InputError('command line', '--theory', 'a session calibrates the timoshenko model: leave --theory out with --session');
    const analysis = calibrated ? calibratedAnalysis(bar, calibrated.summary, { modes, theory: 'timoshenko', shapes: values.shapes ?? false }) : analyzeBar(bar, { modes, theory, shapes: values.shapes ?? false });
    if (values.json) {
      io.stdout(toJson(analysis));
      return 0;
    }
    if (analysis.theory === 'solid') {
      io.stdout(solidTable(bar.label ?? positionals[0]!, analysis));
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
    lines.push(analysis.warnings.length ? analysis.warnings.map((w) => `warning: ${w}`).join('\n') : `No torsion or lateral mode within beating distance of partials 1–3 (${collisionRuleText}).`);
    io.stdout(lines.join('\n'));
    return 0;
  },
};

const signed = (value: number | null | undefined, decimals: number): string => (value === null || value === undefined ? '—' : `${value >= 0 ? '+' : ''}${fixed(value, decimals)}`);

/** The human-readable table of a solid-theory analysis. */
function solidTable(title: string, analysis: BarAnalysis): string {
  const lines: string[] = [];
  const mesh = analysis.mesh;
  const material = analysis.material!;
  lines.push(
    `${title}: solid theory (3D ${material.model} elasticity${material.grain ? `, grain ${material.grain}` : ''}), ${mesh.elements} hexahedra (${mesh.element ?? 'quadratic'}), ${mesh.unknowns} unknowns, ${mesh.solved_as === 'halves' ? 'the two halves across the width solved apart' : 'the full body solved'}`,
  );
  if (material.assumed.length) {
    const shown = material.assumed.map((field) => (field in material.constants ? `${field} ${+material.constants[field]!.toPrecision(3)}` : field));
    lines.push(`Assumed (not in the bar file): ${shown.join(', ')}${material.assumed_source ? ` — ${material.assumed_source}` : ''}`);
  }
  for (const note of analysis.notes ?? []) lines.push(`Note: ${note}`);
  const table = (rows: readonly ModeResult[], first: string) =>
    formatTable([
      [first, 'Hz', 'ratio', 'line model ¢', 'nodal lines on the top centre line (mm from left end)'],
      ...rows.map((m) => [String(m.mode), fixed(m.hz, 2), fixed(m.ratio, 4), signed(m.line_model_cents, 1), (m.nodal_lines_mm ?? []).map((x) => fixed(x, 1)).join(', ')]),
    ]);
  lines.push('', 'Bending (vertical) — the tuned partials', table(analysis.bending, 'partial'));
  for (const [name, family] of [
    ['Torsion', analysis.torsion],
    ['Lateral bending', analysis.lateral],
    ['Longitudinal', analysis.longitudinal ?? []],
  ] as const) {
    lines.push('', name, family.length ? table(family, 'mode') : '(none in this range)');
  }
  lines.push('', 'line model ¢: the Timoshenko / St-Venant / rod line model\'s mode against the solid\'s, 1200·log2(f_line/f_solid); + means the line model is sharp.');
  lines.push(analysis.warnings.length ? analysis.warnings.map((w) => `warning: ${w}`).join('\n') : `No torsion, lateral or longitudinal mode within beating distance of partials 1–3 (${collisionRuleText}).`);
  return lines.join('\n');
}
