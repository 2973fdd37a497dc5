import { csvNumber, csvTable } from './csvTable.ts';
import type { ChimeSetPlan } from './chimeSetPlan.ts';

/**
 * A chime set's cut list as CSV (RFC 4180, header row, CRLF): one row per chime with note, MIDI,
 * target Hz, tuned pitch, length, hanging point and lower node from the top (0.1 mm), strike
 * note, partial ratios 2–6 and warnings (joined with "; ").
 */
export function chimeCutListCsv(plan: ChimeSetPlan): string {
  const header = ['note', 'midi', 'target_hz', 'tuned', 'length_mm', 'hanging_point_mm', 'lower_node_mm', 'fundamental_hz', 'strike_hz', 'strike_note', 'strike_cents', 'ratio_2', 'ratio_3', 'ratio_4', 'ratio_5', 'ratio_6', 'warnings'];
  const rows = plan.chimes.map((c) => [
    c.note,
    String(c.midi),
    csvNumber(c.target_hz, 2),
    plan.tune,
    csvNumber(c.length_mm, 1),
    csvNumber(c.hanging_point_mm, 1),
    csvNumber(c.lower_node_mm, 1),
    csvNumber(c.fundamental_hz, 2),
    csvNumber(c.strike_hz, 2),
    c.strike_note,
    csvNumber(c.strike_cents, 1),
    ...[1, 2, 3, 4, 5].map((k) => csvNumber(c.partials[k]!.ratio, 3)),
    c.warnings.join('; '),
  ]);
  return csvTable([header, ...rows]);
}
