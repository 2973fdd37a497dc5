import { InputError, parseNote, withLotRecord, type LotFile } from '../../fileFormats/index.ts';
import { calibrateSession, lotPrior, lotRecordFromCalibration, nextCut } from '../../session/index.ts';
import { fixed, formatTable, parseOptions, toJson, type Command, type CommandIo } from '../command.ts';
import { priorForSession, readLotFile, readSessionFile, sessionLotName } from '../readSession.ts';

/** The lots of a lot file with what each teaches the next bar (lotPrior), for `lots show`. */
function lotSummaries(file: LotFile) {
  return Object.entries(file.lots).map(([name, entry]) => {
    const prior = lotPrior(name, entry.bars);
    return {
      lot: name,
      ...(entry.notes ? { notes: entry.notes } : {}),
      bars: entry.bars.map((bar) => ({ bar: bar.bar, ...(bar.note ? { note: bar.note } : {}), learnt_at: bar.learnt_at, E_GPa: bar.E_GPa, G_GPa: bar.G_GPa, density_kg_m3: bar.density_kg_m3, correction_per_depth: bar.correction_per_depth, arch_depth: bar.arch_depth, ...(bar.pitch_learnt ? { pitch_cents_per_c: bar.pitch_cents_per_c } : {}) })),
      next_bar: prior
        ? {
            specific_E: { mean_MPa_per_kg_m3: Math.exp(prior.lnSpecificYoung.mean) / 1e6, spread_percent: 100 * prior.lnSpecificYoung.sigma },
            specific_G: { mean_MPa_per_kg_m3: Math.exp(prior.lnSpecificShear.mean) / 1e6, spread_percent: 100 * prior.lnSpecificShear.sigma },
            correction_per_depth: prior.corrections.map((c) => ({ mean: c.mean, spread: c.sigma })),
            ...(prior.pitch ? { pitch_cents_per_c: { mean: prior.pitch.centsPerC, spread: prior.pitch.sigma } } : {}),
          }
        : null,
    };
  });
}

function showText(file: LotFile, path: string): string {
  const summaries = lotSummaries(file);
  if (summaries.length === 0) return `${path}: no lots yet. Add a finished bar's session with: barwright lots add ${path} SESSION`;
  const lines: string[] = [];
  for (const lot of summaries) {
    lines.push(`Lot ${lot.lot}${lot.notes ? ` (for ${lot.notes.from}–${lot.notes.to})` : ''}: ${lot.bars.length} finished bar${lot.bars.length === 1 ? '' : 's'}`);
    lines.push(
      formatTable([
        ['bar', 'E GPa', 'G GPa', 'ρ kg/m³', 'E/ρ MPa·m³/kg', 'corrections per unit depth', 'depth', 'cents/°C'],
        ...lot.bars.map((bar) => [bar.bar, fixed(bar.E_GPa, 2), fixed(bar.G_GPa, 3), fixed(bar.density_kg_m3, 0), fixed((1e3 * bar.E_GPa) / bar.density_kg_m3, 2), bar.correction_per_depth.slice(0, 3).map((c) => fixed(c, 3)).join(' / '), fixed(bar.arch_depth, 2), bar.pitch_cents_per_c !== undefined ? fixed(bar.pitch_cents_per_c, 2) : '—']),
      ]),
    );
    if (lot.next_bar)
      lines.push(
        `Next bar starts from: E/ρ ${fixed(lot.next_bar.specific_E.mean_MPa_per_kg_m3, 2)} ±${fixed(lot.next_bar.specific_E.spread_percent, 1)} %, G/ρ ${fixed(lot.next_bar.specific_G.mean_MPa_per_kg_m3, 3)} ±${fixed(lot.next_bar.specific_G.spread_percent, 1)} %, corrections ${lot.next_bar.correction_per_depth.slice(0, 3).map((c) => `${fixed(c.mean, 3)} ±${fixed(c.spread, 3)}`).join(' / ')}${lot.next_bar.pitch_cents_per_c ? `, ${fixed(lot.next_bar.pitch_cents_per_c.mean, 2)} ±${fixed(lot.next_bar.pitch_cents_per_c.spread, 2)} cents/°C` : ''}`,
      );
    lines.push('');
  }
  return lines.join('\n').trimEnd();
}

