import {
  analyzeBar,
  barModelFromFile,
  envelopeEigenproblem,
  envelopeToDense,
  lowestModesOf,
  solidBarOf,
  solidMeshFor,
  solidRigidModes,
  solveSolidPart,
  sparseSymmetricToDense,
  assembleSolidBar,
  buildSolidBarMesh,
  type SolidMeshOptions,
  type SolidPart,
} from '../../../src/index.ts';
import { denseGeneralizedEigen } from '../../reference/denseGeneralizedEigen.ts';
import { deepArchBar, deepArchConverged } from '../../solid/deepArchBar.ts';
import { measure, type BenchRow, type BenchSuite } from '../measure.ts';

/** Least-squares slope of y against x. */
function slope(x: readonly number[], y: readonly number[]): number {
  const mx = x.reduce((a, b) => a + b, 0) / x.length;
  const my = y.reduce((a, b) => a + b, 0) / y.length;
  let num = 0;
  let den = 0;
  x.forEach((xi, i) => {
    num += (xi - mx) * (y[i]! - my);
    den += (xi - mx) ** 2;
  });
  return num / den;
}

const cpuMs = () => {
  const usage = process.cpuUsage();
  return (usage.user + usage.system) / 1000;
};

/** Median CPU milliseconds of `runs` calls after one warm-up: steadier than wall time on a shared machine. */
function medianCpu(fn: () => unknown, runs: number): number {
  fn();
  const times: number[] = [];
  for (let k = 0; k < runs; k++) {
    const start = cpuMs();
    fn();
    times.push(cpuMs() - start);
  }
  times.sort((a, b) => a - b);
  return times[runs >> 1]!;
}

/**
 * The solid model's cost on the deep-arch bar (380 × 55 × 22 mm, arch to 8 mm, the
 * issue's orthotropic constants): analyzeBar with the solid theory (target ≤ 1000 ms, ≤ 300 MB),
 * its CPU time, memory, the accuracy of every family against the mesh-converged values
 * (target ≤ 1 cent), the line model on the same bar as the same-run baseline, the growth of the
 * time with the unknowns (scaled meshes, log–log slope), and the dense textbook route against
 * the envelope Lanczos on the same small system.
 */
