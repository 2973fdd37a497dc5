// A 1:3 bar tuned in whole simulated sessions, on the solid model and on the line model alone (solidSessionRuns.ts).
import { describe, it } from 'vitest';
import { blank, compareSessions } from './solidSessionRuns.ts';

describe('a session on the solid model reaches tolerance in fewer cuts than on the line model alone', () => {
  it('C5 1:3, 300 × 40 × 22 mm, seeds 1–3', () => {
    const lines = compareSessions('C5 1:3', blank(300, 40), { hz: 525.6, ratios: [1, 3], tolerance_cents: [2, 5] }, [1, 2, 3]);
    console.log(`sessions against the solid "real bar":\n${lines.join('\n')}`);
  }, 1_200_000);
});
