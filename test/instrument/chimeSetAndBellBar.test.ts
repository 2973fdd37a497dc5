import { readFileSync } from 'node:fs';
import { mkdtemp, rm } from 'node:fs/promises';
import { tmpdir } from 'node:os';
import { join } from 'node:path';
import { describe, expect, it } from 'vitest';
import { main } from '../../src/cli/main.ts';
import { bellBarForNote } from '../../src/instrument/bellBarForNote.ts';
import { tuneBellBarOvertone } from '../../src/instrument/tuneBellBarOvertone.ts';
import { analyzeBar } from '../../src/modes/analyzeBar.ts';
import { chimeCutListCsv } from '../../src/instrument/chimeCutListCsv.ts';
import { planChimeSet } from '../../src/instrument/chimeSetPlan.ts';
import { cuttingPlan } from '../../src/instrument/cuttingPlan.ts';
import { nearestInterval } from '../../src/instrument/musicalInterval.ts';
import { parseChimeSetFile } from '../../src/fileFormats/chimeSetFile.ts';
import { parseRfc4180 } from './rfc4180.ts';
import { captureIo as capture } from '../cli/captureIo.ts';

const demoPath = 'fixtures/demo.chimes.json';


const cents = (a: number, b: number): number => 1200 * Math.log2(a / b);

describe('chime set plan (demo aluminium set)', () => {
  const file = parseChimeSetFile(JSON.parse(readFileSync(demoPath, 'utf8')), demoPath);
  const plan = planChimeSet(file);

  it('cuts every chime to sound its note, shorter up the scale, hung near 22 % from the top', () => {
    expect(plan.chimes.map((c) => c.note)).toEqual(['C5', 'D5', 'E5', 'G5', 'A5', 'C6']);
    for (const [i, chime] of plan.chimes.entries()) {
      // Equal temperament at A4 = 442 (MIDI 1.0) and the search's own tolerance (1e-4 cent, margin 10×).
      expect(chime.target_hz).toBeCloseTo(442 * 2 ** ((chime.midi - 69) / 12), 9);
      expect(Math.abs(cents(chime.fundamental_hz, chime.target_hz))).toBeLessThan(1e-3);
      if (i > 0) expect(chime.length_mm).toBeLessThan(plan.chimes[i - 1]!.length_mm);
      // The top plug pulls the node towards the top: below the free tube's 0.2242 (Blevins 1979, table 8-1).
      expect(chime.hanging_point_fraction).toBeLessThan(0.2242);
      expect(chime.hanging_point_fraction).toBeGreaterThan(0.18);
      expect(chime.hanging_point_shift_mm).toBeLessThan(0);
    }
  });

  it('writes a cut list that parses as RFC 4180 and round-trips the plan', () => {
    const csv = chimeCutListCsv(plan);
    const records = parseRfc4180(csv);
    expect(records[0]!.slice(0, 5)).toEqual(['note', 'midi', 'target_hz', 'tuned', 'length_mm']);
    expect(records).toHaveLength(1 + plan.chimes.length);
    const column = (name: string) => records[0]!.indexOf(name);
    records.slice(1).forEach((record, i) => {
      const chime = plan.chimes[i]!;
      expect(record[column('note')]).toBe(chime.note);
      expect(Number(record[column('midi')])).toBe(chime.midi);
      // Written to 0.1 mm: back within half of that.
      expect(Math.abs(Number(record[column('length_mm')]) - chime.length_mm)).toBeLessThanOrEqual(0.05 + 1e-9);
      expect(Math.abs(Number(record[column('hanging_point_mm')]) - chime.hanging_point_mm)).toBeLessThanOrEqual(0.05 + 1e-9);
      expect(record[column('warnings')]).toBe(chime.warnings.join('; '));
    });
  });

  it('plans the stock: every chime in some stock bar, none over length', () => {
    expect(plan.cutting).toBeDefined();
    const pieces = plan.cutting!.bars.flatMap((b) => b.pieces);
    expect(pieces.sort()).toEqual(plan.chimes.map((c) => c.note).sort());
    for (const bar of plan.cutting!.bars) expect(bar.used_mm).toBeLessThanOrEqual(2000);
    // First-fit decreasing, checked by hand: 600, 500, 400, 300, 100 mm into 1000 mm bars with a 2 mm
    // kerf → [600 + 300], [500 + 400], [100] (without the kerf the 100 would still fit the first bar).
    const fit = cuttingPlan(['a', 'b', 'c', 'd', 'e'].map((label, i) => ({ label, length_mm: [600, 500, 400, 300, 100][i]! })), 1000, 2);
    expect(fit.bars.map((b) => b.pieces)).toEqual([['a', 'd'], ['b', 'c'], ['e']]);
    expect(fit.bars.map((b) => b.offcut_mm)).toEqual([98, 98, 900]);
    expect(cuttingPlan([{ label: 'a', length_mm: 600 }, { label: 'e', length_mm: 100 }, { label: 'd', length_mm: 300 }], 1000, 0).bars.map((b) => b.pieces)).toEqual([['a', 'd', 'e']]);
  });

  it('refuses a bad chime-set file with the field and the rule', () => {
    const bad = (change: (f: Record<string, any>) => void): string => {
      const f = JSON.parse(readFileSync(demoPath, 'utf8'));
      change(f);
      try {
        parseChimeSetFile(f, 'c.json');
      } catch (e) {
        return (e as Error).message;
      }
      return 'no error';
    };
    expect(bad((f) => (f.notes = ['C5', 'B#4']))).toBe('c.json: notes[1]: B#4 is the same note as C5');
    expect(bad((f) => (f.stock.section.wall_mm = 13))).toBe('c.json: stock.section.wall_mm: wall 13 mm must be less than half the outer diameter (12.7 mm)');
    expect(bad((f) => (f.stock.section = { shape: 'rect', width_mm: 30, thickness_mm: 8 }))).toMatch(/^c\.json: stock\.section\.shape: a chime is a "tube" or a "round" rod/);
    expect(bad((f) => (f.tune = 'loud'))).toBe('c.json: tune: must be "fundamental" or "strike" (got "loud")');
    expect(bad((f) => (f.end_masses[0].mass_g = 0))).toBe('c.json: end_masses[0].mass_g: must be greater than 0 g (got 0)');
  });
});

