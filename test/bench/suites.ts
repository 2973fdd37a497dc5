import type { BenchSuite } from './measure.ts';

/** Every benchmark suite `npm run bench` runs. Add yours here (one file per suite in suites/). */
export const suites: BenchSuite[] = [];
