import { mkdir } from 'node:fs/promises';
import { join } from 'node:path';
import { analyzeChime, type ChimeAnalysis, chimeCutListCsv, chimeForNote, type ChimeForNote, planChimeSet, type ChimeSetPlan, type ChimeStock, metalCautions, signedNumber } from '../../instrument/index.ts';
import { hzToNote, noteToHz } from '../../pitch/index.ts';
import { checkA4, parseBarFile, parseChimeSetFile, InputError } from '../../fileFormats/index.ts';
import { fixed, formatTable, numberOption, parseOptions, readJsonFile, toJson, type Command } from '../command.ts';

const usage = [
  'barwright chime SET.chimes.json [--out DIR] [--json]',
  'barwright chime (--tube OD×WALL | --rod D) (--note NAME | --hz F | --length-mm L) [--a4 HZ] [--material PRESET | --e-gpa E --density-kg-m3 RHO [--poisson NU]] [--tune fundamental|strike] [--top-plug-g M --plug-length-mm P] [--theory timoshenko|euler-bernoulli] [--json]',
].join('\n  ');

/** Parses "25.4x1.6" (outer diameter × wall, mm) for --tube. */
function parseTube(text: string): { shape: 'tube'; outer_diameter_mm: number; wall_mm: number } {
  const parts = text.split(/[x×*]/).map((p) => Number(p.trim()));
  if (parts.length !== 2 || parts.some((p) => !Number.isFinite(p) || p <= 0)) throw new InputError('command line', '--tube', `"${text}" is not OUTERxWALL in mm, e.g. 25.4x1.6`);
  return { shape: 'tube', outer_diameter_mm: parts[0]!, wall_mm: parts[1]! };
}

/** The stock given on the command line, validated by the bar-file rules. */
function stockFromOptions(values: Record<string, string | boolean | undefined>): ChimeStock {
  if ((values.tube === undefined) === (values.rod === undefined)) throw new InputError('command line', '--tube', 'give --tube OD×WALL or --rod D (mm), one of them');
  const section = values.tube !== undefined ? parseTube(String(values.tube)) : { shape: 'round' as const, diameter_mm: numberOption(String(values.rod), 'rod', (n) => (n > 0 ? null : 'must be greater than 0 mm'))! };
  let material: unknown;
  if (values['e-gpa'] !== undefined || values['density-kg-m3'] !== undefined) {
    if (values.material !== undefined) throw new InputError('command line', '--material', 'give a preset or --e-gpa and --density-kg-m3, not both');
    material = {
      E_GPa: numberOption(values['e-gpa'] as string | undefined, 'e-gpa'),
      density_kg_m3: numberOption(values['density-kg-m3'] as string | undefined, 'density-kg-m3'),
      ...(values.poisson !== undefined ? { poisson: numberOption(String(values.poisson), 'poisson') } : {}),
    };
  } else material = { preset: values.material ?? 'aluminium-6061-t6' };
  const bar = parseBarFile({ length_mm: 1000, section, material }, 'command line');
  const stock: ChimeStock = { section: bar.section as ChimeStock['section'], material: bar.material };
  const plug = numberOption(values['top-plug-g'] as string | undefined, 'top-plug-g', (n) => (n > 0 ? null : 'must be greater than 0 g'));
  if (plug !== undefined) {
    const length = numberOption(values['plug-length-mm'] as string | undefined, 'plug-length-mm', (n) => (n > 0 ? null : 'must be greater than 0 mm'));
    if (length === undefined) throw new InputError('command line', '--plug-length-mm', 'is needed with --top-plug-g');
    stock.end_masses = [{ end: 'top', mass_g: plug, length_mm: length }];
  }
  return stock;
}

function setTable(plan: ChimeSetPlan): string {
  const lines = [`${plan.name || 'Chime set'}: ${plan.chimes.length} chimes, tuned on the ${plan.tune === 'strike' ? 'strike note' : 'fundamental'}, A4 = ${plan.a4_hz} Hz`, ''];
  lines.push(
    formatTable([
      ['note', 'target Hz', 'length mm', 'hang at mm', 'lower node mm', 'strike', 'ratios 2–6'],
      ...plan.chimes.map((c) => [
        c.note,
        fixed(c.target_hz, 2),
        fixed(c.length_mm, 1),
        `${fixed(c.hanging_point_mm, 1)}${c.hanging_point_shift_mm !== undefined ? ` (${signedNumber(c.hanging_point_shift_mm, 1)})` : ''}`,
        fixed(c.lower_node_mm, 1),
        `${c.strike_note} ${signedNumber(c.strike_cents, 0)}¢`,
        c.partials.slice(1).map((p) => fixed(p.ratio, 2)).join(' '),
      ]),
    ]),
  );
  lines.push('', `Lengths and hanging points from the top end; (±) is the plug's shift of the hanging point. Total tube ${fixed(plan.total_length_mm / 1000, 2)} m.`);
  if (plan.cutting) {
    lines.push('', 'Cutting plan (longest first):');
    plan.cutting.bars.forEach((bar, i) => lines.push(`  stock bar ${i + 1}: ${bar.pieces.join(', ')} — offcut ${fixed(bar.offcut_mm, 0)} mm`));
    if (plan.cutting.too_long.length) lines.push(`  longer than the stock: ${plan.cutting.too_long.join(', ')}`);
  }
  const warnings = plan.chimes.flatMap((c) => c.warnings.map((w) => `  ${c.note}: ${w}`));
  if (warnings.length) lines.push('', 'Warnings:', ...warnings);
  lines.push('', 'Cautions:', ...plan.cautions.map((c) => `  - ${c}`));
  return lines.join('\n');
}

