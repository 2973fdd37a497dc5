/**
 * Orthotropic elastic constants of wood in its material axes: L along the grain, R radial
 * (across the growth rings), T tangential (along them). Pa for moduli. Poisson's ratio ν_ij is
 * −ε_j / ε_i under a stress along i alone (so ν_ij / E_i = ν_ji / E_j).
 */
export interface OrthotropicElasticity {
  readonly youngLongitudinal: number;
  readonly youngRadial: number;
  readonly youngTangential: number;
  readonly shearLongitudinalRadial: number;
  readonly shearLongitudinalTangential: number;
  readonly shearRadialTangential: number;
  readonly poissonLongitudinalRadial: number;
  readonly poissonLongitudinalTangential: number;
  readonly poissonRadialTangential: number;
}

/**
 * How the growth rings run through a bar's cross-section, as the bar file gives it (ring_angle_deg):
 * the angle (radians) between the radial direction R and the thickness direction, in the plane of
 * the cross-section. 0: R runs through the thickness (`"radial"`, the default); π/2: T does
 * (`"tangential"`). L is always along the bar.
 */
export interface GrainOrientation {
  readonly ringAngle: number;
}

/** R through the thickness (the bar file's `"through_thickness": "radial"`, its default). */
export const radialThroughThickness: GrainOrientation = { ringAngle: 0 };
/** T through the thickness (`"through_thickness": "tangential"`). */
export const tangentialThroughThickness: GrainOrientation = { ringAngle: Math.PI / 2 };

/**
 * A 6 × 6 elastic stiffness in Voigt form (row-major, Pa): σ = C·ε with
 * σ = (σ_xx, σ_yy, σ_zz, σ_yz, σ_xz, σ_xy) and ε = (ε_xx, ε_yy, ε_zz, γ_yz, γ_xz, γ_xy),
 * γ the engineering shear strains. In a bar's axes: x along the length, y across the width,
 * z up through the thickness.
 */
export type VoigtStiffness = Float64Array;

/** Voigt index of the tensor index pair (i, j). */
const voigt = [
  [0, 5, 4],
  [5, 1, 3],
  [4, 3, 2],
];

/**
 * The compliance matrix S (6 × 6, row-major) of orthotropic constants in the material axes,
 * order (L, R, T, RT, LT, LR): S_LL = 1/E_L, S_LR = −ν_LR/E_L, S_LT = −ν_LT/E_L,
 * S_RT = −ν_RT/E_R, shear 1/G (Bodig & Jayne, Mechanics of Wood and Wood Composites (1982), ch. 3).
 */
export function orthotropicCompliance(constants: OrthotropicElasticity): Float64Array {
  const s = new Float64Array(36);
  s[0] = 1 / constants.youngLongitudinal;
  s[7] = 1 / constants.youngRadial;
  s[14] = 1 / constants.youngTangential;
  s[1] = s[6] = -constants.poissonLongitudinalRadial / constants.youngLongitudinal;
  s[2] = s[12] = -constants.poissonLongitudinalTangential / constants.youngLongitudinal;
  s[8] = s[13] = -constants.poissonRadialTangential / constants.youngRadial;
  s[21] = 1 / constants.shearRadialTangential;
  s[28] = 1 / constants.shearLongitudinalTangential;
  s[35] = 1 / constants.shearLongitudinalRadial;
  return s;
}

/**
 * Which rule of positive definiteness orthotropic constants break, or null: every modulus > 0,
 * ν_ij² < E_i/E_j for each pair, and 1 − ν_LR ν_RL − ν_RT ν_TR − ν_TL ν_LT − 2 ν_LR ν_RT ν_TL > 0
 * (the compliance's normal block has a positive determinant; Jones, Mechanics of Composite
 * Materials, 2nd ed. (1999), §2.4). Each message names the constants involved.
 */
