// The workshop description (`*.workshop.json`, format "barwright.workshop", version 1, and the
// `workshop` section of keyboard and project files): the tools a maker cuts undercuts with and
// the shop's own rules. The designer's limits follow from it (src/design/workshopLimits.ts).
import { InputError } from './InputError.ts';
import { isJsonObject as isObject, type JsonObject as Json } from './jsonFields.ts';

/**
 * What a tool is. Band saw: roughs the arch out with the bar on its side (its kerf is finished
 * with another tool). Drum: a sanding drum on a drill press or arbor, the bar held underside-down
 * against it. Spindle: an oscillating spindle sander's sleeve, the bar on its side. Router with
 * template: a pattern bit following a template fastened to the bar on its side. Grinding wheel:
 * a bench grinder's wheel, the bar underside-down.
 */
export type WorkshopToolKind = 'band-saw' | 'drum' | 'spindle' | 'router-template' | 'grinding-wheel';

/** The tool kinds, in the order a file lists them. */
export const workshopToolKinds: readonly WorkshopToolKind[] = ['band-saw', 'drum', 'spindle', 'router-template', 'grinding-wheel'];

/** One tool of the workshop (mm). */
export interface WorkshopTool {
  kind: WorkshopToolKind;
  /** What the maker calls it ("25 mm sleeve"). */
  label?: string;
  /** Radius of the cutting surface (drum, spindle sleeve, grinding wheel, router bit), mm. */
  radius_mm?: number;
  /** Blade width of a band saw, mm. */
  blade_width_mm?: number;
  /** Steepest wall this tool finishes, rise over run, when the kind's usual one does not fit. */
  steepest_wall?: number;
}

/** Cord holes: the drill, and how far the arch must stay from a hole's edge (mm). */
export interface WorkshopCordHoles {
  /** Drill diameter, mm; 0 for bars hung without holes. */
  diameter_mm: number;
  /** Wood left uncut between a hole's edge and the arch, mm. */
  clearance_mm: number;
}

/** A workshop: its tools and its rules (every rule optional: barwright's defaults otherwise). */
export interface Workshop {
  name?: string;
  tools: WorkshopTool[];
  cord_holes: WorkshopCordHoles;
  /** Thinnest point under the arch as a fraction of the blank's thickness (default 0.25). */
  min_thickness_fraction?: number;
  /** Uncut length at each end as a fraction of the bar's length; absent: as far as the cord holes need. */
  uncut_end_fraction?: number;
}

/** A workshop file: a workshop with its format and version. */
export interface WorkshopFile extends Workshop {
  format: 'barwright.workshop';
  version: 1;
}

/** The `format` of a workshop file. */
export const workshopFileFormat = 'barwright.workshop';

/**
 * barwright's default workshop: a typical small shop (common practice; an invented example, no
 * real shop) — a band saw to rough the arch out, an oscillating spindle sander with a 25 mm
 * sleeve and a 50 mm drum on the drill press to finish it, a 6 mm drill for the cord holes kept
 * 3 mm clear of the arch, and the thinnest point a quarter of the blank (common practice: a
 * quarter to a third under a low marimba-type bar). Chosen so that marimba-type and
 * xylophone-type keyboards of the usual sizes plan cleanly (test/instrument/keyboardPlans.test.ts).
 */
export const defaultWorkshop: Workshop = {
  name: 'a typical small shop (barwright default)',
  tools: [
    { kind: 'band-saw', label: 'band saw, 6 mm blade', blade_width_mm: 6 },
    { kind: 'spindle', label: 'oscillating spindle sander, 25 mm sleeve', radius_mm: 12.5 },
    { kind: 'drum', label: 'sanding drum on the drill press, 50 mm', radius_mm: 25 },
  ],
  cord_holes: { diameter_mm: 6, clearance_mm: 3 },
  min_thickness_fraction: 0.25,
};

function numberIn(source: string, field: string, value: unknown, rule: (n: number) => string | null): number {
  if (typeof value !== 'number' || !Number.isFinite(value)) throw new InputError(source, field, `must be a number (got ${JSON.stringify(value)})`);
  const problem = rule(value);
  if (problem) throw new InputError(source, field, problem);
  return value;
}

function refuseUnknown(source: string, prefix: string, value: Json, known: readonly string[], what: string): void {
  for (const key of Object.keys(value)) if (!known.includes(key)) throw new InputError(source, `${prefix}${key}`, `is not a ${what} field (known: ${known.join(', ')})`);
}

/** Kinds that finish the underside (every kind but the band saw). */
export function finishesUnderside(kind: WorkshopToolKind): boolean {
  return kind !== 'band-saw';
}