/** `barwright chime`: a chime set from a file, or one tube or rod from the command line. */
export const chimeCommand: Command = {
  name: 'chime',
  summary: 'chime tubes and rods: length for a note, partials, strike note, hanging point, set cut list',
  usage,
  async run(args, io) {
    const { values, positionals } = parseOptions(args, {
      out: { type: 'string' },
      json: { type: 'boolean' },
      tube: { type: 'string' },
      rod: { type: 'string' },
      note: { type: 'string' },
      hz: { type: 'string' },
      'length-mm': { type: 'string' },
      a4: { type: 'string' },
      material: { type: 'string' },
      'e-gpa': { type: 'string' },
      'density-kg-m3': { type: 'string' },
      poisson: { type: 'string' },
      tune: { type: 'string' },
      'top-plug-g': { type: 'string' },
      'plug-length-mm': { type: 'string' },
      theory: { type: 'string' },
    });
    const theory = values.theory ?? 'timoshenko';
    if (theory !== 'timoshenko' && theory !== 'euler-bernoulli') throw new InputError('command line', '--theory', `must be timoshenko or euler-bernoulli (got "${theory}")`);
    if (positionals.length > 1) throw new InputError('command line', 'SET', 'give at most one chime-set file');
    if (positionals.length === 1) {
      const single = ['tube', 'rod', 'note', 'hz', 'length-mm', 'a4', 'material', 'e-gpa', 'density-kg-m3', 'poisson', 'tune', 'top-plug-g', 'plug-length-mm', 'theory'].filter((k) => values[k as keyof typeof values] !== undefined);
      if (single.length) throw new InputError('command line', `--${single[0]}`, 'belongs to a single chime; a chime-set file carries its own stock, notes and tuning');
      const path = positionals[0]!;
      const plan = planChimeSet(parseChimeSetFile(await readJsonFile(path, io), path));
      if (values.out !== undefined) {
        await mkdir(values.out, { recursive: true });
        await io.writeFile(join(values.out, 'chime-cut-list.csv'), chimeCutListCsv(plan));
        await io.writeFile(join(values.out, 'chime-plan.json'), `${toJson(plan)}\n`);
      }
      io.stdout(values.json ? toJson(plan) : `${setTable(plan)}${values.out !== undefined ? `\n\nWrote ${join(values.out, 'chime-cut-list.csv')} and chime-plan.json` : ''}`);
      return 0;
    }
    const stock = stockFromOptions(values);
    const tune = values.tune ?? 'fundamental';
    if (tune !== 'fundamental' && tune !== 'strike') throw new InputError('command line', '--tune', `must be fundamental or strike (got "${tune}")`);
    const a4 = checkA4(numberOption(values.a4, 'a4') ?? 440, 'command line', '--a4');
    const given = [values.note, values.hz, values['length-mm']].filter((v) => v !== undefined).length;
    if (given !== 1) throw new InputError('command line', '--note', 'give one of --note, --hz or --length-mm');
    let result: ChimeAnalysis | ChimeForNote;
    if (values['length-mm'] !== undefined) {
      const length = numberOption(values['length-mm'], 'length-mm', (n) => (n > 0 && n <= 20000 ? null : 'must be greater than 0 and at most 20000 mm'))!;
      result = analyzeChime(stock, length, { theory });
    } else {
      const hz = values.note !== undefined ? noteToHz(values.note, a4, 'command line', '--note') : numberOption(values.hz, 'hz', (n) => (n >= 20 && n <= 20000 ? null : 'must be from 20 to 20000 Hz'))!;
      result = chimeForNote(stock, hz, { tune, theory });
    }
    if (values.out !== undefined) throw new InputError('command line', '--out', 'writes the files of a chime set: give a SET file');
    if (values.json) {
      io.stdout(toJson({ ...result, cautions: metalCautions }));
      return 0;
    }
    const strike = hzToNote(result.strike.hz, a4);
    const lines = [
      `${'target_hz' in result ? `Chime for ${fixed((result as ChimeForNote).target_hz, 2)} Hz (${tune}): ` : 'Chime: '}length ${fixed(result.length_mm, 1)} mm, ${theory}`,
      `Hang at ${fixed(result.hanging_point_mm, 1)} mm from the top (${fixed(result.hanging_point_fraction * 100, 2)} % of the length)${result.hanging_point_shift_mm !== undefined ? `, moved ${fixed(result.hanging_point_shift_mm, 1)} mm by the plug` : ''}; lower node ${fixed(result.lower_node_mm, 1)} mm.`,
      `Strike note ${fixed(result.strike.hz, 1)} Hz (${strike.name} ${signedNumber(strike.cents, 0)} cents at A4 = ${a4}); an octave below mode 4: ${fixed(result.strike.octave_below_mode4_hz, 1)} Hz.`,
      '',
      formatTable([['partial', 'Hz', 'ratio', 'nearest interval'], ...result.partials.map((p) => [String(p.mode), fixed(p.hz, 1), fixed(p.ratio, 3), `${p.interval.name} ${signedNumber(p.interval.cents, 0)}¢`])]),
    ];
    if (result.warnings.length) lines.push('', ...result.warnings.map((w) => `warning: ${w}`));
    lines.push('', 'Cautions:', ...metalCautions.map((c) => `  - ${c}`));
    io.stdout(lines.join('\n'));
    return 0;
  },
};
