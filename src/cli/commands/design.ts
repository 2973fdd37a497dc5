import { clearanceText, designBar, designBarSolid, type DesignRequest, type OtherModesReport, type SolidDesignResult, parseToleranceList, profileTemplateSvg, stationTable, stationTableCsv, whereToCutMap, type CutLimitsInput } from '../../design/index.ts';
import { InputError, parseWorkshopFile } from '../../fileFormats/index.ts';
import { fixed, formatTable, numberOption, parseOptions, readJsonFile, toJson, type Command } from '../command.ts';
import { readBarFile } from '../readBarFile.ts';
import { sessionSummary } from '../readSession.ts';
import { calibratedDesign, calibrationNote } from '../../session/index.ts';

const positive = (n: number): string | null => (n > 0 ? null : 'must be greater than 0');
const signed = (c: number): string => `${c >= 0 ? '+' : '−'}${Math.abs(c).toFixed(2)}`;
const nonNegative = (n: number): string | null => (n >= 0 ? null : 'must be 0 or more');

/** The solid design's other modes against the beating rule, in one line. */
function otherModesLine(report: OtherModesReport): string {
  const nearest = report.after[0];
  const moved = report.uncut_end_mm;
  const asFound = report.before.filter((c) => !c.clear);
  if (!report.kept_clear)
    return report.holds
      ? `Other modes (not kept clear: --other-modes warn): all clear of the tuned partials (${report.rule})${nearest ? `; nearest ${clearanceText(nearest)}` : ''}.`
      : `Other modes (not kept clear: --other-modes warn): ${report.after.filter((c) => !c.clear).map(clearanceText).join('; ')}.`;
  const was = asFound.length ? `on the arch made for the partials alone ${asFound.map(clearanceText).join('; ')}; ` : '';
  const tried = report.uncut_ends_tried_mm.length ? `uncut ends tried up to ${fixed(Math.max(...report.uncut_ends_tried_mm), 1)} mm` : 'no narrower arch could be tried';
  if (!report.holds) return `Other modes: ${report.after.filter((c) => !c.clear).map(clearanceText).join('; ')}; no arch keeps them clear with the partials on target (${tried}; ${report.rule}).`;
  const how = moved ? `keeping the arch ${fixed(moved.to, 1)} mm from each end (was ${fixed(moved.from, 1)} mm, ${report.solid_solves} more solid solves) clears them; ` : '';
  return `Other modes: ${was}${how}every torsion, lateral and longitudinal mode is clear of the tuned partials (${report.rule})${nearest ? `, nearest: ${clearanceText(nearest)}` : ''}.`;
}

