import { adviseBlankLength, designBar, designBarSolid, type BarFile, type DesignRequest, type DesignResult } from '../../../src/index.ts';
import { measure, type BenchRow, type BenchSuite } from '../measure.ts';

/** An invented demo blank of the generic dense hardwood (uniform, no cut yet). */
function blank(label: string, length_mm: number, width_mm: number, thickness_mm: number): BarFile {
  return { format: 'barwright.bar', version: 1, label, length_mm, section: { shape: 'rect', width_mm, thickness_mm }, material: { preset: 'demo-tropical-hardwood' } };
}

/** Typical (middle) bar, and the two ends of the demo keyboard, each a 1:4:10 or 1:3 design. */
const cases: { name: string; bar: BarFile; request: DesignRequest }[] = [
  { name: 'C4 1:4:10 (typical)', bar: blank('C4 blank', 353, 55, 22), request: { target: { note: 'C4', a4: 442, ratios: '1:4:10' } } },
  { name: 'A2 1:4:10 (low)', bar: blank('A2 blank', 560, 64, 25), request: { target: { note: 'A2', a4: 442, ratios: '1:4:10' } } },
  { name: 'C7 1:3 (high)', bar: blank('C7 blank', 139, 40, 19), request: { target: { note: 'C7', a4: 442, ratios: '1:3' } } },
];

/**
 * `design` suite: median wall time of designBar for a bar within tolerance, and the number of
 * finite-element solves it took (deterministic); plus one blank-advisor run, and designBarSolid
 * (the solid model's outer rounds) on the typical and low bars.
 */
export const designSuite: BenchSuite = {
  name: 'design',
  async run(): Promise<BenchRow[]> {
    const rows: BenchRow[] = [];
    for (const { name, bar, request } of cases) {
      let result: DesignResult | undefined;
      const timing = await measure(() => (result = designBar(bar, request)), { warmup: 2, minRuns: 7, minTimeMs: 1000, maxRuns: 30 });
      const worst = Math.max(...result!.cents_error.map((c, k) => Math.abs(c) / result!.tolerance_cents[k]!));
      rows.push({ suite: 'design', case: name, ...timing, detail: { solves: result!.solves, feasible: String(result!.feasible), worst_of_tolerance: worst, family: result!.shape.family } });
    }
    let solves = 0;
    const advice = await measure(
      () => {
        solves = adviseBlankLength({ section: { shape: 'rect', width_mm: 55, thickness_mm: 22 }, material: { preset: 'demo-tropical-hardwood' } }, { target: { note: 'C4', a4: 442, ratios: '1:4:10' } }).solves;
      },
      { warmup: 1, minRuns: 3, minTimeMs: 0, maxRuns: 3 },
    );
    rows.push({ suite: 'design', case: 'advise blank C4 1:4:10', ...advice, detail: { solves } });
    // The solid model's verdict in outer rounds (space mapping): target ≤ 15 s a bar.
    for (const { name, bar, request } of cases.slice(0, 2)) {
      let result: ReturnType<typeof designBarSolid> | undefined;
      const timing = await measure(() => (result = designBarSolid(bar, request)), { warmup: 0, minRuns: 2, minTimeMs: 0, maxRuns: 2 });
      const worst = Math.max(...result!.cents_error.map((c, k) => Math.abs(c) / result!.tolerance_cents[k]!));
      rows.push({
        suite: 'design',
        case: `${name}, solid theory`,
        ...timing,
        detail: { solid_solves: result!.solid.solid_solves, line_solves: result!.solid.line_solves, feasible: String(result!.feasible), worst_of_tolerance: worst, target_ms: 15000 },
      });
    }
    return rows;
  },
};
