import { readFileSync } from 'node:fs';
import { parseBarFile } from '../../../src/fileFormats/barFile.ts';
import { parseSessionFile } from '../../../src/fileFormats/sessionFile.ts';
import { calibrateSession } from '../../../src/session/calibrateSession.ts';
import { characterizeBlank } from '../../../src/session/characterizeBlank.ts';
import { nextCut } from '../../../src/session/nextCut.ts';
import { nextCutSolid } from '../../../src/session/nextCutSolid.ts';
import { analyzeBarModel } from '../../../src/modes/analyzeBar.ts';
import { barModelFromFile } from '../../../src/modes/BarModel.ts';
import { solidBendingPartials } from '../../../src/modes/solidBendingPartials.ts';
import { measure, type BenchRow, type BenchSuite } from '../measure.ts';

/**
 * Tune-and-trim sessions: calibrating and planning the next cut of the demo session
 * (fixtures/f3-workshop.session.json, three steps), and characterising a blank from three
 * partials (with the dimension and mass re-inversions). What the workbench's worker waits for
 * after each measurement.
 */
export const sessionSuite: BenchSuite = {
  name: 'session',
  async run() {
    const rows: BenchRow[] = [];
    const raw = JSON.parse(readFileSync(new URL('../../../fixtures/f3-workshop.session.json', import.meta.url), 'utf8'));
    const log = parseSessionFile(raw);
    let flags = 0;
    const calibration = await measure(() => (flags = calibrateSession(log).flags.length), { warmup: 2, minRuns: 5 });
    rows.push({ suite: 'session', case: `calibrateSession, demo F3, ${log.steps.length} steps`, ...calibration, detail: { flags } });
    let status = '';
    const planning = await measure(() => (status = nextCut(raw).status), { warmup: 2, minRuns: 5 });
    rows.push({ suite: 'session', case: `nextCut, demo F3, ${log.steps.length} steps`, ...planning, detail: { status } });
    // The same step on the solid model (the wood fitted in 3D, the arch's correction from it): its cost as a ratio of nextCut's.
    let solves = 0;
    const solid = await measure(() => (solves = nextCutSolid(raw).solid?.solid_solves ?? 0), { warmup: 1, minRuns: 3 });
    rows.push({ suite: 'session', case: `nextCutSolid, demo F3, ${log.steps.length} steps`, ...solid, detail: { solid_solves: solves, ratio_to_nextCut: +(solid.median_ms / planning.median_ms).toFixed(1) } });
    // The bending partials alone on the solid model (what the wood's fit solves), against the full solid analysis (every family).
    const bar = barModelFromFile(log.steps[log.steps.length - 1]!.bar);
    const full = await measure(() => analyzeBarModel(bar, { theory: 'solid', modes: 3 }), { warmup: 1, minRuns: 3 });
    rows.push({ suite: 'session', case: 'analyzeBar solid, F3 bar now (all families)', ...full });
    const bending = await measure(() => solidBendingPartials(bar, 3), { warmup: 1, minRuns: 3 });
    rows.push({ suite: 'session', case: 'solidBendingPartials, F3 bar now (bending only)', ...bending, detail: { ratio_to_full: +(bending.median_ms / full.median_ms).toFixed(2) } });
    const blank = parseBarFile({ length_mm: 440, section: { shape: 'rect', width_mm: 58, thickness_mm: 24 }, material: { E_GPa: 17.2, G_GPa: 1.25, density_kg_m3: 985 } });
    const characterize = await measure(() => characterizeBlank({ bar: blank, measuredHz: [543.81, 1382.81, 2447.44], massGrams: 603 }), { warmup: 2, minRuns: 5 });
    rows.push({ suite: 'session', case: 'characterizeBlank, 3 partials + mass', ...characterize });
    return rows;
  },
};
