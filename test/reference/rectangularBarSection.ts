import type { BeamSectionFunctions } from './timoshenkoShooting.ts';

/** A rectangular bar with a piecewise-linear thickness profile, SI (m, Pa, kg/m³). */
export interface RectangularBar {
  length: number;
  width: number;
  /** [position, thickness] stations from 0 to length, thickness linear between them. */
  profile: readonly (readonly [number, number])[];
  youngModulus: number;
  shearModulus: number;
  density: number;
  shearCoefficient: number;
}

/**
 * Thickness (m) of the bar at x by linear interpolation of its profile (written here, apart from
 * the solver's own profile code, so the reference checks do not share it).
 */
function referenceThickness(bar: RectangularBar, x: number): number {
  const stations = bar.profile;
  for (let k = 1; k < stations.length; k++) {
    const [x0, t0] = stations[k - 1]!;
    const [x1, t1] = stations[k]!;
    if (x <= x1 || k === stations.length - 1) return t0 + ((t1 - t0) * (x - x0)) / (x1 - x0);
  }
  return stations[0]![1];
}

/**
 * Vertical-bending section functions of a flat-topped rectangular bar for the shooting
 * reference: EI = E b t³/12, κGA = κ G b t, ρA = ρ b t, ρI = ρ b t³/12, t = t(x) (classical
 * beam about the section's own centroid, as brief.md §2 writes it).
 */
export function rectangularBarSection(bar: RectangularBar): BeamSectionFunctions {
  const t = (x: number): number => referenceThickness(bar, x);
  return {
    bendingStiffness: (x) => (bar.youngModulus * bar.width * t(x) ** 3) / 12,
    shearStiffness: (x) => bar.shearCoefficient * bar.shearModulus * bar.width * t(x),
    massPerLength: (x) => bar.density * bar.width * t(x),
    rotaryInertiaPerLength: (x) => (bar.density * bar.width * t(x) ** 3) / 12,
  };
}

/** The profile stations' positions (m), for restarting the shooting integration at kinks. */
export function profileStations(bar: RectangularBar): number[] {
  return bar.profile.map(([x]) => x);
}
