import { describe, expect, it } from 'vitest';
import { barModelFromFile } from '../../src/modes/BarModel.ts';
import { defaultCutLimits } from '../../src/design/cutLimits.ts';
import { createDesignProblem } from '../../src/design/designProblem.ts';
import { resolveDesignTarget } from '../../src/design/designTarget.ts';
import { evaluateShape } from '../../src/design/evaluateShape.ts';
import { freeFormArch } from '../../src/design/freeFormArch.ts';
import { powerArch } from '../../src/design/powerArch.ts';
import { shoulderArch } from '../../src/design/shoulderArch.ts';
import { surfaceConstraints } from '../../src/design/surfaceConstraints.ts';
import type { ShapeFamily } from '../../src/design/ShapeFamily.ts';
import type { BarFile } from '../../src/fileFormats/barFile.ts';

/** An invented rough-cut, slightly asymmetric bass blank so the min(original, arch) rule is exercised. */
const bar: BarFile = {
  length_mm: 420,
  section: { shape: 'rect', width_mm: 56, thickness_mm: 22 },
  profile_mm: [[0, 22], [150, 22], [200, 20.5], [230, 20.8], [300, 22], [420, 22]],
  material: { E_GPa: 17, G_GPa: 1.2, density_kg_m3: 980 },
};
const model = barModelFromFile(bar);
const problem = createDesignProblem(model, resolveDesignTarget({ note: 'G3', a4: 442, ratios: '1:4:10' }), defaultCutLimits({ length: 0.42, thickness: 0.022 }));
const m = freeFormArch.parameterCount(problem.space);
const points: [ShapeFamily, number[]][] = [
  [shoulderArch, [0.55, 0.35, 0.6]],
  [powerArch, [0.6, 0.4, 0.7]],
  [freeFormArch, Array.from({ length: m }, (_, k) => 0.5 - (0.4 * k) / m)],
];

describe('exact cents derivatives of the shape parameters (station sensitivities chained through ∂t/∂q)', () => {
  it.each(points.map(([family, q]) => [family.name, family, q] as const))('%s agrees with central finite differences', (_name, family, q) => {
    const base = evaluateShape(problem, family, q);
    const n = q.length;
    let worstRelative = 0;
    for (const p of [0, 1, Math.min(2, n - 1), n - 1]) {
      // Central differences, step 1e-4 of the unit parameter range: truncation O(h²) ≈ 1e-7
      // relative (measured), and the eigensolver's convergence noise (≈ 1e-8 cents) divided by h
      // stays near 1e-6 relative: both below the 1e-5 relative tolerance.
      const h = 1e-4;
      const plus = evaluateShape(problem, family, q.map((v, i) => (i === p ? v + h : v)));
      const minus = evaluateShape(problem, family, q.map((v, i) => (i === p ? v - h : v)));
      for (let k = 0; k < 3; k++) {
        const difference = (plus.cents[k]! - minus.cents[k]!) / (2 * h);
        const exact = base.centsJacobian[k * n + p]!;
        const scale = Math.max(1, Math.abs(difference));
        worstRelative = Math.max(worstRelative, Math.abs(exact - difference) / scale);
      }
      const volumeDifference = (plus.volume - minus.volume) / (2 * h);
      // Removed volume (trapezoid rule): same step, truncation O(h²) ≈ 1e-8 relative; tolerance 1e-6.
      expect(Math.abs(base.volumeGradient[p]! - volumeDifference)).toBeLessThan(1e-6 * Math.abs(volumeDifference) + 1e-15);
    }
    expect(worstRelative).toBeLessThan(1e-5);
  });
  it('the slope and radius rows are the exact derivatives of the constraint values', () => {
    const q = points[0]![1];
    const base = evaluateShape(problem, shoulderArch, q);
    const constraints = surfaceConstraints(problem, base.depth, base.depthJacobian, 3);
    const h = 1e-6;
    const moved = evaluateShape(problem, shoulderArch, [q[0]!, q[1]! + h, q[2]!]);
    const after = surfaceConstraints(problem, moved.depth, moved.depthJacobian, 3);
    let worst = 0;
    for (let c = 0; c < constraints.count; c++) worst = Math.max(worst, Math.abs((after.values[c]! - constraints.values[c]!) / h - constraints.jacobian[c * 3 + 1]!));
    // Forward difference: error ≈ h·(second derivative) ≈ 1e-6 × 1e-2 m; tolerance 1e-6 m per unit q.
    expect(worst).toBeLessThan(1e-6);
  });
});
