import type { LineHole } from '../fe/BeamLine.ts';
import type { BarModel } from '../modes/BarModel.ts';
import { bendingNodePositions } from '../modes/modeShape.ts';
import type { BendingSolution } from '../modes/solveBending.ts';
import { thicknessAt } from '../section/ThicknessProfile.ts';
import type { UncutFromHoles } from './workshopLimits.ts';

/**
 * Where the designer first puts the cord holes, as a fraction of the length from each end, before
 * the arch is known: the nodes of the fundamental of tuned bars lie at 0.19–0.21 of the length
 * (measured on the designs of the demo keyboards; 0.2242 on a uniform bar, Blevins 1979, table
 * 8-1). Taking the inner end of that range keeps the first arch clear of the holes wherever the
 * nodes turn out to be, so the next round only moves the holes.
 */
export const firstNodeEstimate = 0.21;

/** Wood (m) added to the clearance when the uncut ends are set from the holes, so a hole moved by rounding stays clear. */
export const holeClearanceMargin = 0.0005;

/** How far (m) a hole may sit from its node before the designer moves it and designs again. */
export const holePlacementTolerance = 0.00025;

/** The cord holes of one design: where they are (m from the left end), how big, how far from the arch. */
export interface CordHolePlan {
  /** Centres, m from the left end (left one first). */
  readonly positions: readonly number[];
  /** Diameter (m). */
  readonly diameter: number;
  /** Wood kept between a hole's edge and the arch (m). */
  readonly clearance: number;
  /** Holes the bar already has (kept where they are) rather than holes the designer places. */
  readonly drilled: boolean;
}

/** The first placement on a bar of this length: at firstNodeEstimate from each end. */
export function estimatedCordHoles(length: number, diameter: number, clearance: number): CordHolePlan {
  return { positions: [firstNodeEstimate * length, (1 - firstNodeEstimate) * length], diameter, clearance, drilled: false };
}

/**
 * The uncut ends the holes need: out to the far edge of every hole in each half of the bar, plus
 * the clearance and a small margin (holeClearanceMargin).
 */
export function uncutForHoles(plan: CordHolePlan, length: number): UncutFromHoles {
  let left = 0;
  let right = 0;
  const reach = plan.diameter / 2 + plan.clearance + holeClearanceMargin;
  for (const x of plan.positions) {
    if (x <= length / 2) left = Math.max(left, x + reach);
    else right = Math.max(right, length - x + reach);
  }
  return { left, right };
}

/**
 * The model with the plan's holes drilled through the width, each centred in the thickness of
 * the bar where it is (the uncut end: the blank's thickness). Holes the bar already has are in
 * the model already and are kept as they are.
 */
export function modelWithCordHoles(model: BarModel, plan: CordHolePlan): BarModel {
  if (plan.drilled || plan.diameter <= 0) return model;
  const holes: LineHole[] = plan.positions.map((position) => ({ position, radius: plan.diameter / 2, depthBelowTop: thicknessAt(model.profile, position) / 2 }));
  return { ...model, holes };
}

/** The nodes of the fundamental nearest each end (m from the left end), or none if it has fewer than two. */
export function fundamentalNodes(solution: BendingSolution): number[] {
  const nodes = bendingNodePositions(solution, 0);
  return nodes.length >= 2 ? [nodes[0]!, nodes[nodes.length - 1]!] : [];
}
