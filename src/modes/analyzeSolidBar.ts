import { buildMesh } from '../fe/buildMesh.ts';
import { hardwoodRatiosSource } from '../fileFormats/woodConstants.ts';
import { gigapascal as GPa, millimetre } from '../units/units.ts';
import { solidMaterialOf, type SolidMaterialChoice } from '../material/solidElasticity.ts';
import type { BarModel } from './BarModel.ts';
import type { AnalyzeOptions, BarAnalysis, ModeResult, SolidMaterialSummary } from './BarAnalysis.ts';
import { analyzeLineBarModel } from './analyzeLineBar.ts';
import { collisionWarnings, collisionWindowCents, type OtherMode } from './collisionWarnings.ts';
import { meshDensity } from './meshDensity.ts';
import { sampleShape } from './modeShape.ts';
import { solidMeshFor, solidModesOf, solveSolidPart, type SolidBar, type SolidMode, type SolidPartSolution } from './solidBarModes.ts';
import type { SolidModeKind } from './solidModeShape.ts';
import { bendingLine, solveBendingLine } from './solveBending.ts';
import { longitudinalLine, solveTorsionLine, torsionLine } from './solveTorsion.ts';

/**
 * Lanczos residual for the analysis: frequencies to about 1e-8 relative (measured: the same to
 * 1e-9 as at 1e-5 on the deep-arch bar), far below the mesh's 3e-4; two steps fewer on the
 * symmetric half (12 → 10).
 */
const analysisTolerance = 1e-4;
/** 50 cents above the highest of the first three partials: how far up the other families are listed. */
const collisionReach = 2 ** (collisionWindowCents / 1200);
const shapePoints = 61;

/** The solid model of a rectangular bar (SI): geometry, material in the bar's axes, and whether its halves solve apart. */
export function solidBarOf(model: BarModel, choice: SolidMaterialChoice = solidMaterialOf(model.material)): SolidBar {
  if (model.section.shape !== 'rect') throw new Error('internal: the solid model needs a rectangular bar');
  return {
    geometry: { length: model.length, width: model.section.width, blankThickness: model.section.thickness, profile: model.profile },
    material: choice.material,
    mirrorSymmetric: choice.mirrorSymmetric,
  };
}

/** The line model's frequencies (Hz) of one kind: Timoshenko bending (vertical, lateral), St-Venant torsion, rod. */
function lineFrequencies(model: BarModel, kind: SolidModeKind, count: number): Float64Array {
  if (count <= 0) return new Float64Array(0);
  // The line model meshes at the cord holes (their edges and centres are nodes) as its own analysis does.
  const line = kind === 'bending' || kind === 'lateral' ? bendingLine(model, kind === 'bending' ? 'vertical' : 'lateral') : kind === 'torsion' ? torsionLine(model) : longitudinalLine(model);
  const nodes = buildMesh(model.profile, meshDensity(Math.max(count, 4)), line.holes);
  if (kind === 'bending' || kind === 'lateral') return solveBendingLine(line, nodes, 'timoshenko', count, undefined, analysisTolerance).frequencies;
  return solveTorsionLine(line, nodes, count, undefined, analysisTolerance).frequencies;
}

function materialSummary(model: BarModel, choice: SolidMaterialChoice): SolidMaterialSummary {
  const round = (v: number) => +v.toPrecision(4);
  const elasticity = model.material.elasticity;
  if (choice.kind === 'isotropic' || !choice.constants) {
    const poisson = elasticity?.kind === 'isotropic' ? elasticity.poisson : model.material.youngModulus / (2 * model.material.shearModulus) - 1;
    return { model: 'isotropic', constants: { E_GPa: round(model.material.youngModulus / GPa), poisson: round(poisson) }, assumed: choice.assumed.map((f) => (f === 'poisson' ? 'poisson (0.3, the bar file default)' : f)) };
  }
  const c = choice.constants;
  const angle = elasticity?.kind === 'orthotropic' ? (elasticity.grain.ringAngle * 180) / Math.PI : 0;
  const grain = Math.abs(angle) < 1e-9 ? 'radial' : Math.abs(angle - 90) < 1e-9 ? 'tangential' : `ring angle ${round(angle)}°`;
  return {
    model: 'orthotropic',
    grain,
    constants: {
      E_GPa: round(c.youngLongitudinal / GPa),
      E_R_GPa: round(c.youngRadial / GPa),
      E_T_GPa: round(c.youngTangential / GPa),
      G_LR_GPa: round(c.shearLongitudinalRadial / GPa),
      G_LT_GPa: round(c.shearLongitudinalTangential / GPa),
      G_RT_GPa: round(c.shearRadialTangential / GPa),
      nu_LR: round(c.poissonLongitudinalRadial),
      nu_LT: round(c.poissonLongitudinalTangential),
      nu_RT: round(c.poissonRadialTangential),
    },
    assumed: [...choice.assumed],
    ...(choice.assumed.length ? { assumed_source: hardwoodRatiosSource } : {}),
  };
}