describe('barwright chime', () => {
  it('plans the demo set and writes the cut list and plan into --out', async () => {
    const io = capture();
    const dir = await mkdtemp(join(tmpdir(), 'chimes-'));
    try {
      expect(await main(['chime', demoPath, '--out', dir], io)).toBe(0);
      expect(io.out.join('\n')).toContain('C5');
      expect(parseRfc4180(io.files.get(join(dir, 'chime-cut-list.csv'))!)).toHaveLength(7);
      expect(JSON.parse(io.files.get(join(dir, 'chime-plan.json'))!).chimes).toHaveLength(6);
    } finally {
      await rm(dir, { recursive: true, force: true });
    }
  });

  it('sizes one tube for a note as one JSON document, never NaN', async () => {
    const io = capture();
    expect(await main(['chime', '--tube', '25.4x1.6', '--note', 'G5', '--a4', '442', '--json'], io)).toBe(0);
    expect(io.out).toHaveLength(1);
    const result = JSON.parse(io.out[0]!);
    expect(result.partials).toHaveLength(6);
    expect(Math.abs(result.cents_error)).toBeLessThan(1e-3);
    expect(io.out[0]).not.toMatch(/NaN|Infinity/);
  });

  it('exits 2 with a one-line message on bad options', async () => {
    const io = capture();
    expect(await main(['chime', '--tube', '25.4', '--note', 'G5'], io)).toBe(2);
    expect(io.err).toEqual(['command line: --tube: "25.4" is not OUTERxWALL in mm, e.g. 25.4x1.6']);
    const io2 = capture();
    expect(await main(['chime', '--rod', '12'], io2)).toBe(2);
    expect(io2.err[0]).toBe('command line: --note: give one of --note, --hz or --length-mm');
  });
});

