/**
 * `value` rounded to `decimals` places for the edges (files, JSON, screens), never −0: a small
 * negative number that rounds to zero comes back as 0, so a record compares equal to itself after
 * a JSON round trip. Non-finite values pass through unchanged (callers validate before output).
 */
export function roundDecimals(value: number, decimals: number): number {
  const scale = 10 ** decimals;
  const rounded = Math.round(value * scale) / scale;
  return rounded === 0 ? 0 : rounded;
}
