import { analyzeBar } from '../../../src/index.ts';
import { assembleBending } from '../../../src/fe/assembleBending.ts';
import { buildMesh } from '../../../src/fe/buildMesh.ts';
import { bandedToDense } from '../../../src/eigen/BandedMatrix.ts';
import { barModelFromFile } from '../../../src/modes/BarModel.ts';
import { meshDensity } from '../../../src/modes/meshDensity.ts';
import { bendingLine, solveBendingLine } from '../../../src/modes/solveBending.ts';
import type { BarFile } from '../../../src/fileFormats/barFile.ts';
import { denseGeneralizedEigen } from '../../reference/denseGeneralizedEigen.ts';
import { measure, type BenchRow, type BenchSuite } from '../measure.ts';

/**
 * An invented deep-undercut bass bar of dense hardwood: 460 × 60 × 24 mm, cut over its middle
 * 300 mm down to 7 mm (stations every 20 mm over the arch), E 18 GPa, G 1.3 GPa, ρ 1000.
 */
const deepUndercutBar: BarFile = (() => {
  const profile: [number, number][] = [[0, 24]];
  for (let x = 80; x <= 380; x += 20) {
    const u = (x - 230) / 150;
    profile.push([x, 24 - 17 * (1 - u * u)]);
  }
  profile.push([460, 24]);
  return {
    format: 'barwright.bar',
    version: 1,
    label: 'bench bass bar',
    length_mm: 460,
    section: { shape: 'rect', width_mm: 60, thickness_mm: 24 },
    profile_mm: profile,
    material: { E_GPa: 18, G_GPa: 1.3, density_kg_m3: 1000 },
  };
})();

/** Least-squares slope and intercept of y against x. */
function linearFit(x: readonly number[], y: readonly number[]): { slope: number; intercept: number } {
  const meanX = x.reduce((a, b) => a + b, 0) / x.length;
  const meanY = y.reduce((a, b) => a + b, 0) / y.length;
  let numerator = 0;
  let denominator = 0;
  x.forEach((xi, i) => {
    numerator += (xi - meanX) * (y[i]! - meanY);
    denominator += (xi - meanX) ** 2;
  });
  const slope = numerator / denominator;
  return { slope, intercept: meanY - slope * meanX };
}

/**
 * The bar solver's cost: one analyzeBar call (vertical bending, lateral bending and torsion,
 * 4 modes, default mesh) on a deep-undercut wooden bar (target: under 1 ms); analyzeBar at four
 * mesh sizes with the per-element slope of a linear fit (banded work grows linearly); and the
 * same bar's vertical bending problem (same K and M) solved by the dense textbook route of
 * test/reference against the banded Lanczos route, with the ratio (target: ≥ 100×).
 */
export const solverSuite: BenchSuite = {
  name: 'solver',
  async run(): Promise<BenchRow[]> {
    const rows: BenchRow[] = [];
    const single = await measure(() => analyzeBar(deepUndercutBar, { modes: 4 }), { minTimeMs: 1000 });
    const elements = analyzeBar(deepUndercutBar, { modes: 4 }).mesh.elements;
    rows.push({ suite: 'solver', case: 'analyzeBar, deep undercut, 3 families × 4 modes', ...single, detail: { elements, target_ms: 1 } });

    const sizes = [50, 100, 200, 400];
    const times: number[] = [];
    const actual: number[] = [];
    for (const size of sizes) {
      const result = await measure(() => analyzeBar(deepUndercutBar, { modes: 4, elements: size }), { minTimeMs: 500 });
      const meshElements = analyzeBar(deepUndercutBar, { modes: 4, elements: size }).mesh.elements;
      times.push(result.median_ms);
      actual.push(meshElements);
      rows.push({ suite: 'solver', case: `analyzeBar at ${meshElements} elements`, ...result, detail: { elements: meshElements } });
    }
    const fit = linearFit(actual, times);
    rows.push({
      suite: 'solver',
      case: 'analyzeBar cost per element (linear fit)',
      median_ms: fit.slope,
      runs: sizes.length,
      detail: { us_per_element: fit.slope * 1000, intercept_ms: fit.intercept, cost_ratio_8x_mesh: times[3]! / times[0]! },
    });

    const model = barModelFromFile(deepUndercutBar);
    const line = bendingLine(model, 'vertical');
    const nodes = buildMesh(model.profile, meshDensity(4, 'timoshenko'));
    const banded = await measure(() => solveBendingLine(line, nodes, 'timoshenko', 4), { minTimeMs: 500 });
    const system = assembleBending(nodes, line, 'timoshenko');
    const dense = await measure(
      () => {
        const assembled = assembleBending(nodes, line, 'timoshenko');
        return denseGeneralizedEigen(bandedToDense(assembled.stiffness), bandedToDense(assembled.mass));
      },
      { warmup: 1, minRuns: 3, minTimeMs: 0 },
    );
    rows.push({ suite: 'solver', case: 'vertical bending, banded Lanczos', ...banded, detail: { dofs: system.stiffness.size } });
    rows.push({
      suite: 'solver',
      case: 'vertical bending, dense reference (all pairs)',
      ...dense,
      detail: { dofs: system.stiffness.size, dense_over_banded: dense.median_ms / banded.median_ms, target_ratio: 100 },
    });
    return rows;
  },
};