describe('bell bars', () => {
  // Carbon steel as the preset gives it: E 205 GPa, ρ 7850, ν 0.29 (reference-values.md, memory).
  const steel = { width_mm: 38, thickness_mm: 10, material: { E_GPa: 205, density_kg_m3: 7850, poisson: 0.29 } };

  it('finds the length for a note and lists inharmonic partials near the Euler–Bernoulli ratios', () => {
    const bar = bellBarForNote(steel, 880);
    expect(Math.abs(bar.cents_error)).toBeLessThan(1e-3);
    // Closed form for comparison (Blevins 1979, table 8-1): L = 4.7300·(t·√(E/12ρ)/2πf)^½; shear and
    // rotary inertia lower f, so the Timoshenko bar is a little shorter (t/L ≈ 1/24: well under 1 %).
    const closed = 4.73004074486 * Math.sqrt((0.01 * Math.sqrt(205e9 / (12 * 7850))) / (2 * Math.PI * 880)) * 1000;
    expect(bar.length_mm).toBeLessThan(closed);
    expect(bar.length_mm / closed).toBeGreaterThan(0.99);
    // Partial ratios below 2.7565, 5.4039 (EB, Blevins 1979) by the shear correction, within 5 %.
    expect(bar.partials[1]!.ratio).toBeLessThan(2.7565);
    expect(bar.partials[1]!.ratio / 2.7565).toBeGreaterThan(0.95);
    expect(bar.partials[2]!.ratio).toBeLessThan(5.4039);
    // Support points at mode 1's nodes, symmetric about the centre.
    expect(bar.support_points_mm[0] + bar.support_points_mm[1]).toBeCloseTo(bar.length_mm, 6);
    expect(bar.support_points_mm[0] / bar.length_mm).toBeGreaterThan(0.2);
    expect(bar.support_points_mm[0] / bar.length_mm).toBeLessThan(0.2242 + 0.002);
  });

  it('names each partial’s nearest interval (equal temperament) with the cents off', () => {
    // 2.7565 = 1754.9 cents: an octave + perfect fourth (1700) + 55 → octave + tritone? nearest is 1800 (−45).
    expect(nearestInterval(2.7565).name).toBe('octave + tritone');
    expect(nearestInterval(4).name).toBe('2 octaves');
    expect(nearestInterval(4).cents).toBeCloseTo(0, 9);
    expect(nearestInterval(10).name).toBe('3 octaves + major third');
    expect(nearestInterval(10).cents).toBeCloseTo(1200 * Math.log2(10) - 4000, 9);
  });

  it('warns when a lateral mode collides with a partial (a bar as wide as it is thick: lateral = vertical)', () => {
    const square = bellBarForNote({ width_mm: 12, thickness_mm: 12, material: steel.material }, 880);
    expect(square.warnings.some((w) => w.startsWith('lateral mode 1 is 0 cents from bending partial 1'))).toBe(true);
  });

  it('tunes the second partial to a twelfth (3×) through the designer: shallow undercut, ends trimmed', () => {
    // Aluminium 6061-T6 (producers' data sheets, reference-values.md), 38 × 10 mm, A5 at 442.
    const aluminium = { width_mm: 38, thickness_mm: 10, material: { E_GPa: 68.9, density_kg_m3: 2700, poisson: 0.33 } };
    const tuned = tuneBellBarOvertone(aluminium, 884, 3);
    expect(tuned.design.feasible).toBe(true);
    // Re-analysed independently on a fine mesh: fundamental within ±2, partial 2 within ±5 cents of 3×.
    const check = analyzeBar(tuned.design.bar, { modes: 3, elements: 300 });
    expect(Math.abs(cents(check.bending[0]!.hz, 884))).toBeLessThan(2);
    expect(Math.abs(cents(check.bending[1]!.hz, 3 * 884))).toBeLessThan(5);
    // Shallow: never below 70 % of the thickness; trimmed: shorter than the uniform bar for the note.
    for (const [, t] of tuned.design.bar.profile_mm!) expect(t).toBeGreaterThanOrEqual(7 - 1e-6);
    expect(tuned.design.bar.length_mm).toBeLessThan(tuned.uniform.length_mm);
    // A ratio a centre cut cannot reach (below the uniform 2.72) comes back flagged with a reason.
    const impossible = tuneBellBarOvertone(aluminium, 884, 2.5);
    expect(impossible.design.feasible).toBe(false);
    expect(impossible.design.reason).toBeTruthy();
    // Two designs, the second searching its remedies: about 30 s on an idle 2-core machine, more
    // than the default 60 s when the machine is shared, so this case has room of its own.
  }, 240_000);
});
