import { InputError } from '../../fileFormats/index.ts';
import { nextCut, nextCutSolid, type NextCutResult, type SolidSessionReport } from '../../session/index.ts';
import { fixed, formatTable, parseOptions, toJson, type Command, type CommandIo } from '../command.ts';
import { priorForSession, readLotFile, readSessionFile } from '../readSession.ts';

function signed(value: number, decimals: number): string {
  const text = fixed(value, decimals);
  return value >= 0 ? `+${text}` : text;
}

/** Refuses to replace an existing file unless --force: nothing is overwritten silently. */
export async function refuseOverwrite(path: string, force: boolean, io: CommandIo): Promise<void> {
  if (force) return;
  try {
    await io.readText(path);
  } catch {
    return;
  }
  throw new InputError('command line', '--out', `${path} already exists; choose another name or add --force to replace it`);
}

function statusLine(result: NextCutResult): string {
  if (result.status === 'done') return 'Status: done — every tuned partial is within tolerance. No cut.';
  if (result.status === 'stuck') return `Status: stuck — ${result.reason ?? 'no removal helps'}`;
  return `Status: cut — ${result.phase === 'hold' ? 'the fundamental is held a few cents sharp while the overtones are placed' : 'closing in on every target'}`;
}

/** The human-readable report of a next-cut result. */
function formatNextCut(result: NextCutResult, title: string, solid: SolidSessionReport | null = null): string {
  const lines: string[] = [];
  const c = result.calibration;
  lines.push(title);
  lines.push(
    `Calibrated model: E ${fixed(c.E_GPa, 2)} GPa (±${fixed(c.E_uncertainty_percent, 1)} %), G ${fixed(c.G_GPa, 3)} GPa (±${fixed(c.G_uncertainty_percent, 1)} %), density ${fixed(result.calibrated_material.density_kg_m3, 0)} kg/m³`,
  );
  lines.push(`1D-model correction at this arch depth (${fixed(c.arch_depth, 2)}): ${c.correction_percent.slice(0, result.target_hz.length).map((p) => `${signed(p, 2)} %`).join(', ')}`);
  if (solid) {
    lines.push(
      `Wood fitted on the solid model to the bar now: E along the grain ${fixed(solid.E_L_GPa, 2)} GPa, shear moduli ×${fixed(solid.shear_scale, 2)} of the bar file's; readings − model ${solid.fit_residual_cents.map((r) => signed(r, 1)).join(', ')} cents`,
    );
    if (solid.grain)
      lines.push(
        `Grain fitted to the ${Object.keys(solid.grain.residual_hz).join(' and ')} mode read: growth rings at ${fixed(solid.grain.ring_angle_deg, 0)}° to the thickness (0 quarter-sawn, 90 flat-sawn); reading − model ${Object.values(solid.grain.residual_hz).map((r) => signed(r, 1)).join(', ')} Hz`,
      );
    if (solid.solid_sensitivities) lines.push('Closing in: the cut is planned with the solid model\'s own thickness sensitivities');
    if (solid.arch_depth !== null)
      lines.push(
        `Solid model on the planned shape (arch depth ${fixed(solid.arch_depth, 2)}): ${solid.solid_minus_line_cents.map((g) => signed(g, 1)).join(', ')} cents against the line model, given to the correction as its prior (${solid.solid_solves} solid analyses in all)`,
      );
  }
  if (c.lot) lines.push(`Started from lot ${c.lot.name}, learnt from ${c.lot.bars.join(', ')}`);
  for (const depth of c.cut_depth_percent) lines.push(`Cut before step ${depth.step} reads as ${fixed(depth.percent, 0)} % of the depth recorded (±${fixed(depth.uncertainty_percent, 0)} %)`);
  for (const check of c.cut_from_plan)
    lines.push(
      `Cut before step ${check.step}, by the caliper: ${check.percent === null ? 'no planned depth at the readings' : `${fixed(check.percent, 0)} % of the planned depth`} (${check.checkpoints.map((p) => `${fixed(p.x_mm, 0)} mm ${signed(p.off_mm, 2)}`).join(', ')} mm off plan)`,
    );
  const t = result.temperature;
  const projected = t.reading_temperature_c !== null && t.reading_temperature_c !== t.playing_temperature_c;
  lines.push(
    projected
      ? `Readings taken at ${fixed(t.reading_temperature_c!, 1)} °C, shown at the playing temperature ${fixed(t.playing_temperature_c, 1)} °C (${signed(t.shift_cents, 1)} cents, ±${fixed(t.shift_sigma_cents, 1)}; ${fixed(t.pitch_cents_per_c, 2)} cents/°C, ${t.pitch_from === 'learnt' ? 'learnt from this bar' : t.pitch_from})`
      : `Playing temperature ${fixed(t.playing_temperature_c, 1)} °C; coefficient ${fixed(t.pitch_cents_per_c, 2)} cents/°C (${t.pitch_from === 'learnt' ? 'learnt from this bar' : t.pitch_from})`,
  );
  if (result.wait_minutes > 0) lines.push(`WAIT: the last reading was taken on a bar still warm from the cut; strike it again in ${result.wait_minutes} minutes.`);
  lines.push('');
  lines.push(
    formatTable([
      ['partial', 'target Hz', ...(projected ? ['read Hz'] : []), 'now Hz', 'now cents', 'after Hz', 'after cents', 'range cents', 'tolerance'],
      ...result.target_hz.map((target, n) => [
        String(n + 1),
        fixed(target, 2),
        ...(projected ? [result.readings_as_taken_hz[n] !== undefined ? fixed(result.readings_as_taken_hz[n]!, 2) : '—'] : []),
        fixed(result.now_hz[n]!, 2),
        signed(result.now_cents[n]!, 1),
        fixed(result.predicted_hz[n]!, 2),
        signed(result.predicted_cents[n]!, 1),
        `${signed(result.predicted_range_cents[n]![0], 1)} … ${signed(result.predicted_range_cents[n]![1], 1)}`,
        `±${fixed(result.tolerance_cents[n]!, 0)}`,
      ]),
    ]),
  );
  lines.push('');
  lines.push(statusLine(result));
  if (result.cut) {
    lines.push('');
    if (result.cut.shortening_mm > 0) lines.push(`Shorten the bar by ${fixed(result.cut.shortening_mm, 2)} mm: ${fixed(result.cut.shortening_mm / 2, 2)} mm off each end.`);
    if (result.cut.stations.length > 0) {
      lines.push(`Remove from the underside (positions from the left end of the bar now; deepest ${fixed(result.cut.max_depth_mm, 2)} mm):`);
      lines.push(
        formatTable([
          ['station mm', 'now mm', 'after mm', 'remove mm'],
          ...result.cut.stations.map((s) => [fixed(s.position_mm, 1), fixed(s.thickness_now_mm, 2), fixed(s.thickness_after_mm, 2), fixed(s.remove_mm, 2)]),
        ]),
      );
      lines.push(`Region${result.cut.regions_mm.length > 1 ? 's' : ''}: ${result.cut.regions_mm.map(([a, b]) => `${fixed(a, 0)}–${fixed(b, 0)} mm`).join(', ')}`);
    }
    if (result.checkpoints.length > 0) {
      lines.push('');
      lines.push(`Check with the caliper after the cut (positions from the left end of the bar after it): ${result.checkpoints.map((p) => `${fixed(p.x_mm, 0)} mm → ${fixed(p.thickness_mm, 2)} mm`).join(', ')}`);
      lines.push('Record what you measure with the next step (measured_thickness_mm): the session then uses the bar as measured.');
    }
    lines.push('');
    lines.push('Side view (top up; # stays, x comes off, ^ deepest part of the cut, - a little):');
    lines.push(...result.cut.sketch);
    lines.push('');
    lines.push(...result.cautions.map((caution) => `caution: ${caution}`));
  }
  if (result.calibration.flags.length > 0) {
    lines.push('');
    for (const flag of result.calibration.flags) lines.push(`flagged: ${flag.reason}`);
  }
  const warnings = result.warnings.filter((w) => !result.calibration.flags.some((f) => w.startsWith(f.reason)));
  if (warnings.length > 0) {
    lines.push('');
    lines.push(...warnings.map((w) => `warning: ${w}`));
  }
  return lines.join('\n');
}

