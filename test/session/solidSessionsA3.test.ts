// A 1:4:10 bar tuned in whole simulated sessions, on the solid model and on the line model alone (solidSessionRuns.ts).
import { describe, it } from 'vitest';
import { blank, compareSessions } from './solidSessionRuns.ts';

describe('a session on the solid model reaches tolerance in fewer cuts than on the line model alone', () => {
  it('A3 1:4:10, 370 × 56 × 22 mm, seeds 1–3', () => {
    const lines = compareSessions('A3 1:4:10', blank(370, 56), { hz: 221, ratios: [1, 4, 10], tolerance_cents: [2, 5, 15] }, [1, 2, 3]);
    console.log(`sessions against the solid "real bar":\n${lines.join('\n')}`);
  }, 1_200_000);
});
