// The deep-arch bar and its mesh-converged solid frequencies, shared by the convergence
// test and the bench. Run `npx tsx test/solid/deepArchBar.ts` to recompute the reference (about
// ten minutes on an idle 2-core machine; prints the three meshes and the extrapolation).
import { analyzeBar, parseBarFile, type BarFile } from '../../src/index.ts';

/**
 * 380 × 55 × 22 mm, arched to 8 mm as fixtures/f4-practice.bar.json; E_L 12, E_R 1.2, E_T 0.6,
 * G_LR 0.95, G_LT 0.75, G_RT 0.25 GPa, 750 kg/m³ (the constants; Poisson's ratios left
 * to the hardwood means), radial grain.
 */
export const deepArchBar: BarFile = parseBarFile({
  label: 'deep-arch bar (issue constants)',
  length_mm: 380,
  section: { shape: 'rect', width_mm: 55, thickness_mm: 22 },
  profile_mm: [
    [0, 22],
    [80, 22],
    [140, 11],
    [190, 8],
    [240, 11],
    [300, 22],
    [380, 22],
  ],
  material: { E_GPa: 12, E_R_GPa: 1.2, E_T_GPa: 0.6, G_LR_GPa: 0.95, G_LT_GPa: 0.75, G_RT_GPa: 0.25, density_kg_m3: 750 },
});

/**
 * Pinned regression values (computed by this code, not a publication): the deep-arch bar's
 * frequencies (Hz) extrapolated to a converged mesh from three nested refinements of every
 * direction — (along, half width, thickness) = (40, 4, 4), (60, 5, 6), (80, 6, 8) target
 * elements, station refinement 3, 37 215 / 80 679 / 150 843 unknowns — by Richardson
 * extrapolation with the order fitted per mode (2.6–3.3). The finest mesh lies 0.03–0.06 cent
 * from these values.
 */
export const deepArchConverged = {
  bending: [239.303, 955.9853, 2154.1204],
  torsion: [411.6314, 1733.0169],
  lateral: [1065.1047],
} as const;

/** The three meshes of the extrapolation, with the rule that combines them. */
export const referenceMeshes = [
  { lengthElements: 40, halfWidthElements: 4, thicknessElements: 4, stationRefinement: 3 },
  { lengthElements: 60, halfWidthElements: 5, thicknessElements: 6, stationRefinement: 3 },
  { lengthElements: 80, halfWidthElements: 6, thicknessElements: 8, stationRefinement: 3 },
];

/** Richardson extrapolation of three values on meshes of sizes h (observed order fitted by bisection). */
export function extrapolate(values: readonly number[], h: readonly number[]): { limit: number; order: number } {
  const [a, b, c] = values as [number, number, number];
  const [h1, h2, h3] = h as [number, number, number];
  const target = (a - b) / (b - c);
  const residual = (p: number) => (h1 ** p - h2 ** p) / (h2 ** p - h3 ** p) - target;
  let lo = 0.5;
  let hi = 8;
  for (let k = 0; k < 100; k++) {
    const mid = (lo + hi) / 2;
    if (residual(lo) * residual(mid) <= 0) hi = mid;
    else lo = mid;
  }
  const order = (lo + hi) / 2;
  return { order, limit: c - ((b - c) * h3 ** order) / (h2 ** order - h3 ** order) };
}

if (process.argv[1]?.endsWith('deepArchBar.ts')) {
  // Mesh size of each level: the geometric mean of its per-direction refinement against the first.
  const h = [1, (1 / (1.5 * 1.25 * 1.5)) ** (1 / 3), (1 / (2 * 1.5 * 2)) ** (1 / 3)];
  const runs = referenceMeshes.map((mesh) => {
    const analysis = analyzeBar(deepArchBar, { theory: 'solid', modes: 3, solidMesh: mesh });
    console.log(JSON.stringify({ mesh, unknowns: analysis.mesh.unknowns, bending: analysis.bending.map((m) => m.hz), torsion: analysis.torsion.map((m) => m.hz), lateral: analysis.lateral.map((m) => m.hz) }));
    return analysis;
  });
  for (const family of ['bending', 'torsion', 'lateral'] as const) {
    runs[0]![family].forEach((_, i) => {
      const { limit, order } = extrapolate(runs.map((r) => r[family][i]!.hz), h);
      console.log(`${family} ${i + 1}: ${limit.toFixed(4)} Hz (order ${order.toFixed(2)})`);
    });
  }
}
