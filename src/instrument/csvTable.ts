/** Quotes one CSV field when it holds a comma, a double quote, CR or LF (RFC 4180 §2.6–2.7). */
export function csvField(value: string): string {
  return /[",\r\n]/.test(value) ? `"${value.replace(/"/g, '""')}"` : value;
}

/**
 * Rows of text as CSV per RFC 4180: fields separated by commas, records by CRLF, the last record
 * ended by CRLF too, fields quoted only when needed (embedded quotes doubled). The first row is
 * the header. Every row must have the header's field count (RFC 4180 §2.4).
 */
export function csvTable(rows: readonly (readonly string[])[]): string {
  const width = rows[0]?.length ?? 0;
  for (const [i, row] of rows.entries()) if (row.length !== width) throw new Error(`internal: CSV row ${i} has ${row.length} fields, the header ${width}`);
  return rows.map((row) => `${row.map(csvField).join(',')}\r\n`).join('');
}

/** A number for a CSV cell with fixed decimals; refuses NaN and Infinity (never written). */
export function csvNumber(value: number, decimals: number): string {
  if (!Number.isFinite(value)) throw new Error('internal: non-finite number in a CSV cell');
  const text = value.toFixed(decimals);
  return /^-0(\.0*)?$/.test(text) ? text.slice(1) : text;
}

/** A signed number for tables ("+1.5", "-0.3", "+0.0" — never "-0"): for cents and shifts. */
export function signedNumber(value: number, decimals: number): string {
  const text = csvNumber(value, decimals);
  return text.startsWith('-') ? text : `+${text}`;
}