function parseSpan(text: string): { from: string; to: string } {
  const parts = text.split(/[:–-]/).map((part) => part.trim()).filter((part) => part !== '');
  if (parts.length !== 2) throw new InputError('command line', '--notes', `"${text}" is not a span of notes such as A2:B3`);
  const from = parseNote(parts[0]!, 'command line', '--notes');
  const to = parseNote(parts[1]!, 'command line', '--notes');
  if (to.midi < from.midi) throw new InputError('command line', '--notes', `${parts[1]} is below ${parts[0]}`);
  return { from: parts[0]!, to: parts[1]! };
}

async function add(lotsPath: string, sessionPath: string, values: { bar?: string; lot?: string; notes?: string; json?: boolean }, io: CommandIo): Promise<number> {
  const file = await readLotFile(lotsPath, io, true);
  const log = await readSessionFile(sessionPath, io);
  const name = values.lot ?? sessionLotName(log);
  if (name === undefined || name.trim() === '') throw new InputError(sessionPath, 'steps[0].bar.lot', 'the bar names no lot: add "lot" to its bar file, or give --lot NAME');
  const { prior } = priorForSession(log, file);
  const verdict = nextCut(log, { source: sessionPath, lot: prior });
  if (verdict.status !== 'done') throw new InputError(sessionPath, 'steps', `the session is not done (status ${verdict.status}): only a finished bar teaches its lot`);
  const calibration = calibrateSession(log, { lot: prior });
  const barName = values.bar ?? log.label ?? log.target.note ?? sessionPath;
  const record = lotRecordFromCalibration(calibration, barName, new Date().toISOString(), log.target.note);
  const updated = withLotRecord(file, name, record, values.notes !== undefined ? parseSpan(values.notes) : undefined);
  await io.writeFile(lotsPath, `${toJson(updated)}\n`);
  if (values.json) io.stdout(toJson({ lot: name, record, lots: lotSummaries(updated) }));
  else io.stdout(`Learnt ${barName} into lot ${name} (${updated.lots[name]!.bars.length} finished bar${updated.lots[name]!.bars.length === 1 ? '' : 's'}); wrote ${lotsPath}.\n\n${showText(updated, lotsPath)}`);
  return 0;
}

/**
 * `barwright lots`: what finished bars taught about their board or batch of wood. `add LOTS SESSION`
 * learns a finished session into the lot its bar names (creating the lot file if needed); `show
 * LOTS` lists each lot's bars and what the next bar will start from. `next-cut --lots` and
 * `plan --lots` read the same file.
 */
export const lotsCommand: Command = {
  name: 'lots',
  summary: 'what finished bars taught about their lot of wood: the starting point of the next bar from it',
  usage: 'barwright lots add LOTS SESSION [--bar NAME] [--lot NAME] [--notes FROM:TO] [--json]\n  barwright lots show LOTS [--json]',
  async run(args, io) {
    const { values, positionals } = parseOptions(args, {
      bar: { type: 'string' },
      lot: { type: 'string' },
      notes: { type: 'string' },
      json: { type: 'boolean' },
    });
    const [action, lotsPath, sessionPath, ...rest] = positionals;
    if (action === 'add') {
      if (lotsPath === undefined || sessionPath === undefined || rest.length > 0) throw new InputError('command line', 'arguments', 'give: lots add LOTS SESSION');
      return add(lotsPath, sessionPath, values, io);
    }
    if (action === 'show') {
      if (lotsPath === undefined || sessionPath !== undefined) throw new InputError('command line', 'arguments', 'give: lots show LOTS');
      const file = await readLotFile(lotsPath, io);
      io.stdout(values.json ? toJson({ lots: lotSummaries(file) }) : showText(file, lotsPath));
      return 0;
    }
    throw new InputError('command line', 'action', `give "add" or "show" (got ${JSON.stringify(action ?? '')})`);
  },
};
