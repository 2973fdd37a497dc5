// A simulated "real" bar for session tests: its own material and physics, different from the
// solver's. It stands in for the workshop: it is cut (with the maker's execution error) and struck
// (with measurement noise), and the session only ever sees the resulting partials.
import { bendingLaw, type SectionLaw } from '../../src/fe/sectionLaw.ts';
import { buildMesh } from '../../src/fe/buildMesh.ts';
import { solveBendingLine } from '../../src/modes/solveBending.ts';
import type { BarModel } from '../../src/modes/BarModel.ts';

/** How the simulated bar's physics departs from the classical Timoshenko model. */
export interface RealPhysics {
  /** Bending stiffness knock-down where the bar is thin: EI · (1 − bendingLoss · (1 − t/t0)²). */
  readonly bendingLoss: number;
  /** Shear stiffness knock-down where thin: κGA · (1 − shearLoss · (1 − t/t0)). */
  readonly shearLoss: number;
  /** Elements along the bar (the solver's own mesh uses far fewer). */
  readonly elements: number;
}

/**
 * Default departure, tuned so that on the brief's reference bar (400 × 50 mm, parabolic cut over the
 * central 220 mm from 22 to 8 mm) modes 1–3 come out about 2–3 % below classical Timoshenko, like
 * the converged 2D model in brief.md ("The real bar is not the model"), while a uniform bar is
 * untouched. The knock-down is local (depends on the thickness where each mode bends), so it is
 * not the per-partial, depth-proportional correction the calibration assumes.
 */
export const defaultRealPhysics: RealPhysics = { bendingLoss: 0.115, shearLoss: 0.62, elements: 160 };

/** A section law with the local knock-downs applied (value and thickness derivative). */
function knockedLaw(inner: SectionLaw, blank: number, physics: RealPhysics): SectionLaw {
  return {
    count: 4,
    evaluate(t, out, derivative) {
      inner.evaluate(t, out, derivative);
      const thin = Math.max(0, 1 - t / blank);
      const bending = 1 - physics.bendingLoss * thin * thin;
      const shear = 1 - physics.shearLoss * thin;
      if (derivative) {
        derivative[0] = derivative[0]! * bending + out[0]! * (physics.bendingLoss * 2 * thin) / blank;
        derivative[1] = derivative[1]! * shear + out[1]! * physics.shearLoss / blank;
      }
      out[0] = out[0]! * bending;
      out[1] = out[1]! * shear;
    },
  };
}

/** The simulated bar's true partials (Hz) for a shape (SI model with the true material). */
export function realPartials(model: BarModel, physics: RealPhysics = defaultRealPhysics, modes = 3): number[] {
  if (model.section.shape !== 'rect') throw new Error('simulated bars are rect');
  const law = knockedLaw(bendingLaw(model.section, model.material, 'vertical'), model.section.thickness, physics);
  const nodes = buildMesh(model.profile, physics.elements);
  const solution = solveBendingLine({ length: model.length, profile: model.profile, law }, nodes, 'timoshenko', modes);
  return Array.from(solution.frequencies);
}

/** Seeded uniform pseudo-random numbers in [0, 1) (mulberry32), so every test run is the same. */
export function seededRandom(seed: number): () => number {
  let state = seed >>> 0;
  return () => {
    state = (state + 0x6d2b79f5) >>> 0;
    let t = state;
    t = Math.imul(t ^ (t >>> 15), t | 1);
    t ^= t + Math.imul(t ^ (t >>> 7), t | 61);
    return ((t ^ (t >>> 14)) >>> 0) / 4294967296;
  };
}
