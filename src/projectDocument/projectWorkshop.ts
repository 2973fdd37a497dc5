// The project's workshop: the tools its bars are cut with and the shop's rules, kept as the
// project file's `workshop` section (the same shape as a keyboard file's section and a workshop
// file's body). Pure edits, the limits each tool sets as a maker reads them, and the section as a
// workshop file of its own (`*.workshop.json`, what `barwright plan --workshop` reads).
import { defaultWorkshop, parseWorkshop, workshopFileFormat, type Workshop, type WorkshopFile, type WorkshopTool, type WorkshopToolKind } from '../fileFormats/workshopFile.ts';
import { InputError } from '../fileFormats/InputError.ts';
import { defaultMinThicknessFraction, defaultUncutEndFraction, workshopRules } from '../design/index.ts';
import { millimetre as mm } from '../units/units.ts';
import type { ProjectFile } from './projectFileTypes.ts';

/** The workshop a project's bars are planned for: its own, or barwright's default. */
export function projectWorkshop(project: ProjectFile): Workshop {
  return project.workshop ?? defaultWorkshop;
}

/**
 * The project with `workshop` as its workshop, checked by the workshop file's rules (InputError
 * naming `workshop.<field>` and the rule); `null` returns to barwright's default workshop.
 */
export function setProjectWorkshop(project: ProjectFile, workshop: Workshop | null): ProjectFile {
  const next = { ...project };
  if (workshop === null) {
    delete next.workshop;
    return next;
  }
  next.workshop = parseWorkshop(structuredClone(workshop), 'workshop', 'workshop.');
  return next;
}

/** A tool of a kind, at the size a small shop usually has (for "add a tool"; the maker edits it). */
export function newWorkshopTool(kind: WorkshopToolKind): WorkshopTool {
  switch (kind) {
    case 'band-saw':
      return { kind, blade_width_mm: 6 };
    case 'drum':
      return { kind, radius_mm: 25 };
    case 'spindle':
      return { kind, radius_mm: 12.5 };
    case 'router-template':
      return { kind, radius_mm: 6.35 };
    case 'grinding-wheel':
      return { kind, radius_mm: 75 };
  }
}

/** Replaces tool `index` of a workshop (a copy). */
export function withWorkshopTool(workshop: Workshop, index: number, tool: WorkshopTool): Workshop {
  if (index < 0 || index >= workshop.tools.length) throw new InputError('workshop', `workshop.tools[${index}]`, `there is no tool ${index + 1} (the workshop has ${workshop.tools.length})`);
  return { ...workshop, tools: workshop.tools.map((old, i) => (i === index ? tool : old)) };
}

/** Removes tool `index` of a workshop (a copy); the last finishing tool cannot go (parseWorkshop says why). */
export function withoutWorkshopTool(workshop: Workshop, index: number): Workshop {
  return { ...workshop, tools: workshop.tools.filter((_, i) => i !== index) };
}

/** One limit a workshop sets, as a maker reads it: the value and what sets it. */
export interface WorkshopLimitLine {
  /** The limit's name in the design JSON's `limits` (or `cord_holes`). */
  readonly key: 'tool_radius_mm' | 'max_slope' | 'min_thickness' | 'uncut_end' | 'cord_holes';
  readonly label: string;
  readonly value: string;
  readonly setBy: string;
}

function figure(value: number, digits = 1): string {
  return Number(value.toFixed(digits)).toString();
}

/**
 * The designer's limits a workshop sets (workshopRules), each with the tool or rule behind it:
 * the smallest concave radius (the smallest finishing tool), the steepest wall (the finishing
 * tool that makes the steepest), the thinnest point (a fraction of the blank), the uncut ends
 * (the shop's fraction, or as far as the cord holes and their clearance need) and the cord holes.
 * Limits given to one design or plan explicitly still override these.
 */
export function workshopLimitLines(workshop: Workshop): WorkshopLimitLine[] {
  const rules = workshopRules(workshop);
  const holes = rules.cordHoleDiameter > 0;
  return [
    { key: 'tool_radius_mm', label: 'Smallest concave radius', value: `${figure(rules.minToolRadius / mm)} mm`, setBy: rules.minToolRadiusSource },
    { key: 'max_slope', label: 'Steepest wall', value: `${figure(rules.maxSlope, 2)} rise per run (${figure((Math.atan(rules.maxSlope) * 180) / Math.PI, 0)}°)`, setBy: rules.maxSlopeSource },
    {
      key: 'min_thickness',
      label: 'Thinnest point',
      value: `${figure(rules.minThicknessFraction * 100, 0)} % of the blank's thickness`,
      setBy: workshop.min_thickness_fraction === undefined ? `barwright's rule (${figure(defaultMinThicknessFraction * 100, 0)} %, common practice)` : "the workshop's rule",
    },
    {
      key: 'uncut_end',
      label: 'Uncut ends',
      value:
        rules.uncutEndFraction !== undefined
          ? `${figure(rules.uncutEndFraction * 100, 1)} % of the length at each end`
          : holes
            ? 'as far as the cord holes need'
            : `${figure(defaultUncutEndFraction * 100, 0)} % of the length at each end`,
      setBy: rules.uncutEndFraction !== undefined ? "the workshop's rule" : holes ? `the ${figure(rules.cordHoleDiameter / mm)} mm drill and ${figure(rules.cordHoleClearance / mm)} mm of wood kept clear of the arch` : "barwright's rule for bars without holes",
    },
    {
      key: 'cord_holes',
      label: 'Cord holes',
      value: holes ? `${figure(rules.cordHoleDiameter / mm)} mm, drilled at the fundamental's nodes` : 'none (bars hung without holes)',
      setBy: 'the drill',
    },
  ];
}

/** The project's workshop as a workshop file of its own (what `barwright plan --workshop FILE` reads). */
export function workshopFileFromProject(project: ProjectFile): WorkshopFile {
  return { format: workshopFileFormat, version: 1, ...structuredClone(projectWorkshop(project)) };
}
