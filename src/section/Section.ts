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

/**
 * The section's overall depth in the vertical (striking) direction (m): a rect's blank thickness,
 * a rod's diameter, a tube's outer diameter. This is what a thickness profile measures and what
 * cut limits compare with (one convention for every module: modes, design and sessions).
 */
export function sectionDepth(section: Section): number {
  switch (section.shape) {
    case 'rect':
      return section.thickness;
    case 'round':
      return section.diameter;
    case 'tube':
      return section.outerDiameter;
  }
}
