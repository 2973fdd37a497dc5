import { availableParallelism } from 'node:os';
import { mkdir, readFile } from 'node:fs/promises';
import { join } from 'node:path';
import { type StoredKeyboardBar, type KeyboardTask, type KeyboardTaskResult, keyboardBarTemplates, keyboardStationTables, keyboardCutListCsv, planKeyboard, type KeyboardPlan, signedNumber } from '../../instrument/index.ts';
import { createWorkerPool, keyboardBarWorkerUrl } from '../../instrument/index.node.ts';
import { parseKeyboardFile, parseWorkshopFile, InputError } from '../../fileFormats/index.ts';
import { fixed, formatTable, numberOption, parseOptions, readJsonFile, toJson, type Command } from '../command.ts';
import { keyboardFileWithLots, type LotMaterialNote } from '../../session/index.ts';
import { readLotFile } from '../readSession.ts';

/** The stored plan in an output folder, when there is a readable one to resume from. */
async function previousPlan(dir: string): Promise<Pick<KeyboardPlan, 'bars' | 'advice'> | undefined> {
  try {
    const value = JSON.parse(await readFile(join(dir, 'keyboard-plan.json'), 'utf8')) as Partial<KeyboardPlan>;
    if (value.format === 'barwright.keyboard-plan' && value.version === 1 && value.bars && typeof value.bars === 'object') return { bars: value.bars, advice: value.advice && typeof value.advice === 'object' ? value.advice : {} };
  } catch {
    // No plan there yet (or not one of ours): start afresh.
  }
  return undefined;
}

function planTable(plan: KeyboardPlan): string {
  const bars = plan.notes.map((n) => plan.bars[n]).filter((b): b is StoredKeyboardBar => b !== undefined);
  const rows = [['note', 'target Hz', 'blank L×W×T mm', 'centre mm', 'arch mm', 'cord holes mm', 'resonator mm', 'partials (cents)', 'status']];
  for (const bar of bars) {
    rows.push([
      bar.note,
      fixed(bar.target_hz[0]!, 2),
      `${fixed(bar.blank.length_mm, 0)}×${fixed(bar.blank.width_mm, 0)}×${fixed(bar.blank.thickness_mm, 0)}`,
      fixed(bar.centre_thickness_mm, 1),
      bar.arch ? `${fixed(bar.arch.start_mm, 0)}–${fixed(bar.arch.end_mm, 0)}` : '—',
      `${fixed(bar.cord_holes_mm[0], 1)}, ${fixed(bar.cord_holes_mm[1], 1)}`,
      bar.resonator ? fixed(bar.resonator.length_mm, 0) : '—',
      bar.check.cents_error.map((c) => `${signedNumber(c, 1)}`).join(' '),
      bar.status,
    ]);
  }
  const s = plan.summary;
  const lines = [
    `${plan.name || 'Keyboard'}: ${plan.range.lowest}–${plan.range.highest}, ${s.bars} bars at A4 = ${plan.a4_hz} Hz${plan.workshop ? `, cut in ${plan.workshop}` : ''}`,
    '',
    formatTable(rows),
    '',
    `${s.in_tolerance} within tolerance, ${s.out_of_tolerance} outside, ${s.infeasible} not designable${s.complete ? '' : `, ${s.bars - s.designed} not done yet (run again to resume)`}.`,
    'Partials are re-analysed on a fine mesh; holes and arch from the left end; resonators from the closed bottom to the open top.',
  ];
  const flagged = bars.filter((b) => b.reason);
  if (flagged.length) lines.push('', 'Flagged:', ...flagged.map((b) => `  ${b.note}: ${b.reason}`));
  const warned = bars.filter((b) => b.warnings.length);
  if (warned.length) lines.push('', 'Mode collisions:', ...warned.map((b) => `  ${b.note}: ${b.warnings.join('; ')}`));
  lines.push('', 'Cautions:', ...plan.cautions.map((c) => `  - ${c}`));
  return lines.join('\n');
}

/** Which notes were planned from a lot, one line per lot. */
function lotLines(notes: readonly LotMaterialNote[]): string {
  const byLot = new Map<string, LotMaterialNote[]>();
  for (const note of notes) byLot.set(note.lot, [...(byLot.get(note.lot) ?? []), note]);
  return [...byLot.entries()]
    .map(([lot, list]) => `Planned from lot ${lot}: ${list.map((n) => n.note).join(', ')} (E ${fixed(list[0]!.material.E_GPa, 2)} GPa, G ${fixed(list[0]!.material.G_GPa, 3)} GPa at the keyboard's density)`)
    .join('\n');
}