/** `barwright next-cut SESSION`: calibrate the session's bar from its measurements and say where to cut next (contract). */
export const nextCutCommand: Command = {
  name: 'next-cut',
  summary: 'tune-and-trim: learn the bar from its session log and say where to cut next',
  usage: 'barwright next-cut SESSION [--lots LOTS] [--theory timoshenko|solid] [--out BAR [--force]] [--json]',
  async run(args, io) {
    const { values, positionals } = parseOptions(args, {
      lots: { type: 'string' },
      theory: { type: 'string' },
      out: { type: 'string' },
      force: { type: 'boolean' },
      json: { type: 'boolean' },
    });
    if (positionals.length !== 1) throw new InputError('command line', 'SESSION', 'give exactly one session file');
    const path = positionals[0]!;
    const log = await readSessionFile(path, io);
    const { prior, note } = priorForSession(log, values.lots === undefined ? undefined : await readLotFile(values.lots, io));
    const theory = values.theory ?? 'timoshenko';
    if (theory !== 'timoshenko' && theory !== 'solid') throw new InputError('command line', '--theory', `must be timoshenko or solid (got "${theory}")`);
    const solidResult = theory === 'solid' ? nextCutSolid(log, { source: path, lot: prior }) : null;
    const result: NextCutResult = solidResult ?? nextCut(log, { source: path, lot: prior });
    if (note) result.warnings.push(note);
    if (values.out !== undefined) {
      if (result.status !== 'cut') throw new InputError('command line', '--out', `there is no cut to write (status ${result.status})`);
      await refuseOverwrite(values.out, values.force ?? false, io);
      await io.writeFile(values.out, `${JSON.stringify(result.bar_after, null, 2)}\n`);
    }
    if (values.json) {
      io.stdout(toJson(result));
      return 0;
    }
    const steps = log.steps.length;
    io.stdout(formatNextCut(result, `${log.label ?? path}: ${steps} step${steps === 1 ? '' : 's'}, ratios ${log.target.ratios.join(':')}`, solidResult?.solid ?? null));
    if (values.out !== undefined) io.stdout(`\nWrote the bar after the cut to ${values.out}.`);
    return 0;
  },
};
