// How the workbench writes numbers: fixed decimals per unit, a true minus sign, never NaN
// (a missing or non-finite value shows as an en dash). Presentation only; no computation.

/** The text shown where a value is missing or not finite. */
export const missing = '–';

function fixed(value: number | null | undefined, decimals: number): string {
  if (value === null || value === undefined || !Number.isFinite(value)) return missing;
  return value.toFixed(decimals).replace('-', '−');
}

/** Frequency in Hz with one decimal (two below 100 Hz). */
export function formatHz(hz: number | null | undefined): string {
  if (hz === null || hz === undefined || !Number.isFinite(hz)) return missing;
  return fixed(hz, hz < 100 ? 2 : 1);
}

/** Length in mm with `decimals` (default 1). */
export function formatMm(mm: number | null | undefined, decimals = 1): string {
  return fixed(mm, decimals);
}

/** A plain number with `decimals`. */
export function formatNumber(value: number | null | undefined, decimals: number): string {
  return fixed(value, decimals);
}

/** Signed cents: one decimal below 10, whole cents above, always with + or −. */
export function formatCents(centsValue: number | null | undefined): string {
  if (centsValue === null || centsValue === undefined || !Number.isFinite(centsValue)) return missing;
  const magnitude = Math.abs(centsValue);
  const text = magnitude < 10 ? magnitude.toFixed(1) : magnitude.toFixed(0);
  if (text === '0.0') return '0.0';
  return `${centsValue > 0 ? '+' : '−'}${text}`;
}

/** The shape that goes with a verdict, so the sign reads without colour. */
export function verdictMark(verdict: 'sharp' | 'flat' | 'in tune' | null): string {
  if (verdict === 'sharp') return '▲';
  if (verdict === 'flat') return '▼';
  if (verdict === 'in tune') return '●';
  return '';
}

/** CSS class of a verdict. */
export function verdictClass(verdict: 'sharp' | 'flat' | 'in tune' | null): string {
  if (verdict === 'in tune') return 'in-tune';
  return verdict ?? '';
}

/** Local date and time of an ISO timestamp, short (e.g. "3 Mar, 09:15"). */
export function formatWhen(iso: string | null | undefined): string {
  if (!iso) return missing;
  const date = new Date(iso);
  if (Number.isNaN(date.getTime())) return missing;
  return date.toLocaleString(undefined, { day: 'numeric', month: 'short', hour: '2-digit', minute: '2-digit' });
}

/** Local time of an ISO timestamp with seconds (for "saved at"). */
export function formatClock(iso: string | null | undefined): string {
  if (!iso) return missing;
  const date = new Date(iso);
  if (Number.isNaN(date.getTime())) return missing;
  return date.toLocaleTimeString(undefined, { hour: '2-digit', minute: '2-digit', second: '2-digit' });
}

/** Ratios written the trade's way: 1 : 4 : 10. */
export function formatRatios(ratios: readonly number[]): string {
  return ratios.map((ratio) => (Number.isInteger(ratio) ? String(ratio) : ratio.toFixed(2))).join(' : ');
}

/** Plain name of a bar state. */
export function stateName(state: 'not-started' | 'rough' | 'tuning' | 'done'): string {
  return { 'not-started': 'not started', rough: 'rough-cut', tuning: 'tuning', done: 'done' }[state];
}

/** The shape beside each bar state, so states read without colour. */
export const stateMarks: Readonly<Record<'not-started' | 'rough' | 'tuning' | 'done', string>> = { 'not-started': '○', rough: '◔', tuning: '◑', done: '✔' };

/** What each bar state means, for the legend and the hover text. */
export const stateMeanings: Readonly<Record<'not-started' | 'rough' | 'tuning' | 'done', string>> = {
  'not-started': 'the blank as cut to length; no undercut yet',
  rough: 'undercut roughly (a plan used or a cut drawn), no round measured yet',
  tuning: 'rounds of strike, measure and cut under way',
  done: 'marked done: every partial within its tolerance',
};

/** Partial names in trade words: "Fundamental", "Partial 2", … (index from 0). */
export function partialName(index: number): string {
  return index === 0 ? 'Fundamental' : `Partial ${index + 1}`;
}
