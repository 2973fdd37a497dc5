/** A mode of another family (torsion, lateral bending, or longitudinal for the solid model) to check against the tuned partials. */
export interface OtherMode {
  readonly family: 'torsion' | 'lateral' | 'longitudinal';
  readonly mode: number;
  readonly hz: number;
}

/** Default collision window: 50 cents (issue: a few tens of cents make a bar buzz or beat). */
export const collisionWindowCents = 50;

/**
 * Warnings for torsion or lateral modes within `windowCents` of one of the first three bending
 * partials, e.g. "torsion mode 1 is 18 cents from bending partial 3" (cents = 1200·log₂ ratio,
 * rounded to whole cents, sign dropped), nearest first.
 */
export function collisionWarnings(bendingHz: readonly number[], others: readonly OtherMode[], windowCents = collisionWindowCents): string[] {
  const found: { cents: number; text: string }[] = [];
  bendingHz.slice(0, 3).forEach((partial, index) => {
    for (const other of others) {
      const cents = Math.abs(1200 * Math.log2(other.hz / partial));
      if (cents <= windowCents) found.push({ cents, text: `${other.family} mode ${other.mode} is ${Math.round(cents)} cents from bending partial ${index + 1}` });
    }
  });
  return found.sort((a, b) => a.cents - b.cents).map((f) => f.text);
}
