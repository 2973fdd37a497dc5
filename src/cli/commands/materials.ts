import { materialPresets } from '../../material/index.ts';
import { InputError } from '../../fileFormats/index.ts';
import { fixed, formatTable, parseOptions, toJson, type Command } from '../command.ts';

/** `barwright materials`: the material presets with the source of every value (contract). */
export const materialsCommand: Command = {
  name: 'materials',
  summary: 'list the material presets and where each value comes from',
  usage: 'barwright materials [--json]',
  async run(args, io) {
    const { values, positionals } = parseOptions(args, { json: { type: 'boolean' } });
    if (positionals.length > 0) throw new InputError('command line', 'arguments', `materials takes no arguments (got "${positionals.join(' ')}")`);
    if (values.json) {
      io.stdout(toJson({ presets: materialPresets }));
      return 0;
    }
    const rows = [['preset', 'E GPa', 'G GPa', 'ν', 'ρ kg/m³', 'cents/°C', 'description']];
    for (const p of materialPresets) {
      const shear = p.G_GPa ?? p.E_GPa / (2 * (1 + p.poisson));
      rows.push([p.name, fixed(p.E_GPa, 1), `${fixed(shear, 2)}${p.G_GPa === undefined ? ' (from ν)' : ''}`, fixed(p.poisson, 2), fixed(p.density_kg_m3, 0), fixed(p.pitch_cents_per_c, 2), p.label]);
    }
    const woods = materialPresets.filter((p) => p.orthotropic);
    const orthotropic = formatTable([
      ['preset', 'E_L', 'E_R', 'E_T', 'G_LR', 'G_LT', 'G_RT', 'ν_LR', 'ν_LT', 'ν_RT'],
      ...woods.map((p) => {
        const c = p.orthotropic!;
        return [p.name, ...[c.E_GPa, c.E_R_GPa, c.E_T_GPa, c.G_LR_GPa, c.G_LT_GPa, c.G_RT_GPa].map((v) => fixed(v, 3)), ...[c.nu_LR, c.nu_LT, c.nu_RT].map((v) => fixed(v, 2))];
      }),
    ]);
    const sources = materialPresets.map(
      (p) => `${p.name}:\n  E: ${p.sources.E}\n  G: ${p.sources.G}\n  density: ${p.sources.density}\n  ν: ${p.sources.poisson}${p.sources.orthotropic ? `\n  orthotropic set: ${p.sources.orthotropic}` : ''}\n  cents/°C: ${p.pitch_source}`,
    );
    io.stdout(
      `${formatTable(rows)}\n\nOrthotropic sets of the woods for the solid theory (GPa; radial grain: G = G_LR)\n${orthotropic}\n\nSources\n${sources.join('\n')}\n\nWood varies ±20 % from blank to blank: calibrate from the blank's measured partials. cents/°C is how the partials move as the bar warms (readings are projected to the playing temperature with it).`,
    );
    return 0;
  },
};
