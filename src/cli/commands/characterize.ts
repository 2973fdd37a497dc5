import { InputError } from '../../fileFormats/index.ts';
import { characterizeBlank } from '../../session/index.ts';
import { fixed, formatTable, numberOption, parseOptions, toJson, type Command } from '../command.ts';
import { readBarFile } from '../readBarFile.ts';
import { refuseOverwrite } from './next-cut.ts';

/** Parses `--partials 402.1,1051.3` into Hz values (InputError naming the option and the item). */
function partialsOption(text: string | undefined): number[] {
  if (text === undefined) throw new InputError('command line', '--partials', 'give the tapped partials in Hz, e.g. --partials 402.1,1051.3');
  const items = text.split(',').map((item) => item.trim());
  return items.map((item, index) => {
    const hz = Number(item);
    if (item === '' || !Number.isFinite(hz) || hz <= 0) throw new InputError('command line', `--partials[${index}]`, `"${item}" is not a frequency above 0 Hz`);
    return hz;
  });
}

/** `barwright characterize BAR --partials …`: E and G of a blank from its dimensions, mass and tapped partials. */
export const characterizeCommand: Command = {
  name: 'characterize',
  summary: 'find a blank’s E and G from its dimensions, mass and tapped partials',
  usage: 'barwright characterize BAR --partials F1,F2[,F3…] [--mass-g M] [--uncertainty-cents C] [--out BAR [--force]] [--json]',
  async run(args, io) {
    const { values, positionals } = parseOptions(args, {
      partials: { type: 'string' },
      'mass-g': { type: 'string' },
      'uncertainty-cents': { type: 'string' },
      out: { type: 'string' },
      force: { type: 'boolean' },
      json: { type: 'boolean' },
    });
    if (positionals.length !== 1) throw new InputError('command line', 'BAR', 'give exactly one bar file (the blank)');
    const measuredHz = partialsOption(values.partials);
    const massGrams = numberOption(values['mass-g'], 'mass-g', (n) => (n > 0 ? null : 'must be greater than 0 g'));
    const uncertaintyCents = numberOption(values['uncertainty-cents'], 'uncertainty-cents', (n) => (n > 0 && n <= 50 ? null : 'must be greater than 0 and at most 50 cents'));
    const bar = await readBarFile(positionals[0]!, io);
    const result = characterizeBlank({
      bar,
      measuredHz,
      ...(massGrams === undefined ? {} : { massGrams }),
      ...(uncertaintyCents === undefined ? {} : { uncertaintyCents }),
    });
    if (values.out !== undefined) {
      await refuseOverwrite(values.out, values.force ?? false, io);
      await io.writeFile(values.out, `${JSON.stringify(result.bar, null, 2)}\n`);
    }
    if (values.json) {
      io.stdout(toJson(result));
      return 0;
    }
    const m = result.material;
    const u = result.uncertainty;
    const lines = [
      `${bar.label ?? positionals[0]}: Timoshenko inversion from ${measuredHz.length} partial${measuredHz.length === 1 ? '' : 's'}`,
      '',
      formatTable([
        ['', 'value', '± partials', '± total'],
        ['E (GPa)', fixed(m.E_GPa, 3), fixed(u.from_partials.E_GPa, 3), fixed(u.total.E_GPa, 3)],
        ['G (GPa)', fixed(m.G_GPa, 4), fixed(u.from_partials.G_GPa, 4), fixed(u.total.G_GPa, 4)],
        ['E/G', fixed(result.E_over_G, 2), '', ''],
        [`density (kg/m³, from ${result.density_from})`, fixed(m.density_kg_m3, 1), '', ''],
      ]),
      '',
      formatTable([['partial', 'measured Hz', 'model Hz', 'residual cents'], ...result.measured_hz.map((hz, n) => [String(n + 1), fixed(hz, 2), fixed(result.fitted_hz[n]!, 2), fixed(result.residual_cents[n]!, 2)])]),
      '',
      '± are one sigma: "partials" from the cents uncertainty alone, "total" adding the caliper, rule and scale readings.',
      result.consistent ? 'The partials fit one material.' : 'The partials are NOT consistent with one material: see the warnings.',
      ...result.warnings.map((w) => `warning: ${w}`),
    ];
    if (values.out !== undefined) lines.push('', `Wrote the blank with this material to ${values.out}.`);
    io.stdout(lines.join('\n'));
    return 0;
  },
};
