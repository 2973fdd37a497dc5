import type { Material } from '../material/Material.ts';
import { materialFamily } from '../material/materialFamily.ts';

/**
 * The short cautions printed with every cutting plan (brief §4): power tools, dust (or, for metal,
 * burrs and cutting fluids), restricted timber, and that predictions are estimates. Plain strings.
 */
export function designCautions(material: Material): string[] {
  const metal = materialFamily(material) === 'metal';
  return [
    'Power tools (band saw, drum or belt sander, grinder, router): use the guards, eye and hearing protection, keep hands clear of blades and follow the tool maker’s instructions.',
    metal
      ? 'Metal work: deburr cut edges, handle cutting fluids as their data sheet says, and keep swarf off the floor.'
      : 'Fine hardwood dust, tropical species especially, irritates and sensitises the lungs: use dust extraction and a suitable respirator.',
    ...(metal ? [] : ['Some tonewood species are restricted under CITES and national rules: check before buying, selling or exporting.']),
    'This plan is an estimate: the real bar differs from the model. Cut less than predicted, stay a few tens of cents sharp on the rough cut, measure, and creep down. Follow local rules and licensed practice for workshops and electrical equipment.',
  ];
}
