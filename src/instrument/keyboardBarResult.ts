import { analyzeLineBar } from '../modes/analyzeLineBar.ts';
import type { BarFile } from '../fileFormats/barFile.ts';
import { closedTube } from '../resonator/closedTube.ts';

/** How a planned bar stands: within its tolerances on the check mesh, outside them, or not designable. */
export type KeyboardBarStatus = 'in-tolerance' | 'out-of-tolerance' | 'infeasible';

/** A resonator tube sized for a bar (mm, m/s, °C). */
export interface PlannedResonator {
  inner_diameter_mm: number;
  length_mm: number;
  end_correction_mm: number;
  air_temperature_c: number;
  speed_of_sound_m_s: number;
}

/** One planned bar of a keyboard: what the cut list, the templates and the project store (mm, Hz, cents). */
export interface KeyboardBarResult {
  note: string;
  midi: number;
  index: number;
  status: KeyboardBarStatus;
  /** The designer's verdict on its own mesh. */
  feasible: boolean;
  /** Every tuned partial within its tolerance when re-analysed on the fine check mesh. */
  within_tolerance: boolean;
  /** Why the bar is flagged (designer's reason, partials out of tolerance, blank-schedule note). */
  reason?: string;
  blank: { length_mm: number; width_mm: number; thickness_mm: number };
  /** The bar with its planned profile (a bar file `barwright modes` reads). */
  bar: BarFile;
  ratios: number[];
  tolerance_cents: number[];
  target_hz: number[];
  /** The designer's prediction, Hz and cents from target. */
  predicted_hz: number[];
  cents_error: number[];
  /**
   * Re-analysis of the planned bar on the fine mesh: the tuned partials and the first four bending
   * modes. With `theory` 'solid' the tuned partials (`hz`, `cents_error`) are the 3D model's analysis
   * of the final arch (the status follows them); `bending_hz` stays the line model's.
   */
  check: { elements: number; hz: number[]; cents_error: number[]; bending_hz: number[]; theory?: 'solid' };
  centre_thickness_mm: number;
  thinnest_mm: number;
  /** Where the undercut starts and ends, mm from the left end (null when the bar is uncut). */
  arch: { start_mm: number; end_mm: number; extent_mm: number } | null;
  /** Cord holes at the planned bar's mode-1 nodes, mm from the left end. */
  cord_holes_mm: [number, number];
  resonator?: PlannedResonator;
  /** Torsion or lateral collisions and other notes. */
  warnings: string[];
}

/** What describePlannedBar needs besides the designed bar. */
export interface PlannedBarContext {
  note: string;
  midi: number;
  index: number;
  ratios: readonly number[];
  tolerance_cents: readonly number[];
  target_hz: readonly number[];
  feasible: boolean;
  predicted_hz: readonly number[];
  reason?: string;
  resonator?: { inner_diameter_mm: number; air_temperature_c: number; open_end: 'unflanged' | 'flanged' };
  /** Extra notes to carry (blank schedule flags). */
  notes?: readonly string[];
  /** The 3D model's tuned partials (Hz) and fundamental nodes (mm) of the final arch, for a bar designed on it: they replace the line model's check. */
  solid?: { hz: readonly number[]; nodes_mm: readonly number[] };
}

/** Elements of the check mesh: several times the solver's automatic density (Timoshenko O(h⁸): far below 0.001 cent). */
export const checkElements = 160;

/** Thickness difference (mm) below which a station counts as uncut. */
const uncutSlackMm = 0.005;

const cents = (hz: number, target: number): number => 1200 * Math.log2(hz / target);

/**
 * Everything a maker and the records need about a designed bar: the re-analysis on a fine check
 * mesh (every tuned partial against its tolerance), the centre and thinnest thickness, the arch
 * extent, the cord holes at the mode-1 nodes of the planned profile, and the resonator tube
 * (closedTube at the room's temperature) tuned to the target fundamental. Pure.
 */
