import { readFileSync } from 'node:fs';
import { parseBarFile } from '../../../src/fileFormats/barFile.ts';
import { parseSessionFile } from '../../../src/fileFormats/sessionFile.ts';
import { calibrateSession } from '../../../src/session/calibrateSession.ts';
import { characterizeBlank } from '../../../src/session/characterizeBlank.ts';
import { nextCut } from '../../../src/session/nextCut.ts';
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
    const blank = parseBarFile({ length_mm: 440, section: { shape: 'rect', width_mm: 58, thickness_mm: 24 }, material: { E_GPa: 17.2, G_GPa: 1.25, density_kg_m3: 985 } });
    const characterize = await measure(() => characterizeBlank({ bar: blank, measuredHz: [543.81, 1382.81, 2447.44], massGrams: 603 }), { warmup: 2, minRuns: 5 });
    rows.push({ suite: 'session', case: 'characterizeBlank, 3 partials + mass', ...characterize });
    return rows;
  },
};
