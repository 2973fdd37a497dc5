// The mesh along the bar on a designed profile (a kink at every station).
import { describe, expect, it } from 'vitest';
import { lengthSections } from '../../src/fe/index.ts';

describe('element boundaries along a designed bar', () => {
  it('kinks one element apart, each halved toward the other, give no element of zero length (regression: a designed C5 bar once failed with a degenerate hexahedron)', () => {
    // A smooth arch sampled every 4.27 mm, as the designer writes it: every interior station is a kink.
    const positions = Float64Array.from({ length: 31 }, (_, k) => (k * 0.28) / 30);
    const thicknesses = Float64Array.from(positions, (x) => 0.021 - 0.012 * Math.sin((Math.PI * x) / 0.28) ** 2);
    const sections = lengthSections({ positions, thicknesses }, 30, 2);
    let shortest = Infinity;
    for (let k = 1; k < sections.length; k++) shortest = Math.min(shortest, sections[k]! - sections[k - 1]!);
    // Two halvings of a 9.3 mm element leave 2.3 mm at the least; nothing near zero.
    expect(shortest).toBeGreaterThan(1e-3);
    // Every station is still a boundary.
    for (const x of positions) expect(sections.some((s) => Math.abs(s - x) < 1e-12)).toBe(true);
  });
});