/** `barwright plan KEYBOARD`: blank schedule, every bar designed, cut list and templates. */
export const planCommand: Command = {
  name: 'plan',
  summary: 'plan a whole keyboard: blank schedule, every bar designed, cut list, 1:1 templates',
  usage: 'barwright plan KEYBOARD [--workshop FILE] [--lots LOTS] [--theory timoshenko|solid] [--out DIR] [--workers N] [--fresh] [--quiet] [--json]',
  async run(args, io) {
    const { values, positionals } = parseOptions(args, {
      out: { type: 'string' },
      lots: { type: 'string' },
      workshop: { type: 'string' },
      theory: { type: 'string' },
      workers: { type: 'string' },
      fresh: { type: 'boolean' },
      quiet: { type: 'boolean' },
      json: { type: 'boolean' },
    });
    if (positionals.length !== 1) throw new InputError('command line', 'KEYBOARD', 'give exactly one keyboard file');
    const path = positionals[0]!;
    const theory = values.theory ?? 'timoshenko';
    if (theory !== 'timoshenko' && theory !== 'solid') throw new InputError('command line', '--theory', `must be timoshenko or solid (got "${theory}")`);
    let file = parseKeyboardFile(await readJsonFile(path, io), path);
    // A workshop file given on the command line replaces the keyboard file's own.
    if (values.workshop !== undefined) {
      const { format: _format, version: _version, ...workshop } = parseWorkshopFile(await readJsonFile(values.workshop, io), values.workshop);
      file = { ...file, workshop };
    }
    // The remaining bars of each lot are planned from what its finished bars taught.
    let fromLots: LotMaterialNote[] = [];
    if (values.lots !== undefined) ({ file, notes: fromLots } = keyboardFileWithLots(file, await readLotFile(values.lots, io)));
    const workers = numberOption(values.workers, 'workers', (n) => (Number.isInteger(n) && n >= 1 && n <= 16 ? null : 'must be a whole number from 1 to 16')) ?? Math.min(4, availableParallelism());
    const previous = values.out !== undefined && !values.fresh ? await previousPlan(values.out) : undefined;
    const pool = createWorkerPool<KeyboardTask, KeyboardTaskResult>(keyboardBarWorkerUrl, { size: workers });
    const controller = new AbortController();
    const stop = (): void => controller.abort();
    process.once('SIGINT', stop);
    let plan: KeyboardPlan;
    try {
      plan = await planKeyboard(file, {
        runner: pool,
        theory,
        ...(previous ? { previous } : {}),
        signal: controller.signal,
        onProgress: (p) => {
          if (!values.quiet && !values.json && p.note) io.stderr(`${p.stage === 'advice' ? 'advised blank' : 'designed'} ${p.note} (${p.done}/${p.total})`);
        },
      });
    } finally {
      process.removeListener('SIGINT', stop);
      await pool.close();
    }
    if (values.out !== undefined) {
      await mkdir(join(values.out, 'templates'), { recursive: true });
      await mkdir(join(values.out, 'stations'), { recursive: true });
      await io.writeFile(join(values.out, 'keyboard-plan.json'), `${toJson(plan)}\n`);
      const bars = plan.notes.map((n) => plan.bars[n]).filter((b): b is StoredKeyboardBar => b !== undefined);
      await io.writeFile(join(values.out, 'cut-list.csv'), keyboardCutListCsv(bars));
      for (const template of keyboardBarTemplates(bars)) await io.writeFile(join(values.out, 'templates', template.file), template.svg);
      for (const table of keyboardStationTables(bars)) await io.writeFile(join(values.out, 'stations', table.file), table.csv);
    }
    if (!values.json && fromLots.length > 0) io.stdout(lotLines(fromLots));
    io.stdout(values.json ? toJson(fromLots.length > 0 ? { ...plan, lot_materials: fromLots } : plan) : `${planTable(plan)}${values.out !== undefined ? `\n\nWrote ${join(values.out, 'keyboard-plan.json')}, cut-list.csv, templates/*.svg (1:1) and stations/*.csv` : ''}`);
    return plan.summary.complete ? 0 : 1;
  },
};
