/**
 * The short cautions every cutting output carries (brief §4: common practice; local rules and
 * licensed practice come first).
 */
export const woodCautions: readonly string[] = [
  'Power tools (band saw, drum and belt sanders, routers): use the guards, eye and hearing protection, keep hands clear of blades, follow the tool maker’s instructions.',
  'Fine hardwood dust, tropical species especially, irritates and sensitises the airways: use dust extraction and a suitable respirator.',
  'Some tonewood species are trade-restricted (CITES and national rules): check before buying, selling or exporting.',
  'These figures are predictions: cut less than predicted, let the wood rest, re-measure, and follow local rules and licensed practice for workshops and electrical equipment.',
];

/** Cautions for cutting metal tubes, rods and bars (brief §4: common practice). */
export const metalCautions: readonly string[] = [
  'Saws, grinders and drills: use the guards, eye and hearing protection, clamp the work, follow the tool maker’s instructions.',
  'Cut ends and holes leave sharp burrs: deburr them; handle cutting fluids and swarf with gloves.',
  'These figures are predictions: cut a little long, measure the pitch, trim in small steps, and follow local rules and licensed practice for workshops.',
];
