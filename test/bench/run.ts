// `npm run bench [-- --json] [-- --only NAME]`: runs the benchmark suites in this process and
// prints a table (or one JSON document with --json). Figures are medians of repeated runs;
// ratios are always against a baseline measured in the same run.
import { suites } from './suites.ts';
import type { BenchRow } from './measure.ts';

const args = process.argv.slice(2);
const json = args.includes('--json');
const onlyIndex = args.indexOf('--only');
const only = onlyIndex >= 0 ? args[onlyIndex + 1] : undefined;

const rows: BenchRow[] = [];
for (const suite of suites) {
  if (only && suite.name !== only) continue;
  if (!json) process.stderr.write(`running ${suite.name}…\n`);
  rows.push(...(await suite.run()));
}

if (json) {
  process.stdout.write(`${JSON.stringify({ node: process.version, cpus: (await import('node:os')).cpus().length, rows }, null, 2)}\n`);
} else {
  const table = [['suite', 'case', 'median ms', 'runs', 'detail']];
  for (const row of rows) {
    const detail = Object.entries(row.detail ?? {})
      .map(([k, v]) => `${k}=${typeof v === 'number' && !Number.isInteger(v) ? +v.toPrecision(4) : v}`)
      .join(' ');
    table.push([row.suite, row.case, row.median_ms === undefined ? '–' : row.median_ms.toPrecision(4), String(row.runs), detail]);
  }
  const widths = table[0]!.map((_, i) => Math.max(...table.map((r) => r[i]!.length)));
  for (const r of table) process.stdout.write(`${r.map((c, i) => c.padEnd(widths[i]!)).join('  ').trimEnd()}\n`);
}