export function orthotropicDefinitenessViolation(constants: OrthotropicElasticity): string | null {
  const { youngLongitudinal: eL, youngRadial: eR, youngTangential: eT } = constants;
  const nuLR = constants.poissonLongitudinalRadial;
  const nuLT = constants.poissonLongitudinalTangential;
  const nuRT = constants.poissonRadialTangential;
  if (nuLR * nuLR >= eL / eR) return `ν_LR² must be less than E_L/E_R = ${+(eL / eR).toPrecision(4)} (got ν_LR = ${nuLR})`;
  if (nuLT * nuLT >= eL / eT) return `ν_LT² must be less than E_L/E_T = ${+(eL / eT).toPrecision(4)} (got ν_LT = ${nuLT})`;
  if (nuRT * nuRT >= eR / eT) return `ν_RT² must be less than E_R/E_T = ${+(eR / eT).toPrecision(4)} (got ν_RT = ${nuRT})`;
  const nuRL = (nuLR * eR) / eL;
  const nuTL = (nuLT * eT) / eL;
  const nuTR = (nuRT * eT) / eR;
  const determinant = 1 - nuLR * nuRL - nuRT * nuTR - nuTL * nuLT - 2 * nuLR * nuRT * nuTL;
  if (!(determinant > 0)) return `1 − ν_LR·ν_RL − ν_RT·ν_TR − ν_TL·ν_LT − 2·ν_LR·ν_RT·ν_TL must be positive (got ${+determinant.toPrecision(4)}): the Poisson's ratios are too large together`;
  return null;
}

/** Inverse of a symmetric positive definite 6 × 6 matrix (Gauss–Jordan; throws if singular). */
export function invertSix(matrix: ArrayLike<number>): Float64Array {
  const n = 6;
  const a = Float64Array.from(matrix);
  const inverse = new Float64Array(36);
  for (let i = 0; i < n; i++) inverse[i * n + i] = 1;
  for (let column = 0; column < n; column++) {
    let pivotRow = column;
    for (let r = column + 1; r < n; r++) if (Math.abs(a[r * n + column]!) > Math.abs(a[pivotRow * n + column]!)) pivotRow = r;
    const pivot = a[pivotRow * n + column]!;
    if (!(Math.abs(pivot) > 0)) throw new Error('internal: singular 6 × 6 elastic matrix');
    if (pivotRow !== column) {
      for (let c = 0; c < n; c++) {
        [a[column * n + c], a[pivotRow * n + c]] = [a[pivotRow * n + c]!, a[column * n + c]!];
        [inverse[column * n + c], inverse[pivotRow * n + c]] = [inverse[pivotRow * n + c]!, inverse[column * n + c]!];
      }
    }
    for (let c = 0; c < n; c++) {
      a[column * n + c]! /= pivot;
      inverse[column * n + c]! /= pivot;
    }
    for (let r = 0; r < n; r++) {
      if (r === column) continue;
      const factor = a[r * n + column]!;
      if (factor === 0) continue;
      for (let c = 0; c < n; c++) {
        a[r * n + c]! -= factor * a[column * n + c]!;
        inverse[r * n + c]! -= factor * inverse[column * n + c]!;
      }
    }
  }
  return inverse;
}

/**
 * The rotation Q (3 × 3, row-major) whose columns are the material axes L, R, T in the bar's
 * axes (x along, y across, z up): L = x, R = cos α·z + sin α·y, T = cos α·y − sin α·z for the
 * ring angle α of the orientation.
 */
export function grainAxes(orientation: GrainOrientation): Float64Array {
  // Exact zeros for radial and tangential grain (cos(π/2) is 6e-17 in floating point), so their
  // stiffness is exactly orthotropic in the bar's axes.
  const snap = (value: number) => (Math.abs(value) < 1e-15 ? 0 : value);
  const c = snap(Math.cos(orientation.ringAngle));
  const s = snap(Math.sin(orientation.ringAngle));
  // Rows x, y, z; columns L, R, T.
  return Float64Array.of(1, 0, 0, 0, s, c, 0, c, -s);
}

