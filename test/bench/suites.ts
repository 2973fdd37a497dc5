import type { BenchSuite } from './measure.ts';
import { solverSuite } from './suites/solver.ts';
import { designSuite } from './suites/design.ts';
import { sessionSuite } from './suites/session.ts';
import { audioSuite } from './suites/audio.ts';
import { planSuite } from './suites/plan.ts';
import { startupSuite } from './suites/startup.ts';
import { bundlesSuite } from './suites/bundles.ts';

/** Every benchmark suite `npm run bench` runs. Add yours here (one file per suite in suites/). */
export const suites: BenchSuite[] = [solverSuite, designSuite, sessionSuite, audioSuite, planSuite, startupSuite, bundlesSuite];