/** `barwright design BAR (--note NAME | --hz F) …`: plans an undercut (contract). */
export const designCommand: Command = {
  name: 'design',
  summary: 'plan the undercut that tunes a blank to a note and partial ratios, within workshop limits',
  usage:
    'barwright design BAR (--note NAME | --hz F) [--a4 HZ] [--ratios 1:4:10|1:4|1:3|1:3:6|fundamental|A:B:C] [--tolerance-cents 2,5,15] ' +
    '[--workshop FILE] [--min-thickness-mm T] [--uncut-end-mm L] [--max-slope S] [--tool-radius-mm R] [--allow-shortening [--max-shortening-mm M]] ' +
    '[--theory timoshenko|euler-bernoulli|solid [--other-modes clear|warn]] [--session SESSION [--lots LOTS]] [--out FILE.bar.json] [--template FILE.svg] [--table FILE.csv] [--map] [--json]',
  async run(args, io) {
    const { values, positionals } = parseOptions(args, {
      note: { type: 'string' },
      hz: { type: 'string' },
      a4: { type: 'string' },
      ratios: { type: 'string' },
      'tolerance-cents': { type: 'string' },
      workshop: { type: 'string' },
      'min-thickness-mm': { type: 'string' },
      'uncut-end-mm': { type: 'string' },
      'max-slope': { type: 'string' },
      'tool-radius-mm': { type: 'string' },
      'allow-shortening': { type: 'boolean' },
      'max-shortening-mm': { type: 'string' },
      theory: { type: 'string' },
      'other-modes': { type: 'string' },
      session: { type: 'string' },
      lots: { type: 'string' },
      out: { type: 'string' },
      template: { type: 'string' },
      table: { type: 'string' },
      map: { type: 'boolean' },
      json: { type: 'boolean' },
    });
    if (positionals.length !== 1) throw new InputError('command line', 'BAR', 'give exactly one bar file');
    if ((values.note === undefined) === (values.hz === undefined)) throw new InputError('command line', '--note', 'give either --note NAME or --hz F');
    const theory = values.theory ?? 'timoshenko';
    if (theory !== 'timoshenko' && theory !== 'euler-bernoulli' && theory !== 'solid') throw new InputError('command line', '--theory', `must be timoshenko, euler-bernoulli or solid (got "${theory}")`);
    const lineTheory = theory === 'solid' ? 'timoshenko' : theory;
    const otherModes = values['other-modes'];
    if (otherModes !== undefined && otherModes !== 'clear' && otherModes !== 'warn') throw new InputError('command line', '--other-modes', `must be clear or warn (got "${otherModes}")`);
    if (otherModes !== undefined && theory !== 'solid') throw new InputError('command line', '--other-modes', 'goes with --theory solid (the line model only warns)');
    const hz = numberOption(values.hz, 'hz', positive);
    const a4 = numberOption(values.a4, 'a4', positive);
    const limits: CutLimitsInput = {};
    const minThickness = numberOption(values['min-thickness-mm'], 'min-thickness-mm', positive);
    if (minThickness !== undefined) limits.min_thickness_mm = minThickness;
    const uncut = numberOption(values['uncut-end-mm'], 'uncut-end-mm', nonNegative);
    if (uncut !== undefined) limits.uncut_end_mm = uncut;
    const slope = numberOption(values['max-slope'], 'max-slope', positive);
    if (slope !== undefined) limits.max_slope = slope;
    const radius = numberOption(values['tool-radius-mm'], 'tool-radius-mm', nonNegative);
    if (radius !== undefined) limits.min_tool_radius_mm = radius;
    if (values['allow-shortening']) limits.allow_shortening = true;
    const shortening = numberOption(values['max-shortening-mm'], 'max-shortening-mm', nonNegative);
    if (shortening !== undefined) limits.max_shortening_mm = shortening;
    const path = positionals[0]!;
    const workshop = values.workshop !== undefined ? parseWorkshopFile(await readJsonFile(values.workshop, io), values.workshop) : undefined;
    const bar = await readBarFile(path, io);
    const request: DesignRequest = {
      target: {
        ...(values.note !== undefined ? { note: values.note } : {}),
        ...(hz !== undefined ? { hz } : {}),
        ...(a4 !== undefined ? { a4 } : {}),
        ratios: values.ratios ?? '1:4:10',
        ...(values['tolerance-cents'] !== undefined ? { tolerance_cents: parseToleranceList(values['tolerance-cents']) } : {}),
      },
      limits,
      limits_given_by: 'given on the command line',
      ...(workshop ? { workshop } : {}),
      theory: lineTheory,
      ...(otherModes === 'warn' ? { keep_other_modes_clear: false } : {}),
    };
    if (values.lots !== undefined && values.session === undefined) throw new InputError('command line', '--lots', 'goes with --session (the lot of the session’s bar)');
    const calibrated = values.session === undefined ? null : await sessionSummary(values.session, values.lots, io);
    if (calibrated && theory !== 'timoshenko') throw new InputError('command line', '--theory', 'a session calibrates the timoshenko model: leave --theory out with --session');
    const solid: SolidDesignResult | undefined = theory === 'solid' ? designBarSolid(bar, request, {}, 'command line') : undefined;
    const result = solid ?? (calibrated ? calibratedDesign(bar, request, calibrated.summary, {}, 'command line') : designBar(bar, request, {}, 'command line'));
    const table = stationTable(result.bar);
    const map = values.map ? whereToCutMap(result.bar, { theory: lineTheory }) : undefined;
    const subtitle = `${result.note ?? `${result.target_hz[0]} Hz`} at A4 = ${result.a4_hz} Hz, ratios ${result.ratios.join(':')}, ${result.bar.length_mm} mm × ${result.bar.section.shape === 'rect' ? result.bar.section.width_mm : 0} mm, blank ${result.bar.section.shape === 'rect' ? result.bar.section.thickness_mm : 0} mm`;
    if (values.out) await io.writeFile(values.out, `${toJson(result.bar)}\n`);
    if (values.template) await io.writeFile(values.template, profileTemplateSvg(result.bar, { title: result.bar.label ?? path, subtitle, cord_holes_mm: result.cord_holes_mm }));
    if (values.table) await io.writeFile(values.table, stationTableCsv(table));
    if (values.json) {
      io.stdout(toJson({ ...result, station_table: table, ...(map ? { where_to_cut: map } : {}) }));
      return 0;
    }
    const lines: string[] = [];
    lines.push(`${bar.label ?? path}: undercut for ${subtitle}`);
    if (calibrated) lines.push(`Calibrated: ${calibrationNote(calibrated.summary, values.session!)}`);
    lines.push(result.feasible ? 'Feasible: every partial within tolerance.' : `NOT FEASIBLE — ${result.reason ?? 'targets not reached'}`);
    lines.push('');
    const shift = result.cord_holes?.shift_cents;
    lines.push(
      formatTable([
        ['partial', 'target Hz', solid ? 'solid Hz' : 'predicted Hz', 'cents', 'tolerance', ...(solid ? ['line model Hz', 'line cents'] : []), ...(shift ? ['drilling moves (cents)'] : [])],
        ...result.target_hz.map((target, k) => [
          String(k + 1),
          fixed(target, 2),
          fixed(result.predicted_hz[k]!, 2),
          fixed(result.cents_error[k]!, 2),
          `±${result.tolerance_cents[k]}`,
          ...(solid ? [fixed(solid.solid.line_model_hz[k]!, 2), fixed(solid.solid.line_model_cents[k]!, 2)] : []),
          ...(shift ? [signed(shift[k]!)] : []),
        ]),
      ]),
    );
    lines.push('');
    lines.push(`Arch: ${result.shape.family}; thinnest ${fixed(result.thinnest_mm, 2)} mm at ${fixed(result.thinnest_at_mm, 1)} mm; ${fixed(result.removed_volume_mm3 / 1000, 1)} cm³ removed${result.shortened_mm > 0 ? `; shortened by ${fixed(result.shortened_mm, 1)} mm (half at each end)` : ''}.`);
    const holes = result.cord_holes;
    if (holes) {
      lines.push(
        `Cord holes: ${fixed(holes.diameter_mm, 1)} mm at ${holes.x_mm.map((x) => `${fixed(x, 1)} mm`).join(' and ')} from the left end (the nodes of the fundamental: ${result.cord_holes_mm.map((x) => fixed(x, 1)).join(', ')} mm), ${fixed(holes.clearance_mm, 1)} mm clear of the arch${holes.drilled_already ? '; drilled already' : ''}.`,
      );
      if (holes.shift_cents && holes.undrilled_hz)
        lines.push(
          `Drilling them moves the partials by ${holes.shift_cents.map(signed).join(', ')} cents: drill first and tune to the targets, or drill last and tune the undrilled bar to ${holes.undrilled_hz.map((f) => fixed(f, 2)).join(', ')} Hz.`,
        );
    } else lines.push(`Cord holes (nodes of the fundamental): ${result.cord_holes_mm.map((x) => `${fixed(x, 1)} mm`).join(', ')} from the left end.`);
    lines.push(`Limits (workshop: ${result.workshop}):`);
    lines.push(
      formatTable([
        ['limit', 'value', 'set by'],
        ['thinnest', `${+result.limits.min_thickness_mm.toFixed(2)} mm`, result.limit_sources.min_thickness_mm],
        ['uncut ends', `${fixed(result.limits.uncut_left_mm, 1)} / ${fixed(result.limits.uncut_right_mm, 1)} mm`, result.limit_sources.uncut_end_mm],
        ['steepest wall', `${result.limits.max_slope}`, result.limit_sources.max_slope],
        ['tool radius', `${result.limits.min_tool_radius_mm} mm`, result.limit_sources.tool_radius_mm],
      ]).replace(/^/gm, '  '),
    );
    lines.push(`Limits at their edge: ${result.binding_limits.length ? result.binding_limits.join(', ') : 'none'}. ${result.solves} solver runs.`);
    if (result.remedies) {
      lines.push('');
      lines.push(result.remedies.length ? 'Remedies, cheapest first (each designed again and checked):' : 'No single change tried meets the target.');
      result.remedies.forEach((remedy, i) => lines.push(`  ${i + 1}. ${remedy.change} (${remedy.kind} = ${Array.isArray(remedy.value) ? remedy.value.join(':') : remedy.value}; recovers ${fixed(remedy.cents_gained, 1)} cents)`));
    }
    if (solid)
      lines.push(
        `Solid model: ${solid.solid.solid_solves} solid solves; the line model's targets corrected ${solid.solid.rounds.length - 1} time${solid.solid.rounds.length === 2 ? '' : 's'} until the solid partials met the tolerances${solid.solid.converged ? '' : ' (they did not)'}. The line model alone would call this arch ${solid.solid.line_model_cents.map((c) => `${c >= 0 ? '+' : ''}${fixed(c, 1)}`).join(' / ')} cents.`,
      );
    if (solid) lines.push(otherModesLine(solid.solid.collisions));
    for (const warning of result.warnings) lines.push(`Warning: ${warning}`);
    lines.push('');
    lines.push('Thickness every 5 mm from the centre line (rows inside the cut, the cord holes and the ends):');
    const cutRows = table.filter((row, i) => row.mark || row.depth_mm > 0 || i === 0 || i === table.length - 1 || (table[i - 1]?.depth_mm ?? 0) > 0 || (table[i + 1]?.depth_mm ?? 0) > 0);
    lines.push(formatTable([['from centre mm', 'from left mm', 'thickness mm', 'depth mm', ''], ...cutRows.map((r) => [fixed(r.from_centre_mm, 1), fixed(r.from_left_mm, 1), fixed(r.thickness_mm, 2), fixed(r.depth_mm, 2), r.mark ?? ''])]));
    if (map) {
      lines.push('');
      lines.push(`Where to cut: cents per ${map.depth_mm} mm removed over ${map.strip_mm} mm, every 10 mm from the left end:`);
      const every = Math.max(1, Math.round(10 / (map.positions_mm[1]! - map.positions_mm[0]!)));
      const rows = map.positions_mm.map((x, i) => [fixed(x, 1), ...map.partials.map((p) => fixed(p.cents[i]!, 3))]).filter((_, i) => i % every === 0);
      lines.push(formatTable([['from left mm', ...map.partials.map((p) => `partial ${p.partial}`)], ...rows]));
    }
    if (values.out) lines.push('', `Designed bar written to ${values.out}.`);
    if (values.template) lines.push(`1:1 template written to ${values.template} (print at 100 %, check the scale bar).`);
    if (values.table) lines.push(`Thickness table written to ${values.table}.`);
    lines.push('');
    for (const caution of result.cautions) lines.push(`Caution: ${caution}`);
    io.stdout(lines.join('\n'));
    return 0;
  },
};
