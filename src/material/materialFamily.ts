import type { Material } from './Material.ts';

/** Above this Young's modulus (Pa) a material is taken to be metal: woods lie at 8–25 GPa along the grain, aluminium at 69 (common practice). */
const metalModulus = 40e9;

/**
 * Whether a material is timber (or a timber-like synthetic) or metal, for the words the workbench
 * and the cautions use: metal when E > 40 GPa. Metal is also nearly isotropic (E/G = 2(1 + ν) ≈ 2.6),
 * so shear barely moves its partials, while timber's E/G of 10–20 does.
 */
export function materialFamily(material: Pick<Material, 'youngModulus'>): 'timber' | 'metal' {
  return material.youngModulus > metalModulus ? 'metal' : 'timber';
}