export const solidSuite: BenchSuite = {
  name: 'solid',
  async run(): Promise<BenchRow[]> {
    const rows: BenchRow[] = [];
    const line = await measure(() => analyzeBar(deepArchBar, { modes: 3 }), { minTimeMs: 500 });
    rows.push({ suite: 'solid', case: 'baseline: line model analyzeBar, deep arch, 3 families', ...line });

    let cpu = 0;
    let calls = 0;
    const heapBefore = process.memoryUsage().heapUsed;
    const solid = await measure(
      () => {
        const start = cpuMs();
        analyzeBar(deepArchBar, { theory: 'solid', modes: 3 });
        cpu += cpuMs() - start;
        calls++;
      },
      { warmup: 1, minRuns: 5, minTimeMs: 0 },
    );
    const analysis = analyzeBar(deepArchBar, { theory: 'solid', modes: 3 });
    const heapAfter = process.memoryUsage().heapUsed;
    const maxRssMb = process.resourceUsage().maxRSS / 1024;
    rows.push({
      suite: 'solid',
      case: 'analyzeBar solid, deep arch, partials 1–3 with torsion and lateral',
      ...solid,
      detail: {
        cpu_ms: cpu / calls,
        unknowns: analysis.mesh.unknowns ?? 0,
        target_ms: 1000,
        over_line_model: solid.median_ms / line.median_ms,
        max_rss_mb: maxRssMb,
        heap_growth_mb: (heapAfter - heapBefore) / 1e6,
        target_mb: 300,
      },
    });
    const solidDefault = await measure(() => analyzeBar(deepArchBar, { theory: 'solid' }), { warmup: 0, minRuns: 3, minTimeMs: 0 });
    rows.push({ suite: 'solid', case: 'analyzeBar solid, deep arch, CLI default (4 partials, families up to partial 4)', ...solidDefault });

    // Accuracy against the mesh-converged values (cents; the default mesh converges from above).
    const cents: Record<string, number> = {};
    let worst = 0;
    for (const family of ['bending', 'torsion', 'lateral'] as const) {
      deepArchConverged[family].forEach((hz, i) => {
        const value = 1200 * Math.log2(analysis[family][i]!.hz / hz);
        cents[`${family}_${i + 1}`] = value;
        worst = Math.max(worst, Math.abs(value));
      });
    }
    rows.push({ suite: 'solid', case: 'default mesh against the mesh-converged values (cents)', median_ms: 0, runs: 1, detail: { ...cents, worst_cents: worst, target_cents: 1 } });

    // Growth of the time with the unknowns: both halves at scaled default meshes, CPU time (wall
    // time on a shared 2-core machine swings by 2–3× between runs).
    const model = barModelFromFile(deepArchBar);
    const bar = solidBarOf(model);
    const unknowns: number[] = [];
    const times: number[] = [];
    for (const scale of [0.6, 0.8, 1, 1.25]) {
      const meshOf = (part: SolidPart): SolidMeshOptions => {
        const base = solidMeshFor(part);
        return { ...base, lengthElements: Math.max(4, Math.round(base.lengthElements * scale)), halfWidthElements: Math.max(1, Math.round(base.halfWidthElements * scale)), thicknessElements: Math.max(1, Math.round(base.thicknessElements * scale)) };
      };
      let dofs = 0;
      const solveBoth = () => {
        dofs = 0;
        for (const part of ['symmetric', 'antisymmetric'] as const) dofs += solveSolidPart(bar, part, meshOf(part), { count: 3 }, 1e-5).system.dofCount;
      };
      const cpuMedian = medianCpu(solveBoth, 3);
      unknowns.push(dofs);
      times.push(cpuMedian);
      rows.push({ suite: 'solid', case: `both halves, 3 modes each, mesh × ${scale} (CPU ms)`, median_ms: cpuMedian, runs: 3, detail: { unknowns: dofs } });
    }
    rows.push({
      suite: 'solid',
      case: 'growth of CPU time with unknowns (log–log slope)',
      median_ms: 0,
      runs: unknowns.length,
      detail: { exponent: slope(unknowns.map(Math.log), times.map(Math.log)), from_unknowns: unknowns[0]!, to_unknowns: unknowns[unknowns.length - 1]! },
    });

    // The dense textbook route on the same small system (Cholesky–Householder–QL, all pairs).
    const small = assembleSolidBar(buildSolidBarMesh(bar.geometry, 'symmetric', { element: 'serendipity-20', lengthElements: 8, halfWidthElements: 1, thicknessElements: 1, stationRefinement: 0 }), bar.material);
    const envelope = await measure(() => lowestModesOf(envelopeEigenproblem(small.stiffness, small.mass), 3, { shift: -1e5, rigidModes: solidRigidModes(small) }), { minTimeMs: 300 });
    const dense = await measure(() => denseGeneralizedEigen(envelopeToDense(small.stiffness), sparseSymmetricToDense(small.mass)), { warmup: 0, minRuns: 2, minTimeMs: 0 });
    rows.push({ suite: 'solid', case: 'small mesh: envelope LDLᵀ + Lanczos, 3 modes', ...envelope, detail: { unknowns: small.dofCount } });
    rows.push({
      suite: 'solid',
      case: 'small mesh: dense reference (all pairs)',
      ...dense,
      detail: { unknowns: small.dofCount, dense_over_envelope: dense.median_ms / envelope.median_ms, dense_at_default_mesh_s_by_n3: ((dense.median_ms * ((analysis.mesh.unknowns ?? 0) / 2 / small.dofCount) ** 3) / 1000) * 2 },
    });
    return rows;
  },
};
