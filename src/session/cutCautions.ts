/**
 * The short cautions every proposed cut carries (brief.md §4). barwright's predictions are
 * estimates; the maker's workshop rules and licensed practice come first.
 */
export const cutCautions: readonly string[] = [
  'Predictions are estimates: cut less than predicted, strike and measure again before the next cut.',
  'Power tools (band saw, drum or belt sander, grinder, router): guards in place, eye and hearing protection, hands clear of the blade or drum; follow the tool maker’s instructions.',
  'Fine hardwood dust, tropical species especially, irritates and sensitises the lungs: use dust extraction and a suitable respirator.',
  'Follow local rules and licensed practice for workshops and electrical equipment; some tonewoods are trade-restricted (CITES): check before buying, selling or exporting.',
];