/**
 * A Voigt stiffness rotated from material axes to the bar's: C′_pqrs = Q_pi Q_qj Q_rk Q_sl C_ijkl
 * with Q from grainAxes (the stiffness tensor C_ijkl is the Voigt entry of (ij), (kl) when
 * engineering shear strains are used; Ting, Anisotropic Elasticity (1996), ch. 2).
 */
export function rotateStiffness(materialStiffness: ArrayLike<number>, rotation: ArrayLike<number>): VoigtStiffness {
  const tensor = (i: number, j: number, k: number, l: number): number => materialStiffness[voigt[i]![j]! * 6 + voigt[k]![l]!]!;
  const result = new Float64Array(36);
  const pairs = [
    [0, 0],
    [1, 1],
    [2, 2],
    [1, 2],
    [0, 2],
    [0, 1],
  ];
  for (let row = 0; row < 6; row++) {
    const [p, q] = pairs[row]!;
    for (let column = row; column < 6; column++) {
      const [r, s] = pairs[column]!;
      let sum = 0;
      for (let i = 0; i < 3; i++) {
        const qpi = rotation[p! * 3 + i]!;
        if (qpi === 0) continue;
        for (let j = 0; j < 3; j++) {
          const qqj = rotation[q! * 3 + j]!;
          if (qqj === 0) continue;
          for (let k = 0; k < 3; k++) {
            const qrk = rotation[r! * 3 + k]!;
            if (qrk === 0) continue;
            for (let l = 0; l < 3; l++) {
              const qsl = rotation[s! * 3 + l]!;
              if (qsl === 0) continue;
              sum += qpi * qqj * qrk * qsl * tensor(i, j, k, l);
            }
          }
        }
      }
      result[row * 6 + column] = sum;
      result[column * 6 + row] = sum;
    }
  }
  return result;
}

/** The Voigt stiffness of orthotropic wood in the bar's axes for a grain orientation. */
export function orthotropicStiffness(constants: OrthotropicElasticity, orientation: GrainOrientation): VoigtStiffness {
  return rotateStiffness(invertSix(orthotropicCompliance(constants)), grainAxes(orientation));
}

/** The Voigt stiffness of an isotropic material: λ = Eν/((1+ν)(1−2ν)), μ = E/(2(1+ν)). */
export function isotropicStiffness(youngModulus: number, poisson: number): VoigtStiffness {
  const lambda = (youngModulus * poisson) / ((1 + poisson) * (1 - 2 * poisson));
  const mu = youngModulus / (2 * (1 + poisson));
  const c = new Float64Array(36);
  for (let i = 0; i < 3; i++) {
    for (let j = 0; j < 3; j++) c[i * 6 + j] = lambda + (i === j ? 2 * mu : 0);
    c[(i + 3) * 6 + i + 3] = mu;
  }
  return c;
}

/**
 * The shear moduli a beam sees in the bar's two bending planes for this grain orientation:
 * vertical (x–z plane, 1/S′_xz,xz) and lateral (x–y plane, 1/S′_xy,xy), from the rotated
 * compliance. Radial through the thickness gives G_LR and G_LT; tangential, G_LT and G_LR.
 * (An independent route to the bar file's verticalShearModulusGPa.)
 */
export function bendingPlaneShearModuli(constants: OrthotropicElasticity, orientation: GrainOrientation): { vertical: number; lateral: number } {
  const compliance = invertSix(orthotropicStiffness(constants, orientation));
  return { vertical: 1 / compliance[4 * 6 + 4]!, lateral: 1 / compliance[5 * 6 + 5]! };
}

/** True when a grain orientation keeps the bar's mid-width plane a plane of material symmetry (R and T along y and z). */
export function grainIsAligned(orientation: GrainOrientation): boolean {
  return Math.abs(Math.sin(2 * orientation.ringAngle)) < 1e-12;
}