function parseTool(source: string, field: string, value: unknown): WorkshopTool {
  if (!isObject(value)) throw new InputError(source, field, 'must be an object such as { "kind": "spindle", "radius_mm": 12.5 }');
  const kind = value.kind;
  if (typeof kind !== 'string' || !(workshopToolKinds as readonly string[]).includes(kind)) throw new InputError(source, `${field}.kind`, `must be one of ${workshopToolKinds.join(', ')} (got ${JSON.stringify(kind)})`);
  const tool: WorkshopTool = { kind: kind as WorkshopToolKind };
  if (kind === 'band-saw') {
    refuseUnknown(source, `${field}.`, value, ['kind', 'label', 'blade_width_mm'], 'band saw');
    tool.blade_width_mm = numberIn(source, `${field}.blade_width_mm`, value.blade_width_mm, (n) => (n > 0 && n <= 50 ? null : `must be more than 0 and at most 50 mm (got ${n})`));
  } else {
    refuseUnknown(source, `${field}.`, value, ['kind', 'label', 'radius_mm', 'steepest_wall'], kind);
    tool.radius_mm = numberIn(source, `${field}.radius_mm`, value.radius_mm, (n) => (n > 0 && n <= 500 ? null : `must be more than 0 and at most 500 mm (got ${n})`));
    if (value.steepest_wall !== undefined) tool.steepest_wall = numberIn(source, `${field}.steepest_wall`, value.steepest_wall, (n) => (n > 0 && n <= 10 ? null : `must be more than 0 and at most 10 (rise over run; got ${n})`));
  }
  if (value.label !== undefined) {
    if (typeof value.label !== 'string' || value.label.length > 200) throw new InputError(source, `${field}.label`, 'must be a name of at most 200 characters');
    tool.label = value.label;
  }
  return tool;
}

/**
 * Validates a workshop (the body of a workshop file, or a file's `workshop` section named by
 * `prefix`, e.g. "workshop."). Throws InputError(source, field, rule) on the first problem.
 * Unknown fields are refused so a misspelt one is not silently ignored.
 */
export function parseWorkshop(value: unknown, source = 'workshop', prefix = '', extraFields: readonly string[] = []): Workshop {
  if (!isObject(value)) throw new InputError(source, prefix ? prefix.replace(/\.$/, '') : 'workshop', 'must be an object with tools and cord_holes');
  refuseUnknown(source, prefix, value, ['name', 'tools', 'cord_holes', 'min_thickness_fraction', 'uncut_end_fraction', ...extraFields], 'workshop');
  if (value.name !== undefined && (typeof value.name !== 'string' || value.name.length > 200)) throw new InputError(source, `${prefix}name`, 'must be a name of at most 200 characters');
  if (!Array.isArray(value.tools) || value.tools.length === 0) throw new InputError(source, `${prefix}tools`, 'must list the tools, e.g. [{ "kind": "spindle", "radius_mm": 12.5 }]');
  const tools = value.tools.map((tool: unknown, i: number) => parseTool(source, `${prefix}tools[${i}]`, tool));
  if (!tools.some((tool) => finishesUnderside(tool.kind)))
    throw new InputError(source, `${prefix}tools`, 'needs a tool that finishes the underside: a drum, spindle, router-template or grinding-wheel (a band saw only roughs the arch out)');
  if (!isObject(value.cord_holes)) throw new InputError(source, `${prefix}cord_holes`, 'must be an object { "diameter_mm": 6, "clearance_mm": 3 } (diameter 0 for bars hung without holes)');
  refuseUnknown(source, `${prefix}cord_holes.`, value.cord_holes, ['diameter_mm', 'clearance_mm'], 'cord-hole');
  const cordHoles: WorkshopCordHoles = {
    diameter_mm: numberIn(source, `${prefix}cord_holes.diameter_mm`, value.cord_holes.diameter_mm, (n) => (n >= 0 && n <= 20 ? null : `must be from 0 to 20 mm (got ${n})`)),
    clearance_mm: numberIn(source, `${prefix}cord_holes.clearance_mm`, value.cord_holes.clearance_mm, (n) => (n >= 0 && n <= 30 ? null : `must be from 0 to 30 mm (got ${n})`)),
  };
  const workshop: Workshop = { tools, cord_holes: cordHoles };
  if (typeof value.name === 'string') workshop.name = value.name;
  if (value.min_thickness_fraction !== undefined)
    workshop.min_thickness_fraction = numberIn(source, `${prefix}min_thickness_fraction`, value.min_thickness_fraction, (n) => (n > 0 && n < 1 ? null : `must lie between 0 and 1 (got ${n})`));
  if (value.uncut_end_fraction !== undefined)
    workshop.uncut_end_fraction = numberIn(source, `${prefix}uncut_end_fraction`, value.uncut_end_fraction, (n) => (n >= 0 && n < 0.45 ? null : `must be from 0 to under 0.45 of the length (got ${n})`));
  return workshop;
}

/** Validates a workshop file (format "barwright.workshop", version 1). */
export function parseWorkshopFile(value: unknown, source = 'workshop'): WorkshopFile {
  if (!isObject(value)) throw new InputError(source, 'workshop', 'must be a JSON object');
  if (value.format !== workshopFileFormat) throw new InputError(source, 'format', `must be "${workshopFileFormat}" (got ${JSON.stringify(value.format)})`);
  if (value.version !== 1) throw new InputError(source, 'version', `must be 1 (got ${JSON.stringify(value.version)})`);
  return { format: workshopFileFormat, version: 1, ...parseWorkshop(value, source, '', ['format', 'version']) };
}
