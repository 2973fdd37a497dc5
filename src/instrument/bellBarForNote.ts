import { millimetre } from '../units/units.ts';
import type { BeamTheory } from '../fe/beamElementType.ts';
import { analyzeBar } from '../modes/analyzeBar.ts';
import { barModelFromFile } from '../modes/BarModel.ts';
import type { BarFile, BarFileMaterial } from '../fileFormats/barFile.ts';
import { lengthForFrequency } from './lengthForFrequency.ts';
import { nearestInterval } from './musicalInterval.ts';
import { meshDensity } from '../modes/meshDensity.ts';
import { pieceModes } from './pieceModes.ts';

/** Stock of a bell bar: a plain rectangular bar, mm. */
export interface BellBarStock {
  width_mm: number;
  thickness_mm: number;
  material: BarFileMaterial;
}

/** One partial of a bell bar with its nearest musical interval. */
export interface BellBarPartial {
  mode: number;
  hz: number;
  ratio: number;
  interval: { name: string; cents: number };
  nodes_mm: number[];
}

/** A bell bar cut for a note (mm, Hz, cents). */
export interface BellBarForNote {
  target_hz: number;
  length_mm: number;
  cents_error: number;
  theory: BeamTheory;
  /** The bar file of the uniform bar at that length. */
  bar: BarFile;
  partials: BellBarPartial[];
  /** Where to support it: mode 1's two nodes, mm from the left end. */
  support_points_mm: [number, number];
  torsion: { mode: number; hz: number; ratio: number }[];
  lateral: { mode: number; hz: number; ratio: number }[];
  /** Torsion or lateral modes within beating distance of partials 1–3 (collisionWarnings' rule in Hz). */
  warnings: string[];
}

/** βL of mode 1 of a free–free Euler–Bernoulli beam (Blevins 1979, table 8-1). */
const firstRoot = 4.73004074486;

/**
 * A uniform bell bar (steel, aluminium, any material) for a target fundamental (Hz): the length
 * from a secant search on the solver's Timoshenko modes (started from the Euler–Bernoulli closed
 * form L = βL₁·(t·√(E/12ρ)/2πf)^½, Blevins 1979, table 8-1), its inharmonic partials with
 * the nearest equal-tempered intervals, support points at mode 1's nodes, and torsion and
 * lateral modes with collision warnings from analyzeBar. Pure.
 */
export function bellBarForNote(stock: BellBarStock, targetHz: number, options: { partials?: number; theory?: BeamTheory; label?: string } = {}): BellBarForNote {
  const theory = options.theory ?? 'timoshenko';
  const count = Math.max(3, Math.floor(options.partials ?? 5));
  const barAt = (lengthMm: number): BarFile => ({
    format: 'barwright.bar',
    version: 1,
    ...(options.label ? { label: options.label } : {}),
    length_mm: lengthMm,
    section: { shape: 'rect', width_mm: stock.width_mm, thickness_mm: stock.thickness_mm },
    material: { ...stock.material },
  });
  const probe = barModelFromFile(barAt(1000)).material;
  const thickness = stock.thickness_mm * millimetre;
  const initial = firstRoot * Math.sqrt((thickness * Math.sqrt(probe.youngModulus / (12 * probe.density))) / (2 * Math.PI * targetHz));
  const solution = lengthForFrequency((length) => pieceModes(barModelFromFile(barAt(length * 1000)), { modes: 1, theory, elements: meshDensity(Math.max(count, 4), theory) })[0]!.hz, targetHz, initial);
  const bar = barAt(solution.length * 1000);
  const analysis = analyzeBar(bar, { modes: count, theory });
  const partials = analysis.bending.map((m) => {
    const interval = nearestInterval(m.ratio);
    return { mode: m.mode, hz: m.hz, ratio: m.ratio, interval: { name: interval.name, cents: interval.cents }, nodes_mm: m.nodes_mm ?? [] };
  });
  const nodes = partials[0]!.nodes_mm;
  return {
    target_hz: targetHz,
    length_mm: bar.length_mm,
    cents_error: 1200 * Math.log2(partials[0]!.hz / targetHz),
    theory,
    bar,
    partials,
    support_points_mm: [nodes[0]!, nodes[nodes.length - 1]!],
    torsion: analysis.torsion.map((m) => ({ mode: m.mode, hz: m.hz, ratio: m.ratio })),
    lateral: analysis.lateral.map((m) => ({ mode: m.mode, hz: m.hz, ratio: m.ratio })),
    warnings: analysis.warnings,
  };
}
