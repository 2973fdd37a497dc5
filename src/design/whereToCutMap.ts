import { millimetre } from '../units/units.ts';
import type { BeamTheory } from '../fe/beamElementType.ts';
import { gaussLegendre } from '../fe/gaussLegendre.ts';
import { barModelFromFile } from '../modes/BarModel.ts';
import { bendingSensitivityDensity } from '../modes/bendingSensitivities.ts';
import { solveBending } from '../modes/solveBending.ts';
import type { BarFile } from '../fileFormats/barFile.ts';
import { InputError } from '../fileFormats/InputError.ts';
import { roundDecimals } from '../fileFormats/roundDecimals.ts';

/** Options of whereToCutMap (mm at the edge). */
export interface CutEffectOptions {
  /** How many partials (default 3). */
  readonly partials?: number;
  /** Spacing of the map's positions, mm (default 2.5). */
  readonly step_mm?: number;
  /** Depth removed in the thought experiment, mm (default 0.1). */
  readonly depth_mm?: number;
  /** Length of the strip removed around each position, mm (default 10: a sanding-drum pass). */
  readonly strip_mm?: number;
  readonly theory?: BeamTheory;
}

/** One partial's row of the map. */
export interface CutEffectPartial {
  partial: number;
  hz: number;
  /** Cents change for removing `depth_mm` over `strip_mm` centred at each position (− flattens). */
  cents: number[];
}

/** A where-to-cut map, ready to plot: positions along the bar and the effect of a small cut there. */
export interface CutEffectMap {
  positions_mm: number[];
  depth_mm: number;
  strip_mm: number;
  partials: CutEffectPartial[];
}

/** Gauss points per element piece of a strip (the density is a smooth function within an element). */
const stripRule = gaussLegendre(6);

/**
 * Where to cut: for each of the first partials, the change in cents from removing `depth_mm`
 * (default 0.1 mm) over a `strip_mm` (default 10 mm) strip centred at each position, from the
 * solver's local sensitivity density dλ/dt (bendingSensitivityDensity, exact to first order):
 * Δλ = −depth·∫strip density dx (Gauss–Legendre on each mesh element inside the strip), Δcents = (1200/ln 2)·Δλ/(2λ). Strips are clipped at the ends.
 * Negative where a cut flattens the partial (it bends there), positive where it sharpens it.
 */
export function whereToCutMap(bar: BarFile, options: CutEffectOptions = {}, source = 'map'): CutEffectMap {
  if (bar.section.shape !== 'rect') throw new InputError(source, 'section.shape', `only rect bars are undercut (this bar is a ${bar.section.shape})`);
  const partials = options.partials ?? 3;
  const step = options.step_mm ?? 2.5;
  const depth = options.depth_mm ?? 0.1;
  const strip = options.strip_mm ?? 10;
  if (!Number.isInteger(partials) || partials < 1 || partials > 6) throw new InputError(source, 'partials', `must be a whole number from 1 to 6 (got ${partials})`);
  if (!(step >= 0.5 && step <= 50)) throw new InputError(source, 'step_mm', `must be from 0.5 to 50 mm (got ${step})`);
  if (!(depth > 0 && depth <= 5)) throw new InputError(source, 'depth_mm', `must be more than 0 and at most 5 mm (got ${depth})`);
  if (!(strip >= 1 && strip <= bar.length_mm / 2)) throw new InputError(source, 'strip_mm', `must be from 1 mm to half the bar length (got ${strip})`);
  const model = barModelFromFile(bar);
  const solution = solveBending(model, { modes: partials, theory: options.theory ?? 'timoshenko' });
  const length = model.length;
  const nodes = solution.system.nodes;
  const count = Math.floor(bar.length_mm / step + 1e-9) + 1;
  const positions = Array.from({ length: count }, (_, i) => Math.min(bar.length_mm, i * step));
  if (positions[positions.length - 1]! < bar.length_mm - 1e-9) positions.push(bar.length_mm);
  const result: CutEffectPartial[] = [];
  for (let mode = 0; mode < Math.min(partials, solution.frequencies.length); mode++) {
    const lambda = solution.eigenvalues[mode]!;
    const cents = positions.map((positionMm) => {
      const a = Math.max(0, positionMm * millimetre - (strip * millimetre) / 2);
      const b = Math.min(length, positionMm * millimetre + (strip * millimetre) / 2);
      // Piecewise Gauss between the mesh nodes inside the strip (the density is smooth within an
      // element and kinks at nodes and stations).
      const breaks = [a, ...Array.from(nodes).filter((x) => x > a + 1e-12 && x < b - 1e-12), b];
      let integral = 0;
      for (let piece = 0; piece + 1 < breaks.length; piece++) {
        const start = breaks[piece]!;
        const span = breaks[piece + 1]! - start;
        stripRule.points.forEach((xi, g) => (integral += stripRule.weights[g]! * span * bendingSensitivityDensity(solution, mode, start + xi * span)));
      }
      const change = -depth * millimetre * integral;
      return roundDecimals(((1200 / Math.LN2) * change) / (2 * lambda), 3);
    });
    result.push({ partial: mode + 1, hz: roundDecimals(solution.frequencies[mode]!, 3), cents });
  }
  return { positions_mm: positions.map((p) => roundDecimals(p, 3)), depth_mm: depth, strip_mm: strip, partials: result };
}
