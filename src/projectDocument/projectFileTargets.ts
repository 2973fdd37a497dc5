// Targets of a project's bars: the register a bar belongs to, its partials' target frequencies
// at the instrument's A4, and how far measured or predicted partials sit from them in cents.
import { cents, sharpOrFlat } from '../pitch/cents.ts';
import { noteToHz } from '../pitch/noteToHz.ts';
import { InputError } from '../fileFormats/InputError.ts';
import type { ProjectBar, ProjectFile, Register } from './projectFileTypes.ts';

/** The register a bar belongs to; throws InputError when the bar names none of the instrument's. */
export function registerOf(project: ProjectFile, bar: ProjectBar): Register {
  const register = project.instrument.registers.find((candidate) => candidate.id === bar.register);
  if (!register) throw new InputError('project', `bars[${bar.note}].register`, `names no register of the instrument ("${bar.register}")`);
  return register;
}

/** Target frequency (Hz) of each tuned partial of a bar: f(note at A4) × the register's ratios. */
export function barTargetHz(project: ProjectFile, bar: ProjectBar): number[] {
  const fundamental = noteToHz(bar.note, project.instrument.a4_hz, 'project', `bar ${bar.note}: note`);
  return registerOf(project, bar).ratios.map((ratio) => fundamental * ratio);
}

/** One partial's standing against its target. */
export interface PartialStanding {
  /** Partial number, 1 = fundamental. */
  partial: number;
  targetHz: number;
  /** The measured or predicted frequency, Hz, or null when there is none for this partial. */
  hz: number | null;
  /** Signed cents from the target (positive = sharp), or null. */
  cents: number | null;
  toleranceCents: number;
  /** "sharp", "flat" or "in tune" (within tolerance), or null when there is no frequency. */
  verdict: 'sharp' | 'flat' | 'in tune' | null;
}

/**
 * Compares frequencies (Hz, partial order) with targets: signed cents per partial
 * (1200 · log2(f / f_target)) and a verdict using each partial's tolerance.
 */
export function comparePartials(hz: readonly (number | null | undefined)[], targetHz: readonly number[], toleranceCents: readonly number[]): PartialStanding[] {
  return targetHz.map((target, index) => {
    const value = hz[index];
    const tolerance = toleranceCents[index] ?? toleranceCents[toleranceCents.length - 1] ?? 0;
    if (value === null || value === undefined || !Number.isFinite(value) || value <= 0) {
      return { partial: index + 1, targetHz: target, hz: null, cents: null, toleranceCents: tolerance, verdict: null };
    }
    const offset = cents(value, target);
    return { partial: index + 1, targetHz: target, hz: value, cents: offset, toleranceCents: tolerance, verdict: sharpOrFlat(offset, tolerance) };
  });
}

/** The last measured partials of a bar (Hz), or null before the first round. */
export function lastMeasuredHz(bar: ProjectBar): number[] | null {
  const last = bar.session.steps[bar.session.steps.length - 1];
  return last ? [...last.measured_hz] : null;
}

