// The demo project is the contract's invented scenario, and its invented measurements are
// plausible: close to what the model predicts for each shape, and the finished bar in tune.
import { readFileSync } from 'node:fs';
import { resolve } from 'node:path';
import { describe, expect, it } from 'vitest';
import { analyzeBar, barTargetHz, cents, comparePartials, parseProjectFile, registerOf } from '../../src/index.ts';

const project = parseProjectFile(JSON.parse(readFileSync(resolve(import.meta.dirname, '../../fixtures/demo.project.json'), 'utf8')), 'demo');

describe('demo project', () => {
  it('is the invented workshop: A2–C7 at A4 = 442 Hz in dense tropical hardwood, with aluminium chimes', () => {
    expect(project.instrument.lowest_note).toBe('A2');
    expect(project.instrument.highest_note).toBe('C7');
    expect(project.instrument.a4_hz).toBe(442);
    const families = new Set(project.bars.map((bar) => registerOf(project, bar).family));
    expect(families).toEqual(new Set(['keyboard', 'chime']));
    expect(project.bars.filter((bar) => bar.current.section.shape === 'tube').length).toBeGreaterThanOrEqual(3);
    expect(new Set(project.bars.map((bar) => bar.state))).toEqual(new Set(['not-started', 'rough', 'tuning', 'done']));
    expect(project.bars.filter((bar) => bar.session.steps.length > 0).length).toBeGreaterThanOrEqual(2);
  });

  it('has measurements within 12 % (about 200 cents) of the model for each measured shape', () => {
    // Real wood differs from the starting guess by ±20 % in E (brief §2), i.e. about ±10 % in
    // frequency; the demo's invented blanks sit within that.
    for (const bar of project.bars) {
      for (const step of bar.session.steps) {
        const predicted = analyzeBar(step.bar, { modes: step.measured_hz.length }).bending.map((mode) => mode.hz);
        step.measured_hz.forEach((hz, index) => expect(Math.abs(cents(hz, predicted[index]!))).toBeLessThan(200));
      }
    }
  });

  it('has its finished bars within tolerance on every tuned partial', () => {
    for (const bar of project.bars.filter((entry) => entry.state === 'done')) {
      const last = bar.session.steps.at(-1)!;
      const standings = comparePartials(last.measured_hz, barTargetHz(project, bar), registerOf(project, bar).tolerance_cents);
      for (const standing of standings) expect(standing.verdict).toBe('in tune');
    }
  });
});
