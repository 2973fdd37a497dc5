import { readFileSync } from 'node:fs';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { checkProfile, resolveCutLimits } from '../../src/design/cutLimits.ts';
import { workshopRules } from '../../src/design/workshopLimits.ts';
import { defaultWorkshop } from '../../src/fileFormats/workshopFile.ts';
import { thicknessAt } from '../../src/section/ThicknessProfile.ts';
import type { StoredKeyboardBar } from '../../src/instrument/designKeyboardBar.ts';
import { runKeyboardTask, type KeyboardTask, type KeyboardTaskResult } from '../../src/instrument/keyboardTask.ts';
import { keyboardCutListColumns, keyboardCutListCsv } from '../../src/instrument/keyboardCutListCsv.ts';
import { keyboardBarTemplates, keyboardStationTables } from '../../src/instrument/keyboardBarTemplates.ts';
import { planKeyboard, type KeyboardPlan } from '../../src/instrument/planKeyboard.ts';
import { inThreadRunner } from '../../src/instrument/runBatch.ts';
import { createWorkerPool, type WorkerPool } from '../../src/instrument/workerPool.ts';
import { analyzeBar } from '../../src/modes/analyzeBar.ts';
import { barModelFromFile } from '../../src/modes/BarModel.ts';
import { parseKeyboardFile } from '../../src/fileFormats/keyboardFile.ts';
import { parseRfc4180 } from './rfc4180.ts';
import { storePlanInProject } from '../../src/projectDocument/storePlanInProject.ts';
import { readProjectFileText } from '../../src/projectDocument/projectFile.ts';

const file = parseKeyboardFile(JSON.parse(readFileSync(new URL('../../fixtures/demo.keyboard.json', import.meta.url), 'utf8')), 'demo.keyboard.json');
const cents = (a: number, b: number): number => 1200 * Math.log2(a / b);

let pool: WorkerPool<KeyboardTask, KeyboardTaskResult>;
let plan: KeyboardPlan;
let bars: StoredKeyboardBar[];

beforeAll(async () => {
  pool = createWorkerPool<KeyboardTask, KeyboardTaskResult>(new URL('../../src/instrument/keyboardBarWorker.ts', import.meta.url), { size: 2 });
  plan = await planKeyboard(file, { runner: pool });
  bars = plan.notes.map((n) => plan.bars[n]!);
}, 600_000);

afterAll(() => pool?.close());

