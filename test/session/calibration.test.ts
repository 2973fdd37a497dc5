// Calibration: the session learns the simulated bar's material from its measurements, and a
// contradictory measurement is flagged and set aside, never absorbed.
import { describe, expect, it } from 'vitest';
import { parseSessionFile } from '../../src/fileFormats/sessionFile.ts';
import { calibrateSession } from '../../src/session/calibrateSession.ts';
import { nextCut } from '../../src/session/nextCut.ts';
import { runSimulatedSession } from './simulatedSession.ts';

const guess = { E_GPa: 18, G_GPa: 1.3, density_kg_m3: 1000 };
const youngFactor = 1.12;
const shearFactor = 0.78;

/** A C4 session three cuts in (four measured steps), clean: ±0.5 cent noise, cuts as planned. */
function cleanSession(): Record<string, any> {
  const outcome = runSimulatedSession({
    blank: { format: 'barwright.bar', version: 1, length_mm: 328, section: { shape: 'rect', width_mm: 52, thickness_mm: 21 }, material: guess },
    youngFactor,
    shearFactor,
    target: { hz: 262.81, ratios: [1, 4, 10], tolerance_cents: [2, 5, 15] },
    limits: { min_thickness_mm: 5.3 },
    noiseCents: 0.5,
    executionError: 0,
    seed: 404,
    maxCuts: 3,
  });
  return structuredClone(outcome.session);
}

const base = cleanSession();

function shifted(session: Record<string, any>, step: number, partial: number, cents: number): Record<string, any> {
  const copy = structuredClone(session);
  copy.steps[step].measured_hz[partial] *= 2 ** (cents / 1200);
  return copy;
}

describe('calibrateSession', () => {
  it('learns the simulated bar’s E within 2 % and G within 10 % (prior: the guess, 12 % and 22 % off)', () => {
    expect(base.steps.length).toBe(4);
    const calibration = calibrateSession(parseSessionFile(base));
    // E is pinned by the uncut blank, where the simulated physics equals classical Timoshenko;
    // G by the shear softening of f2/f1. The tolerances are those a maker would accept for a
    // starting guess of the next blank from the same board (common practice).
    expect(Math.abs(calibration.youngModulus / (guess.E_GPa * 1e9 * youngFactor) - 1)).toBeLessThan(0.02);
    expect(Math.abs(calibration.shearModulus / (guess.G_GPa * 1e9 * shearFactor) - 1)).toBeLessThan(0.1);
    // On the uncut blank the simulated physics is classical Timoshenko: fitted to the noise.
    for (const r of calibration.steps[0]!.residualCents) expect(Math.abs(r ?? 0)).toBeLessThan(1);
    // On the arch it is not (local knock-downs against a per-partial correction linear in depth):
    // a compromise of several cents, but every residual within 4 of its own allowance sigma — the
    // line beyond which a reading would be called contradictory.
    for (const step of calibration.steps) step.residualCents.forEach((r, n) => expect(Math.abs(r ?? 0)).toBeLessThan(4 * step.sigmaCents[n]!));
    expect(calibration.flags).toEqual([]);
    // The 1D model is too high on a deep arch (brief.md): every correction comes out negative.
    for (const c of calibration.corrections.slice(0, 3)) expect(c).toBeLessThan(0);
  });

  it('flags a partial read 100 cents off in the last step and plans no cut from it', () => {
    const session = shifted(base, 3, 1, 100);
    const calibration = calibrateSession(parseSessionFile(session));
    expect(calibration.flags.map((f) => [f.step, f.partial])).toEqual([[4, 2]]);
    expect(Math.abs(calibration.flags[0]!.residual_cents!)).toBeGreaterThan(70);
    const result = nextCut(session);
    expect(result.status).toBe('stuck');
    expect(result.reason).toMatch(/^re-measure before cutting: partial 2 of step 4/);
    expect(result.bar_after).toEqual(session.steps[3].bar);
  });

  it('does not absorb a contradictory measurement: the calibration stays where the clean session puts it', () => {
    const clean = calibrateSession(parseSessionFile(base));
    // The third step (two cuts in): the misreading is far larger than the model's allowance for the
    // change to its neighbours (15 % of roughly 80–300 cents).
    for (const [step, partial] of [
      [2, 2],
      [2, 0],
    ] as const) {
      const session = shifted(base, step, partial, -100);
      const calibration = calibrateSession(parseSessionFile(session));
      expect(calibration.flags.map((f) => [f.step, f.partial])).toEqual([[step + 1, partial + 1]]);
      expect(Math.abs(calibration.youngModulus / clean.youngModulus - 1)).toBeLessThan(0.005);
      expect(Math.abs(calibration.shearModulus / clean.shearModulus - 1)).toBeLessThan(0.03);
      // An old step set aside: the next cut is still planned, with the reason in the warnings.
      const result = nextCut(session);
      expect(result.status).toBe('cut');
      expect(result.warnings.join(' ')).toMatch(new RegExp(`partial ${partial + 1} of step ${step + 1} .* set aside`));
    }
  });

  it('flags partials typed in the wrong order (swapped) instead of fitting them', () => {
    const session = structuredClone(base);
    const hz = session.steps[3].measured_hz as number[];
    [hz[1], hz[2]] = [hz[2]!, hz[1]!];
    const calibration = calibrateSession(parseSessionFile(session));
    expect(calibration.flags.filter((f) => f.step === 4).map((f) => f.partial).sort()).toEqual([2, 3]);
    expect(calibration.flags[0]!.reason).toMatch(/out of order/);
    expect(nextCut(session).status).toBe('stuck');
  });

  it('raises no flag for ordinary noise: 1-cent errors on every partial of the last step', () => {
    for (const cents of [-1, 1]) {
      let session = base;
      for (let n = 0; n < 3; n++) session = shifted(session, 3, n, cents * (n % 2 ? -1 : 1));
      expect(calibrateSession(parseSessionFile(session)).flags).toEqual([]);
    }
  });

  it('reads a cut recorded as planned but made 8 % deeper', () => {
    const outcome = runSimulatedSession({
      blank: { format: 'barwright.bar', version: 1, length_mm: 328, section: { shape: 'rect', width_mm: 52, thickness_mm: 21 }, material: guess },
      youngFactor,
      shearFactor,
      target: { hz: 262.81, ratios: [1, 4, 10], tolerance_cents: [2, 5, 15] },
      limits: { min_thickness_mm: 5.3 },
      noiseCents: 0.5,
      executionError: 0,
      seed: 405,
      maxCuts: 2,
      cutScale: 1.08,
    });
    const calibration = calibrateSession(parseSessionFile(outcome.session));
    expect(calibration.cutDepths.length).toBe(2);
    // Each cut read within 3 % of the 108 % it really was (prior: 100 ± 10 %).
    for (const estimate of calibration.cutDepths) expect(Math.abs(1 + estimate.scale - 1.08)).toBeLessThan(0.03);
  });
});