export function describePlannedBar(bar: BarFile, context: PlannedBarContext): KeyboardBarResult {
  if (bar.section.shape !== 'rect') throw new Error('internal: a keyboard bar is rectangular');
  const blankThickness = bar.section.thickness_mm;
  const profile = bar.profile_mm ?? [
    [0, blankThickness],
    [bar.length_mm, blankThickness],
  ];
  const partials = context.ratios.length;
  const analysis = analyzeLineBar(bar, { modes: Math.max(4, partials), elements: checkElements });
  const checkHz = context.solid ? [...context.solid.hz] : analysis.bending.slice(0, partials).map((m) => m.hz);
  const checkCents = checkHz.map((hz, k) => cents(hz, context.target_hz[k]!));
  const outside = checkCents.flatMap((c, k) => (Math.abs(c) > context.tolerance_cents[k]! ? [`partial ${k + 1} is ${c > 0 ? '+' : ''}${c.toFixed(1)} cents (tolerance ±${context.tolerance_cents[k]})`] : []));
  const within = outside.length === 0;
  const centre = thicknessAtMm(profile, bar.length_mm / 2);
  const thinnest = Math.min(...profile.map(([, t]) => t));
  const cutIndices = profile.flatMap(([, t], i) => (t < blankThickness - uncutSlackMm ? [i] : []));
  const arch =
    cutIndices.length === 0
      ? null
      : (() => {
          const start = profile[Math.max(0, cutIndices[0]! - 1)]![0];
          const end = profile[Math.min(profile.length - 1, cutIndices[cutIndices.length - 1]! + 1)]![0];
          return { start_mm: start, end_mm: end, extent_mm: end - start };
        })();
  const nodes = context.solid?.nodes_mm.length === 2 ? [...context.solid.nodes_mm] : (analysis.bending[0]!.nodes_mm ?? []);
  const reasons = [...(context.reason ? [context.reason] : []), ...(context.feasible && !within ? outside : []), ...(context.notes ?? [])];
  const result: KeyboardBarResult = {
    note: context.note,
    midi: context.midi,
    index: context.index,
    status: !context.feasible ? 'infeasible' : within ? 'in-tolerance' : 'out-of-tolerance',
    feasible: context.feasible,
    within_tolerance: within,
    ...(reasons.length > 0 ? { reason: reasons.join('; ') } : {}),
    blank: { length_mm: bar.length_mm, width_mm: bar.section.width_mm, thickness_mm: blankThickness },
    bar,
    ratios: [...context.ratios],
    tolerance_cents: [...context.tolerance_cents],
    target_hz: [...context.target_hz],
    predicted_hz: [...context.predicted_hz],
    cents_error: context.predicted_hz.map((hz, k) => cents(hz, context.target_hz[k]!)),
    check: { elements: analysis.mesh.elements, hz: checkHz, cents_error: checkCents, bending_hz: analysis.bending.slice(0, 4).map((m) => m.hz), ...(context.solid ? { theory: 'solid' as const } : {}) },
    centre_thickness_mm: centre,
    thinnest_mm: thinnest,
    arch,
    cord_holes_mm: [nodes[0]!, nodes[nodes.length - 1]!],
    warnings: [...analysis.warnings],
  };
  if (context.resonator) {
    const tube = closedTube(
      { targetHz: context.target_hz[0]!, innerDiameterM: context.resonator.inner_diameter_mm / 1000, air: { temperatureC: context.resonator.air_temperature_c }, openEnd: context.resonator.open_end },
      `resonator ${context.note}`,
    );
    result.resonator = {
      inner_diameter_mm: context.resonator.inner_diameter_mm,
      length_mm: tube.lengthM * 1000,
      end_correction_mm: tube.endCorrectionM * 1000,
      air_temperature_c: context.resonator.air_temperature_c,
      speed_of_sound_m_s: tube.speedOfSoundMS,
    };
  }
  return result;
}

/** Thickness (mm) of a piecewise-linear profile at a position (mm). */
function thicknessAtMm(profile: readonly (readonly [number, number])[], position: number): number {
  for (let i = 1; i < profile.length; i++) {
    const [x1, t1] = profile[i]!;
    if (position <= x1) {
      const [x0, t0] = profile[i - 1]!;
      return x1 > x0 ? t0 + ((position - x0) / (x1 - x0)) * (t1 - t0) : t1;
    }
  }
  return profile[profile.length - 1]![1];
}