describe('the demo keyboard planned end to end (52 bars, A2–C7, A4 = 442 Hz)', () => {
  it('designs every bar', () => {
    expect(plan.notes).toHaveLength(52);
    expect(plan.notes[0]).toBe('A2');
    expect(plan.notes[51]).toBe('C7');
    expect(plan.summary.complete).toBe(true);
    expect(bars.every((b) => b !== undefined)).toBe(true);
  });

  it('leaves every bar within its tolerances on an independent finer mesh, or flags it with the reason', () => {
    for (const bar of bars) {
      // Independent re-analysis: 400 elements (the plan checks on 160, the designer on its own mesh).
      const fine = analyzeBar(bar.bar, { modes: Math.max(3, bar.ratios.length), elements: 400 });
      const off = bar.ratios.map((r, k) => cents(fine.bending[k]!.hz, bar.target_hz[0]! * r));
      const within = off.every((c, k) => Math.abs(c) <= bar.tolerance_cents[k]!);
      // Both ways: a bar called in tolerance is, and a bar flagged is really off on the finer mesh.
      expect(within, `${bar.note} (${bar.status}): ${off.map((c) => c.toFixed(2)).join(' ')}`).toBe(bar.status === 'in-tolerance');
      // A flag names the partial that misses (1st, 2nd… or "the fundamental") or the limit that binds.
      if (bar.status !== 'in-tolerance') expect(bar.reason, bar.note).toMatch(/partial|fundamental|limit|slope|radius|thickness|blank/);
      // The check mesh and the finer one agree to 0.01 cent (Timoshenko O(h⁸) elements, both converged).
      bar.check.hz.forEach((hz, k) => expect(Math.abs(cents(hz, fine.bending[k]!.hz)), `${bar.note} partial ${k + 1}`).toBeLessThan(0.01));
    }
    // With the default workshop and the demo's tuning by register (common practice), every bar.
    expect(plan.summary.in_tolerance).toBe(52);
  });

  it('only ever removes material within the default workshop’s limits (the designer’s own limit check), clear of the cord holes', () => {
    const rules = workshopRules(defaultWorkshop);
    for (const bar of bars) {
      const blank = barModelFromFile({ ...bar.bar, profile_mm: undefined, holes: undefined });
      const limits = resolveCutLimits(
        { min_thickness_mm: file.limits.min_thickness_fraction! * bar.blank.thickness_mm, max_slope: rules.maxSlope, min_tool_radius_mm: rules.minToolRadius * 1000, uncut_end_mm: 0 },
        { length: blank.length, thickness: bar.blank.thickness_mm / 1000 },
      );
      const profile = barModelFromFile({ ...bar.bar, holes: undefined }).profile;
      expect(checkProfile(profile, blank.profile, limits), bar.note).toEqual([]);
      expect(bar.thinnest_mm).toBeGreaterThanOrEqual(bar.blank.thickness_mm / 4 - 1e-6);
      // The default workshop's 6 mm holes, with 3 mm of uncut wood between each and the arch.
      expect(bar.bar.holes, bar.note).toHaveLength(2);
      for (const hole of bar.bar.holes!) {
        expect(hole.diameter_mm).toBe(6);
        for (let x = hole.x_mm - 6; x <= hole.x_mm + 6; x += 0.5) expect(1e3 * thicknessAt(profile, x * 1e-3), `${bar.note} at ${x} mm`).toBeCloseTo(bar.blank.thickness_mm, 9);
      }
    }
  });

  it('schedules blanks that shorten up the keyboard in whole millimetres, flagging notes outside their window', () => {
    plan.schedule.forEach((blank, i) => {
      expect(Number.isInteger(blank.length_mm), blank.note).toBe(true);
      if (i > 0) expect(blank.length_mm, blank.note).toBeLessThanOrEqual(plan.schedule[i - 1]!.length_mm);
      if (!blank.inside) expect(blank.reason, blank.note).toBeTruthy();
      // The plan keeps its blank unless it could not reach the targets, and then says so.
      const planned = plan.bars[blank.note]!;
      if (planned.blank.length_mm !== blank.length_mm) expect(planned.reason, blank.note).toMatch(/the plan changed the blank/);
    });
  });

  it('puts the cord holes at the planned bar’s mode-1 nodes, and drills them there within 0.5 mm', () => {
    for (const bar of bars) {
      const nodes = analyzeBar(bar.bar, { modes: 1 }).bending[0]!.nodes_mm!;
      bar.bar.holes!.forEach((hole, i) => expect(Math.abs(hole.x_mm - nodes[i === 0 ? 0 : nodes.length - 1]!), `${bar.note} hole ${i + 1}`).toBeLessThan(0.5));
      // Default mesh against the check mesh: nodes agree to 0.05 mm.
      expect(Math.abs(bar.cord_holes_mm[0] - nodes[0]!), bar.note).toBeLessThan(0.05);
      expect(Math.abs(bar.cord_holes_mm[1] - nodes[1]!), bar.note).toBeLessThan(0.05);
      // On a symmetric arch they are symmetric, and inside the bar's outer quarters (Blevins 0.2242 L uncut).
      expect(bar.cord_holes_mm[0] + bar.cord_holes_mm[1]).toBeCloseTo(bar.blank.length_mm, 1);
      expect(bar.cord_holes_mm[0] / bar.blank.length_mm).toBeGreaterThan(0.15);
      expect(bar.cord_holes_mm[0] / bar.blank.length_mm).toBeLessThan(0.2242 + 0.003);
    }
  });

  it('sizes each resonator as the closed-tube formula at 22 °C says', () => {
    for (const bar of bars) {
      // c = 331.3 √(1 + T/273.15) (brief §2), L = c/(4f) − 0.6133 r (Levine & Schwinger 1948, unflanged).
      const c = 331.3 * Math.sqrt(1 + 22 / 273.15);
      const radius = bar.resonator!.inner_diameter_mm / 2000;
      const expected = (c / (4 * bar.target_hz[0]!) - 0.6133 * radius) * 1000;
      expect(bar.resonator!.length_mm).toBeCloseTo(expected, 6);
    }
  });

  it('writes a cut list that parses as RFC 4180 and round-trips every bar', () => {
    const csv = keyboardCutListCsv(bars);
    expect(csv.endsWith('\r\n')).toBe(true);
    const records = parseRfc4180(csv);
    expect(records[0]).toEqual([...keyboardCutListColumns]);
    expect(records).toHaveLength(53);
    const col = (name: (typeof keyboardCutListColumns)[number]) => keyboardCutListColumns.indexOf(name);
    const near = (text: string, value: number | undefined, half: number) => {
      if (value === undefined) return expect(text).toBe('');
      expect(Math.abs(Number(text) - value)).toBeLessThanOrEqual(half + 1e-9);
    };
    records.slice(1).forEach((record, i) => {
      const bar = bars[i]!;
      expect(record[col('note')]).toBe(bar.note);
      expect(Number(record[col('midi')])).toBe(bar.midi);
      near(record[col('target_hz')]!, bar.target_hz[0], 0.005);
      near(record[col('blank_length_mm')]!, bar.blank.length_mm, 0.05);
      near(record[col('blank_width_mm')]!, bar.blank.width_mm, 0.05);
      near(record[col('blank_thickness_mm')]!, bar.blank.thickness_mm, 0.05);
      near(record[col('centre_thickness_mm')]!, bar.centre_thickness_mm, 0.05);
      near(record[col('arch_extent_mm')]!, bar.arch?.extent_mm, 0.05);
      near(record[col('cord_hole_1_mm')]!, bar.cord_holes_mm[0], 0.05);
      near(record[col('cord_hole_2_mm')]!, bar.cord_holes_mm[1], 0.05);
      near(record[col('resonator_length_mm')]!, bar.resonator?.length_mm, 0.05);
      expect(record[col('ratios')]).toBe(bar.ratios.join(':'));
      expect(record[col('status')]).toBe(bar.status);
      expect(record[col('reason')]).toBe(bar.reason ?? '');
    });
  });

  it('draws one 1:1 SVG template per bar and writes its station table', () => {
    const templates = keyboardBarTemplates(bars);
    const tables = keyboardStationTables(bars);
    expect(templates).toHaveLength(52);
    for (const [i, template] of templates.entries()) {
      const bar = bars[i]!;
      expect(template.file).toBe(`${String(i + 1).padStart(2, '0')}-${bar.note.replace('#', 's')}.svg`);
      // 1:1: the drawing's width is the bar plus the template's 10 mm margins, in millimetres.
      expect(template.svg).toContain(`width="${+(bar.blank.length_mm + 20).toFixed(3)}mm"`);
      // The size the template reports (for print layouts) is the one it draws at.
      expect(template.note).toBe(bar.note);
      expect(template.svg).toContain(`width="${+template.width_mm.toFixed(3)}mm" height="${+template.height_mm.toFixed(3)}mm"`);
      // The holes drawn to size where they are drilled, and marked in the station table.
      for (const hole of bar.bar.holes!) expect(template.svg).toContain(`cord hole ${hole.diameter_mm} mm at ${hole.x_mm}`);
      expect(template.svg).not.toMatch(/NaN|Infinity/);
      const rows = parseRfc4180(tables[i]!.csv);
      expect(rows[0]).toEqual(['from_left_mm', 'from_centre_mm', 'thickness_mm', 'depth_mm', 'mark']);
      expect(rows.filter((r) => r[4] === 'cord hole 6 mm').map((r) => Number(r[0]))).toEqual(bar.bar.holes!.map((h) => h.x_mm));
      // The thinnest station in the table is the planned thinnest point, to the table's 5 mm spacing.
      const thinnest = Math.min(...rows.slice(1).map((r) => Number(r[2])));
      expect(thinnest).toBeGreaterThanOrEqual(bar.thinnest_mm - 0.005);
    }
  });
});

