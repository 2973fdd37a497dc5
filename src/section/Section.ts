/**
 * A bar's cross-section in SI units (metres). A `rect` bar has a flat top and may be undercut
 * from below (its `thickness` is the blank's); `round` is a solid rod, `tube` a round tube.
 */
export type Section =
  | { readonly shape: 'rect'; readonly width: number; readonly thickness: number }
  | { readonly shape: 'round'; readonly diameter: number }
  | { readonly shape: 'tube'; readonly outerDiameter: number; readonly wall: number };

/** True for sections whose two bending planes coincide (rod, tube). */
export function isAxisymmetric(section: Section): boolean {
  return section.shape !== 'rect';
}
