import type { CutLimitsInput } from '../fileFormats/cutLimitsInput.ts';
import { finishesUnderside, type Workshop, type WorkshopTool, type WorkshopToolKind } from '../fileFormats/workshopFile.ts';
import { millimetre as mm } from '../units/units.ts';
import { defaultMinThicknessFraction, defaultUncutEndFraction, resolveCutLimits, type CutBlank, type CutLimits } from './cutLimits.ts';

/**
 * The steepest wall (rise over run) each kind of tool finishes cleanly, when the file gives none:
 * barwright's own working figures, not published ones. A bar held underside-down against a drum
 * is tilted at most about 45° while it stays steady (1); on its side against a spindle the maker
 * follows the marked line at up to about 56° (1.5); a router's bit follows its template's wall
 * (2); a grinding wheel, underside-down and ground by rocking the bar, keeps to about 27° (0.5).
 */
export const kindSteepestWall: Readonly<Record<Exclude<WorkshopToolKind, 'band-saw'>, number>> = {
  drum: 1,
  spindle: 1.5,
  'router-template': 2,
  'grinding-wheel': 0.5,
};

/** The designer's limits by name (as in the JSON's `limits`). */
export type LimitName = 'min_thickness_mm' | 'uncut_end_mm' | 'max_slope' | 'tool_radius_mm';

/** What a workshop allows, in SI, each figure with the tool or rule behind it. */
export interface WorkshopRules {
  readonly name: string;
  readonly minThicknessFraction: number;
  readonly minThicknessSource: string;
  /** Steepest wall (rise over run) and the tool that finishes it. */
  readonly maxSlope: number;
  readonly maxSlopeSource: string;
  /** Smallest concave radius (m) and the tool that makes it. */
  readonly minToolRadius: number;
  readonly minToolRadiusSource: string;
  /** Cord-hole drill (m; 0: no holes) and the wood kept between a hole's edge and the arch (m). */
  readonly cordHoleDiameter: number;
  readonly cordHoleClearance: number;
  /** The shop's own uncut-end rule, a fraction of the length, when it has one. */
  readonly uncutEndFraction?: number;
}

/** A tool as a maker reads it: its label, or its kind and size. */
export function describeTool(tool: WorkshopTool): string {
  if (tool.label) return tool.label;
  switch (tool.kind) {
    case 'band-saw':
      return `band saw, ${tool.blade_width_mm} mm blade`;
    case 'drum':
      return `sanding drum, ${tool.radius_mm} mm radius`;
    case 'spindle':
      return `spindle sander, ${tool.radius_mm} mm radius`;
    case 'router-template':
      return `router with template, ${tool.radius_mm} mm bit radius`;
    case 'grinding-wheel':
      return `grinding wheel, ${tool.radius_mm} mm radius`;
  }
}

/** The steepest wall a tool finishes: its own figure, else its kind's. */
export function toolSteepestWall(tool: WorkshopTool): number {
  if (!finishesUnderside(tool.kind)) return 0;
  return tool.steepest_wall ?? kindSteepestWall[tool.kind as Exclude<WorkshopToolKind, 'band-saw'>];
}

/**
 * The limits a workshop sets. Smallest concave radius: the smallest finishing tool (a drum,
 * spindle, router bit or grinding wheel cannot follow a curve tighter than itself; the band saw
 * only roughs out). Steepest wall: the finishing tool that makes the steepest (toolSteepestWall).
 * Thinnest point: the shop's fraction of the blank (default a quarter, common practice). Uncut
 * ends: the cord holes (kept clear of the arch) or the shop's own fraction (designBar).
 */