describe('storing the plan in a project', () => {
  it('gives each keyboard bar of the demo project its planned undercut and lists the bars it lacks', () => {
    const project = readProjectFileText(readFileSync(new URL('../../fixtures/demo.project.json', import.meta.url), 'utf8'), 'demo.project.json');
    const { project: updated, stored, missing } = storePlanInProject(project, plan, '2026-01-01T00:00:00Z');
    const keyboardNotes = project.bars.filter((b) => b.register !== 'chimes').map((b) => b.note);
    expect(stored).toEqual(keyboardNotes);
    expect(missing).toHaveLength(52 - keyboardNotes.length);
    const a2 = updated.bars.find((b) => b.note === 'A2')!;
    expect(a2.design!.bar.profile_mm).toEqual(plan.bars.A2!.bar.profile_mm);
    expect(a2.design!.predicted_hz).toEqual(plan.bars.A2!.check.hz);
    // The chime bars are left alone.
    expect(updated.bars.filter((b) => b.register === 'chimes')).toEqual(project.bars.filter((b) => b.register === 'chimes'));
  });
});

describe('batch control', () => {
  it('resumes: only bars missing or with changed inputs are designed again', async () => {
    const kept: Record<string, StoredKeyboardBar> = { ...plan.bars };
    delete kept.C4;
    delete kept.G5;
    const changed = { ...kept.A3!, fingerprint: 'stale' };
    kept.A3 = changed;
    const ran: string[] = [];
    const counting = inThreadRunner((task: KeyboardTask) => (task.kind === 'design' && ran.push(task.job.key), runKeyboardTask(task)));
    const resumed = await planKeyboard(file, { runner: counting, previous: { bars: kept, advice: plan.advice } });
    expect(ran.sort()).toEqual(['A3', 'C4', 'G5']);
    expect(resumed.summary.complete).toBe(true);
    expect(resumed.bars.E4).toEqual(plan.bars.E4);
    // The same inputs give the same design, in a worker thread or in this one.
    expect(resumed.bars.C4!.check.hz).toEqual(plan.bars.C4!.check.hz);
  }, 120_000);

  it('cancels cleanly and reports the plan as incomplete', async () => {
    const controller = new AbortController();
    const partial = await planKeyboard(file, {
      runner: pool,
      signal: controller.signal,
      previous: { advice: plan.advice, bars: Object.fromEntries(Object.entries(plan.bars).slice(0, 40)) },
      onProgress: (p) => p.stage === 'design' && p.done >= 42 && controller.abort(),
    });
    expect(partial.summary.complete).toBe(false);
    expect(partial.summary.designed).toBeGreaterThanOrEqual(42);
    expect(partial.summary.designed).toBeLessThan(52);
  }, 120_000);
});
