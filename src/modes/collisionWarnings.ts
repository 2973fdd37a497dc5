/** A mode of another family (torsion, lateral bending, or longitudinal for the solid model) to check against the tuned partials. */
export interface OtherMode {
  readonly family: 'torsion' | 'lateral' | 'longitudinal';
  readonly mode: number;
  readonly hz: number;
}

/**
 * How far beyond the tuned partials other modes are listed, cents (50: wide enough to hold every
 * mode the beating rule below can flag for partials above about 210 Hz, where 6 Hz is 50 cents).
 */
export const collisionWindowCents = 50;

/**
 * The closest, in Hz, a torsion, lateral or longitudinal mode may come to a tuned partial before
 * it can make the bar buzz or beat: 6 Hz below 1 kHz, 15 Hz below 2 kHz, 30 Hz above
 * (common practice, from memory; ../shared/brief.md, "other modes"). Beats are |f₁ − f₂| per
 * second, so the rule is a distance in Hz, not in cents.
 */
export function collisionDistanceHz(partialHz: number): number {
  if (partialHz < 1000) return 6;
  if (partialHz < 2000) return 15;
  return 30;
}

/** The beating rule in words, for messages. */
export const collisionRuleText = '6 Hz below 1 kHz, 15 Hz below 2 kHz, 30 Hz above';

/**
 * Warnings for torsion, lateral or longitudinal modes within the beating distance
 * (collisionDistanceHz) of one of the first three bending partials, nearest first, e.g.
 * "torsion mode 1 is 18 cents from bending partial 3 (4.2 Hz apart; closer than 15 Hz can beat)"
 * (cents = 1200·log₂ ratio, rounded to whole cents, sign dropped).
 */
export function collisionWarnings(bendingHz: readonly number[], others: readonly OtherMode[]): string[] {
  const found: { cents: number; text: string }[] = [];
  bendingHz.slice(0, 3).forEach((partial, index) => {
    const allowed = collisionDistanceHz(partial);
    for (const other of others) {
      const apart = Math.abs(other.hz - partial);
      if (apart > allowed) continue;
      const cents = Math.abs(1200 * Math.log2(other.hz / partial));
      found.push({ cents, text: `${other.family} mode ${other.mode} is ${Math.round(cents)} cents from bending partial ${index + 1} (${apart.toFixed(1)} Hz apart; closer than ${allowed} Hz can beat)` });
    }
  });
  return found.sort((a, b) => a.cents - b.cents).map((f) => f.text);
}

/** Where one other mode stands against the beating rule: its nearest tuned partial by the rule, and how far inside or outside. */
export interface OtherModeClearance {
  readonly family: OtherMode['family'];
  readonly mode: number;
  readonly hz: number;
  /** The tuned partial (1-based) whose rule it comes closest to breaking, and that partial's Hz. */
  readonly partial: number;
  readonly partial_hz: number;
  /** The other mode less the partial, Hz (negative: below it). */
  readonly apart_hz: number;
  /** The rule's distance at that partial, Hz (collisionDistanceHz). */
  readonly allowed_hz: number;
  /** |apart| − allowed, Hz: positive is clear, zero or less can beat. */
  readonly margin_hz: number;
  /** True when the mode is farther than the rule's distance from every tuned partial (margin > 0). */
  readonly clear: boolean;
}

/**
 * Each other mode against every tuned partial (all of `tunedHz`, Hz) by the beating rule
 * (collisionDistanceHz): the partial where |f_other − f_partial| − distance is smallest, and that
 * margin in Hz; a mode is clear when the margin is positive (a mode exactly at the distance is
 * flagged, as collisionWarnings does). Sorted tightest first. Pure arithmetic in Hz.
 */
export function otherModeClearances(tunedHz: readonly number[], others: readonly OtherMode[]): OtherModeClearance[] {
  const found: OtherModeClearance[] = [];
  for (const other of others) {
    let nearest: OtherModeClearance | undefined;
    tunedHz.forEach((partial, index) => {
      const apart = other.hz - partial;
      const allowed = collisionDistanceHz(partial);
      const margin = Math.abs(apart) - allowed;
      if (!nearest || margin < nearest.margin_hz) nearest = { family: other.family, mode: other.mode, hz: other.hz, partial: index + 1, partial_hz: partial, apart_hz: apart, allowed_hz: allowed, margin_hz: margin, clear: margin > 0 };
    });
    if (nearest) found.push(nearest);
  }
  return found.sort((a, b) => a.margin_hz - b.margin_hz);
}