export function workshopRules(workshop: Workshop): WorkshopRules {
  const finishing = workshop.tools.filter((tool) => finishesUnderside(tool.kind));
  if (finishing.length === 0) throw new Error('internal: a workshop without a finishing tool (parseWorkshop refuses it)');
  const smallest = finishing.reduce((best, tool) => (tool.radius_mm! < best.radius_mm! ? tool : best));
  const steepest = finishing.reduce((best, tool) => (toolSteepestWall(tool) > toolSteepestWall(best) ? tool : best));
  const fraction = workshop.min_thickness_fraction ?? defaultMinThicknessFraction;
  return {
    name: workshop.name ?? 'workshop',
    minThicknessFraction: fraction,
    minThicknessSource: workshop.min_thickness_fraction === undefined ? `barwright's rule: ${fraction} of the blank (common practice)` : `the workshop's rule: ${fraction} of the blank`,
    maxSlope: toolSteepestWall(steepest),
    maxSlopeSource: `the ${describeTool(steepest)} (walls up to ${toolSteepestWall(steepest)})`,
    minToolRadius: smallest.radius_mm! * mm,
    minToolRadiusSource: `the ${describeTool(smallest)} (${smallest.radius_mm} mm radius)`,
    cordHoleDiameter: workshop.cord_holes.diameter_mm * mm,
    cordHoleClearance: workshop.cord_holes.clearance_mm * mm,
    ...(workshop.uncut_end_fraction !== undefined ? { uncutEndFraction: workshop.uncut_end_fraction } : {}),
  };
}

/** The limits of one design and where each comes from. */
export interface DesignLimits {
  readonly limits: CutLimits;
  readonly sources: Record<LimitName, string>;
}

/** Where the uncut ends come from when nothing is given: the cord holes (m at each end), or none. */
export interface UncutFromHoles {
  readonly left: number;
  readonly right: number;
}

/**
 * The limits of a design on a blank: the workshop's (workshopRules), the uncut ends as far as the
 * cord holes need (`holes`, m from each end) or the shop's fraction (default 0.18 of the length
 * when there are no holes), each overridden by a limit given explicitly in `input` (validated by
 * resolveCutLimits, which names `source` in its errors; `givenBy` says who gave it).
 */
export function resolveDesignLimits(rules: WorkshopRules, input: CutLimitsInput | undefined, blank: CutBlank, holes: UncutFromHoles | undefined, source = 'limits', givenBy = 'given'): DesignLimits {
  const given = input ?? {};
  const fromRule = rules.uncutEndFraction !== undefined ? rules.uncutEndFraction * blank.length : holes ? 0 : defaultUncutEndFraction * blank.length;
  const left = Math.max(fromRule, holes?.left ?? 0);
  const right = Math.max(fromRule, holes?.right ?? 0);
  const base: CutLimitsInput = {
    min_thickness_mm: (rules.minThicknessFraction * blank.thickness) / mm,
    max_slope: rules.maxSlope,
    min_tool_radius_mm: rules.minToolRadius / mm,
    uncut_left_mm: left / mm,
    uncut_right_mm: right / mm,
  };
  const explicitEnds = given.uncut_end_mm !== undefined || given.uncut_left_mm !== undefined || given.uncut_right_mm !== undefined;
  const merged: CutLimitsInput = { ...base, ...given };
  if (explicitEnds) {
    // An explicit end still keeps the arch clear of the cord holes.
    const end = given.uncut_end_mm;
    merged.uncut_left_mm = Math.max(given.uncut_left_mm ?? end ?? base.uncut_left_mm!, (holes?.left ?? 0) / mm);
    merged.uncut_right_mm = Math.max(given.uncut_right_mm ?? end ?? base.uncut_right_mm!, (holes?.right ?? 0) / mm);
    delete merged.uncut_end_mm;
  }
  const limits = resolveCutLimits(merged, blank, source);
  const endSource =
    holes && (holes.left >= fromRule || holes.right >= fromRule)
      ? `the ${+(rules.cordHoleDiameter / mm).toFixed(2)} mm cord holes at the nodes, kept ${+(rules.cordHoleClearance / mm).toFixed(2)} mm clear of the arch`
      : rules.uncutEndFraction !== undefined
        ? `the workshop's rule: ${rules.uncutEndFraction} of the length`
        : `barwright's rule: ${defaultUncutEndFraction} of the length`;
  return {
    limits,
    sources: {
      min_thickness_mm: given.min_thickness_mm !== undefined ? givenBy : rules.minThicknessSource,
      uncut_end_mm: explicitEnds ? (holes ? `${givenBy}, and clear of the cord holes` : givenBy) : endSource,
      max_slope: given.max_slope !== undefined ? givenBy : rules.maxSlopeSource,
      tool_radius_mm: given.min_tool_radius_mm !== undefined ? givenBy : rules.minToolRadiusSource,
    },
  };
}
