// Pieces tuned by their length in the project: the shortening switch, where a shortening is taken,
// the length trimmed recorded as cut with the next round, and the trim advice's input.
import { readFileSync } from 'node:fs';
import { resolve } from 'node:path';
import { describe, expect, it } from 'vitest';
import {
  barLengthTrimInput,
  barMayShorten,
  barShortenAt,
  exportSessionFile,
  parseSessionFile,
  readProjectFileText,
  recordShortening,
  recordStep,
  serializeProjectFile,
  setAllowShortening,
  setShortenAt,
  tunedByLength,
} from '../../src/index.ts';

const demoText = readFileSync(resolve(import.meta.dirname, '../../fixtures/demo.project.json'), 'utf8');
const demo = () => readProjectFileText(demoText, 'demo.project.json');
const bar = (project: ReturnType<typeof demo>, id: string) => project.bars.find((candidate) => candidate.id === id)!;

describe('pieces tuned by length', () => {
  it('records a hand trim of a chime and keeps it with the next round (shortened_mm, at the free end), through save and the exported session file', () => {
    let project = demo();
    const e5 = bar(project, 'chime-E5');
    expect(tunedByLength(e5)).toBe(true);
    expect(barMayShorten(e5)).toBe(true);
    expect(barShortenAt(e5)).toBe('free-end');
    const length = e5.current.length_mm;
    project = recordStep(project, 'chime-E5', [650], { at: '2025-04-01T10:00:00.000Z' });
    expect(barLengthTrimInput(project, bar(project, 'chime-E5'))).toMatchObject({ measuredHz: expect.any(Number), toleranceCents: 3, shortenAt: 'free-end' });
    project = recordShortening(project, 'chime-E5', 4.2, '2025-04-01T10:05:00.000Z');
    expect(bar(project, 'chime-E5').current.length_mm).toBeCloseTo(length - 4.2, 6);
    // Trimmed since the last round: no advice until it is struck again.
    expect(barLengthTrimInput(project, bar(project, 'chime-E5'))).toBeNull();
    project = recordStep(project, 'chime-E5', [660], { at: '2025-04-01T10:20:00.000Z' });
    const step = bar(project, 'chime-E5').session.steps[1]!;
    expect(step.cut).toEqual({ made: 'as-done', shortened_mm: 4.2, shortened_at: 'free-end' });
    expect(step.cut_finished_at).toBe('2025-04-01T10:05:00.000Z');
    const reread = readProjectFileText(serializeProjectFile(project), 'saved');
    expect(bar(reread, 'chime-E5').session.steps[1]!.cut).toEqual(step.cut);
    // The exported session file is one `barwright next-cut` reads, the cut record included.
    expect(parseSessionFile(exportSessionFile(bar(reread, 'chime-E5')), 'e5.session.json').steps[1]!.cut).toEqual(step.cut);
  });

  it('refuses a trim outside 0.05 mm to a quarter of the piece, with the range', () => {
    const project = demo();
    expect(() => recordShortening(project, 'chime-E5', 0, 't')).toThrow(/must lie within 0\.05–\d+(\.\d)? mm/);
    expect(() => recordShortening(project, 'chime-E5', 500, 't')).toThrow(/a quarter of the/);
    expect(() => recordShortening(project, 'chime-E5', Number.NaN, 't')).toThrow(/shortened_mm/);
  });

  it('wires the shortening switch of an undercut bar to its session limits, and the end to shorten_at; a tube cannot turn it off', () => {
    let project = demo();
    const keyboardBar = project.bars.find((candidate) => candidate.current.section.shape === 'rect')!;
    expect(barMayShorten(keyboardBar)).toBe(false);
    project = setAllowShortening(project, keyboardBar.id, true, '2025-04-01T10:00:00.000Z');
    expect(bar(project, keyboardBar.id).session.limits.allow_shortening).toBe(true);
    expect(barMayShorten(bar(project, keyboardBar.id))).toBe(true);
    expect(barShortenAt(bar(project, keyboardBar.id))).toBe('both-ends');
    project = setShortenAt(project, 'chime-G5', 'both-ends', '2025-04-01T10:00:00.000Z');
    expect(bar(project, 'chime-G5').session.limits.shorten_at).toBe('both-ends');
    const reread = readProjectFileText(serializeProjectFile(project), 'saved');
    expect(bar(reread, keyboardBar.id).session.limits.allow_shortening).toBe(true);
    expect(bar(reread, 'chime-G5').session.limits.shorten_at).toBe('both-ends');
    expect(() => setAllowShortening(project, 'chime-G5', false, 't')).toThrow(/tuned by its length alone/);
  });

  it('the session file refuses a shortening record or end it does not know', () => {
    const session = exportSessionFile(bar(demo(), 'chime-C5'));
    expect(() => parseSessionFile({ ...session, limits: { ...session.limits, shorten_at: 'middle' } }, 's.json')).toThrow(/limits\.shorten_at: must be "free-end"/);
    const steps = [session.steps[0], { ...session.steps[0], cut: { made: 'as-done', shortened_mm: -2 } }];
    expect(() => parseSessionFile({ ...session, steps }, 's.json')).toThrow(/steps\[1\]\.cut\.shortened_mm/);
  });
});
