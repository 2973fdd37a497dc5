// The project's workshop section: kept and checked by the workshop file's own rules, carried into
// the keyboard file the workbench plans from and into every single-bar design, and exported as a
// workshop file the CLI reads. The expected limits are the tools' own sizes (the inputs), not
// figures taken from the code under test.
import { readFileSync } from 'node:fs';
import { resolve } from 'node:path';
import { describe, expect, it } from 'vitest';
import {
  checkProjectFile,
  defaultWorkshop,
  designBar,
  keyboardFileFromProject,
  newWorkshopTool,
  parseProjectFile,
  parseWorkshopFile,
  projectWorkshop,
  serializeProjectFile,
  setProjectWorkshop,
  withWorkshopTool,
  withoutWorkshopTool,
  workshopFileFromProject,
  workshopLimitLines,
  type ProjectFile,
  type Workshop,
} from '../../src/index.ts';
import { thrown } from './thrownInputError.ts';

const demoText = readFileSync(resolve(import.meta.dirname, '../../fixtures/demo.project.json'), 'utf8');
const demo = (): ProjectFile => parseProjectFile(JSON.parse(demoText), 'demo');

/** An invented shop: a 40 mm drum only (walls up to 1) and 8 mm cord holes. */
const bigDrumShop: Workshop = { name: 'big drum shop', tools: [{ kind: 'drum', radius_mm: 40 }], cord_holes: { diameter_mm: 8, clearance_mm: 4 } };


describe('the project workshop section', () => {
  it('is barwright’s default workshop when the file has none, and the demo has none', () => {
    const project = demo();
    expect(project.workshop).toBeUndefined();
    expect(projectWorkshop(project)).toEqual(defaultWorkshop);
  });

  it('is kept through a save and load, and null returns to the default', () => {
    const project = setProjectWorkshop(demo(), bigDrumShop);
    const reloaded = parseProjectFile(JSON.parse(serializeProjectFile(project)), 'reloaded');
    expect(reloaded.workshop).toEqual(bigDrumShop);
    const reset = setProjectWorkshop(reloaded, null);
    expect(reset.workshop).toBeUndefined();
    expect(projectWorkshop(reset)).toEqual(defaultWorkshop);
  });

  it('refuses a bad tool with the field and the rule, and leaves the project as it was', () => {
    const project = demo();
    const error = thrown(() => setProjectWorkshop(project, withWorkshopTool(defaultWorkshop, 1, { kind: 'spindle', radius_mm: 0 })));
    expect(error.field).toBe('workshop.tools[1].radius_mm');
    expect(error.rule).toMatch(/more than 0/);
    expect(project.workshop).toBeUndefined();
  });

  it('refuses to remove the last tool that finishes the underside', () => {
    const sawOnly = withoutWorkshopTool(withoutWorkshopTool(defaultWorkshop, 2), 1);
    const error = thrown(() => setProjectWorkshop(demo(), sawOnly));
    expect(error.field).toBe('workshop.tools');
    expect(error.rule).toMatch(/finishes the underside/);
  });

  it('an imported project with a bad workshop section is refused naming the path', () => {
    const raw = { ...JSON.parse(demoText), workshop: { tools: [{ kind: 'drum', radius_mm: -3 }], cord_holes: { diameter_mm: 6, clearance_mm: 3 } } };
    const check = checkProjectFile(raw, 'import');
    expect(check.ok).toBe(false);
    if (check.ok) return;
    expect(check.errors.map((error) => error.field)).toContain('workshop.tools[0].radius_mm');
  });

  it('each limit names the tool that sets it, with that tool’s size', () => {
    const lines = workshopLimitLines({ ...bigDrumShop, tools: [...bigDrumShop.tools, { kind: 'spindle', radius_mm: 6, label: 'small sleeve' }] });
    const radius = lines.find((line) => line.key === 'tool_radius_mm')!;
    expect(radius.value).toBe('6 mm');
    expect(radius.setBy).toContain('small sleeve');
    const holes = lines.find((line) => line.key === 'cord_holes')!;
    expect(holes.value).toContain('8 mm');
  });

  it('new tools come with a size, and every kind is valid as added', () => {
    for (const kind of ['band-saw', 'drum', 'spindle', 'router-template', 'grinding-wheel'] as const) {
      const workshop = { ...defaultWorkshop, tools: [...defaultWorkshop.tools, newWorkshopTool(kind)] };
      expect(setProjectWorkshop(demo(), workshop).workshop!.tools.at(-1)!.kind).toBe(kind);
    }
  });

  it('goes into the keyboard file the workbench plans from', () => {
    const project = setProjectWorkshop(demo(), bigDrumShop);
    const file = keyboardFileFromProject(project, { lowest: project.instrument.lowest_note, highest: project.instrument.lowest_note });
    expect(file.workshop).toEqual(bigDrumShop);
    expect(keyboardFileFromProject(demo(), { lowest: project.instrument.lowest_note, highest: project.instrument.lowest_note }).workshop).toBeUndefined();
  });

  it('exports as a workshop file the CLI’s parser reads back unchanged', () => {
    const project = setProjectWorkshop(demo(), bigDrumShop);
    const file = parseWorkshopFile(JSON.parse(JSON.stringify(workshopFileFromProject(project))), 'exported.workshop.json');
    const { format: _format, version: _version, ...workshop } = file;
    expect(workshop).toEqual(bigDrumShop);
  });

  it('sets the limits of a design made for the project', () => {
    // The designer takes the smallest concave radius from the smallest finishing tool (40 mm
    // here, the input) and drills the workshop's 8 mm holes.
    const project = setProjectWorkshop(demo(), bigDrumShop);
    const bar = project.bars.find((entry) => entry.blank.section.shape === 'rect')!;
    const register = project.instrument.registers.find((entry) => entry.id === bar.register)!;
    const result = designBar(bar.blank, { target: { note: bar.note, a4: project.instrument.a4_hz, ratios: register.ratios.slice(0, 1), tolerance_cents: register.tolerance_cents.slice(0, 1) }, workshop: projectWorkshop(project) });
    expect(result.limits.min_tool_radius_mm).toBe(40);
    expect(result.limit_sources.tool_radius_mm).toContain('40 mm');
    expect(result.bar.holes?.length).toBe(2);
    expect(result.bar.holes?.every((hole) => hole.diameter_mm === 8)).toBe(true);
  });
});