/**
 * analyzeBar for the solid theory: the bar as a 3D elastic body (solveSolidBar's pipeline) on the
 * default solid mesh. Lists the N lowest vertical bending modes and every torsion, lateral and
 * longitudinal mode up to 50 cents above the highest of partials N and 3 (at least the first
 * torsion and lateral mode found), each with its kind, ratio to the fundamental, nodal lines on
 * the top face and `line_model_cents` against the Timoshenko / St-Venant / rod line model's mode
 * of the same kind and index; warnings as the line model's. The halves are found in turn: the
 * symmetric one first, up to the line model's reach (the line model is the sharper one on
 * undercut wood), then the antisymmetric one up to the solid's own reach. Tubes and rods stay on
 * the line model, with a note saying so. Pure and synchronous.
 */
export function analyzeSolidBarModel(model: BarModel, options: AnalyzeOptions = {}): BarAnalysis {
  const modes = Math.max(1, Math.floor(options.modes ?? 4));
  if (model.section.shape !== 'rect') {
    const line = analyzeLineBarModel(model, { ...options, theory: 'timoshenko' });
    return { ...line, notes: [`the solid theory models rectangular bars; this ${model.section.shape === 'tube' ? 'tube' : 'rod'} was analysed with the Timoshenko line model`] };
  }
  const choice = solidMaterialOf(model.material);
  const bar = solidBarOf(model, choice);
  const wantedBending = Math.max(modes, 3);
  const lineBending = lineFrequencies(model, 'bending', wantedBending);
  const lineReach = lineBending[wantedBending - 1]! * collisionReach;
  const parts: SolidPartSolution[] = [];
  const countBending = (found: SolidMode[]) => found.filter((m) => m.kind === 'bending').length;
  const reachOf = (found: SolidMode[]) => {
    const bending = found.filter((m) => m.kind === 'bending');
    return Math.max(bending[modes - 1]?.hz ?? 0, bending[2]?.hz ?? 0) * collisionReach;
  };
  let found: SolidMode[];
  if (bar.mirrorSymmetric) {
    let count = wantedBending;
    let bound = lineReach * 1.02;
    let symmetric: SolidPartSolution;
    for (;;) {
      symmetric = solveSolidPart(bar, 'symmetric', solidMeshFor('symmetric', options.solidMesh), { count, upToHz: bound }, analysisTolerance);
      const modesHere = solidModesOf([symmetric]);
      const reach = reachOf(modesHere);
      if (countBending(modesHere) >= wantedBending && reach <= bound) break;
      count += 2;
      bound = Math.max(bound, reach * 1.02);
    }
    // The antisymmetric half up to the reach, and far enough for its first torsion and lateral
    // modes (listed even beyond the reach, as the line model lists them): the line model's
    // estimates with half an octave to spare, then more modes while either family is missing.
    const reach = reachOf(solidModesOf([symmetric]));
    const firstOthers = Math.max(lineFrequencies(model, 'torsion', 1)[0]!, lineFrequencies(model, 'lateral', 1)[0]!);
    let antisymmetricCount = 1;
    for (;;) {
      const antisymmetric = solveSolidPart(bar, 'antisymmetric', solidMeshFor('antisymmetric', options.solidMesh), { count: antisymmetricCount, upToHz: Math.max(reach, 1.41 * firstOthers) }, analysisTolerance);
      found = solidModesOf([symmetric, antisymmetric]);
      const has = (kind: SolidModeKind) => found.some((m) => m.kind === kind);
      if ((has('torsion') && has('lateral')) || antisymmetricCount > 12) {
        parts.push(symmetric, antisymmetric);
        break;
      }
      antisymmetricCount += 3;
    }
  } else {
    const firstOthers = Math.max(lineFrequencies(model, 'torsion', 1)[0]!, lineFrequencies(model, 'lateral', 1)[0]!);
    let count = wantedBending + 2;
    let bound = Math.max(lineReach * 1.02, 1.41 * firstOthers);
    for (;;) {
      const full = solveSolidPart(bar, 'full', solidMeshFor('full', options.solidMesh), { count, upToHz: bound }, analysisTolerance);
      found = solidModesOf([full]);
      const reach = reachOf(found);
      const complete = found.some((m) => m.kind === 'torsion') && found.some((m) => m.kind === 'lateral');
      if ((countBending(found) >= wantedBending && reach <= bound && complete) || count > wantedBending + 14) {
        parts.push(full);
        break;
      }
      count += 2;
      bound = Math.max(bound, reach * 1.02);
    }
  }
  const reach = reachOf(found);
  const bending = found.filter((m) => m.kind === 'bending').slice(0, modes);
  const fundamental = bending[0]!.hz;
  const listed = (kind: SolidModeKind) => {
    const ofKind = found.filter((m) => m.kind === kind);
    const inRange = ofKind.filter((m) => m.hz <= reach);
    return inRange.length || kind === 'longitudinal' ? inRange : ofKind.slice(0, 1);
  };
  const families: Record<SolidModeKind, SolidMode[]> = { bending, torsion: listed('torsion'), lateral: listed('lateral'), longitudinal: listed('longitudinal') };
  const results = {} as Record<SolidModeKind, ModeResult[]>;
  for (const kind of Object.keys(families) as SolidModeKind[]) {
    const list = families[kind];
    const line = kind === 'bending' ? lineBending : lineFrequencies(model, kind, list.length);
    results[kind] = list.map((m, i) => {
      const lineHz = line[i];
      const nodal = Array.from(m.nodalLines, (x) => x / millimetre);
      const result: ModeResult = { mode: m.index, hz: m.hz, ratio: m.hz / fundamental, kind, purity: m.purity, line_model_cents: lineHz === undefined ? null : 1200 * Math.log2(lineHz / m.hz), nodal_lines_mm: nodal };
      if (kind === 'bending') result.nodes_mm = nodal;
      if (options.shapes) {
        const shape = sampleShape(model.length, shapePoints, (x) => interpolate(m.slices, m.curve, x));
        result.shape = { x_mm: Array.from(shape.x, (x) => x / millimetre), displacement: Array.from(shape.value) };
      }
      return result;
    });
  }
  const others: OtherMode[] = [
    ...results.torsion.map((m) => ({ family: 'torsion' as const, mode: m.mode, hz: m.hz })),
    ...results.lateral.map((m) => ({ family: 'lateral' as const, mode: m.mode, hz: m.hz })),
    ...results.longitudinal.map((m) => ({ family: 'longitudinal' as const, mode: m.mode, hz: m.hz })),
  ];
  const warnings = collisionWarnings(results.bending.slice(0, 3).map((m) => m.hz), others);
  const first = parts[0]!.system.mesh;
  const notes: string[] = [];
  if (!bar.mirrorSymmetric) notes.push('the growth rings lie at an angle in the section, so no mode is symmetric across the width: the full body was solved and each mode is listed under the family with the largest share of its motion (purity)');
  return {
    theory: 'solid',
    bending: results.bending,
    torsion: results.torsion,
    lateral: results.lateral,
    longitudinal: results.longitudinal,
    warnings,
    mesh: {
      elements: parts.reduce((sum, p) => sum + p.system.mesh.elementCount, 0),
      element: first.element.kind === 'serendipity-20' ? '20-node serendipity' : '27-node Lagrange',
      parts: parts.map((p) => ({
        part: p.part,
        along: p.system.mesh.elementsAlong,
        across: p.system.mesh.elementsAcross,
        through_thickness: p.system.mesh.elementsThrough,
        unknowns: p.system.dofCount,
      })),
      nodes: parts.reduce((sum, p) => sum + p.system.mesh.nodeCount, 0),
      unknowns: parts.reduce((sum, p) => sum + p.system.dofCount, 0),
      solved_as: bar.mirrorSymmetric ? 'halves' : 'full body',
    },
    material: materialSummary(model, choice),
    ...(notes.length ? { notes } : {}),
  };
}

/** Linear interpolation of a curve sampled at ascending positions. */
function interpolate(x: Float64Array, y: Float64Array, at: number): number {
  if (at <= x[0]!) return y[0]!;
  for (let i = 1; i < x.length; i++) {
    if (at <= x[i]!) {
      const s = (at - x[i - 1]!) / (x[i]! - x[i - 1]! || 1);
      return y[i - 1]! + s * (y[i]! - y[i - 1]!);
    }
  }
  return y[y.length - 1]!;
}
