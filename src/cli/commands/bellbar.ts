import { bellBarForNote, type BellBarStock, tuneBellBarOvertone, metalCautions, signedNumber } from '../../instrument/index.ts';
import { checkA4, parseBarFile, InputError } from '../../fileFormats/index.ts';
import { noteToHz } from '../../pitch/index.ts';
import { collisionRuleText } from '../../modes/index.ts';
import { fixed, formatTable, numberOption, parseOptions, toJson, type Command } from '../command.ts';

/** `barwright bellbar`: a uniform bell bar for a note — length, partials and intervals, supports, collisions. */
export const bellbarCommand: Command = {
  name: 'bellbar',
  summary: 'uniform steel or aluminium bell bars: length for a note, partials and intervals, support points',
  usage: 'barwright bellbar (--note NAME | --hz F) --width-mm W --thickness-mm T [--a4 HZ] [--material PRESET | --e-gpa E --density-kg-m3 RHO [--poisson NU]] [--partials N] [--tune-overtone RATIO [--min-thickness-mm T] [--out FILE]] [--json]',
  async run(args, io) {
    const { values, positionals } = parseOptions(args, {
      note: { type: 'string' },
      hz: { type: 'string' },
      a4: { type: 'string' },
      'width-mm': { type: 'string' },
      'thickness-mm': { type: 'string' },
      material: { type: 'string' },
      'e-gpa': { type: 'string' },
      'density-kg-m3': { type: 'string' },
      poisson: { type: 'string' },
      partials: { type: 'string' },
      'tune-overtone': { type: 'string' },
      'min-thickness-mm': { type: 'string' },
      out: { type: 'string' },
      json: { type: 'boolean' },
    });
    if (positionals.length > 0) throw new InputError('command line', 'arguments', `bellbar takes options only (got "${positionals.join(' ')}")`);
    const a4 = checkA4(numberOption(values.a4, 'a4') ?? 440, 'command line', '--a4');
    if ((values.note === undefined) === (values.hz === undefined)) throw new InputError('command line', '--note', 'give --note or --hz, one of them');
    const hz = values.note !== undefined ? noteToHz(values.note, a4, 'command line', '--note') : numberOption(values.hz, 'hz', (n) => (n >= 20 && n <= 20000 ? null : 'must be from 20 to 20000 Hz'))!;
    const partials = numberOption(values.partials, 'partials', (n) => (Number.isInteger(n) && n >= 3 && n <= 12 ? null : 'must be a whole number from 3 to 12')) ?? 5;
    let material: unknown;
    if (values['e-gpa'] !== undefined || values['density-kg-m3'] !== undefined) {
      if (values.material !== undefined) throw new InputError('command line', '--material', 'give a preset or --e-gpa and --density-kg-m3, not both');
      material = {
        E_GPa: numberOption(values['e-gpa'], 'e-gpa'),
        density_kg_m3: numberOption(values['density-kg-m3'], 'density-kg-m3'),
        ...(values.poisson !== undefined ? { poisson: numberOption(values.poisson, 'poisson') } : {}),
      };
    } else material = { preset: values.material ?? 'steel-carbon' };
    if (values['width-mm'] === undefined) throw new InputError('command line', '--width-mm', 'is needed (bar width, mm)');
    if (values['thickness-mm'] === undefined) throw new InputError('command line', '--thickness-mm', 'is needed (bar thickness, mm)');
    const bar = parseBarFile({ length_mm: 1000, section: { shape: 'rect', width_mm: numberOption(values['width-mm'], 'width-mm'), thickness_mm: numberOption(values['thickness-mm'], 'thickness-mm') }, material }, 'command line');
    if (bar.section.shape !== 'rect') throw new Error('internal: rect expected');
    const stock: BellBarStock = { width_mm: bar.section.width_mm, thickness_mm: bar.section.thickness_mm, material: bar.material };
    const result = bellBarForNote(stock, hz, { partials, label: values.note ? `${values.note} bell bar` : undefined });
    const overtoneRatio = numberOption(values['tune-overtone'], 'tune-overtone', (n) => (n > 1.5 && n <= 8 ? null : 'must be a ratio above 1.5 and at most 8'));
    const minimum = numberOption(values['min-thickness-mm'], 'min-thickness-mm', (n) => (n > 0 && n < stock.thickness_mm ? null : `must be greater than 0 and less than the bar's ${stock.thickness_mm} mm`));
    if (overtoneRatio === undefined && (minimum !== undefined || values.out !== undefined)) throw new InputError('command line', '--tune-overtone', 'is needed with --min-thickness-mm and --out');
    const tuning = overtoneRatio === undefined ? undefined : tuneBellBarOvertone(stock, hz, overtoneRatio, minimum === undefined ? {} : { min_thickness_mm: minimum }, 'command line');
    if (tuning && values.out !== undefined) await io.writeFile(values.out, `${toJson(tuning.design.bar)}\n`);
    if (values.json) {
      io.stdout(toJson({ ...result, ...(tuning ? { overtone_tuning: { design: tuning.design, warnings: tuning.warnings } } : {}), cautions: metalCautions }));
      return 0;
    }
    const lines = [
      `Bell bar for ${fixed(hz, 2)} Hz: ${fixed(result.length_mm, 1)} × ${fixed(stock.width_mm, 1)} × ${fixed(stock.thickness_mm, 1)} mm (${result.theory})`,
      `Support at the mode-1 nodes: ${fixed(result.support_points_mm[0], 1)} and ${fixed(result.support_points_mm[1], 1)} mm from the left end.`,
      '',
      formatTable([['partial', 'Hz', 'ratio', 'nearest interval'], ...result.partials.map((p) => [String(p.mode), fixed(p.hz, 1), fixed(p.ratio, 3), `${p.interval.name} ${signedNumber(p.interval.cents, 0)}¢`])]),
      '',
      `Torsion: ${result.torsion.slice(0, 3).map((m) => `${fixed(m.hz, 0)} Hz`).join(', ')}; lateral: ${result.lateral.slice(0, 3).map((m) => `${fixed(m.hz, 0)} Hz`).join(', ')}`,
      result.warnings.length ? result.warnings.map((w) => `warning: ${w}`).join('\n') : `No torsion or lateral mode within beating distance of partials 1–3 (${collisionRuleText}).`,
      '',
      ...(tuning
        ? [
            `Second partial to ${overtoneRatio}× by a shallow undercut and end trimming: ${tuning.design.feasible ? 'reached' : 'not reached'}.`,
            `  length ${fixed(tuning.design.bar.length_mm, 1)} mm (${fixed(tuning.design.shortened_mm, 1)} mm trimmed, half from each end), thinnest ${fixed(tuning.design.thinnest_mm, 2)} mm at ${fixed(tuning.design.thinnest_at_mm, 1)} mm`,
            `  partials ${tuning.design.predicted_hz.map((f) => fixed(f, 1)).join(', ')} Hz (${tuning.design.cents_error.map((c) => `${signedNumber(c, 1)}`).join(', ')} cents); supports at ${tuning.design.cord_holes_mm.map((x) => fixed(x, 1)).join(' and ')} mm`,
            ...(tuning.design.reason ? [`  ${tuning.design.reason}`] : []),
            ...tuning.warnings.map((w) => `  warning: ${w}`),
            ...(values.out !== undefined ? [`  wrote the tuned bar to ${values.out} (its profile_mm is the cut)`] : []),
            '',
          ]
        : []),
      'Cautions:',
      ...metalCautions.map((c) => `  - ${c}`),
    ];
    io.stdout(lines.join('\n'));
    return 0;
  },
};
