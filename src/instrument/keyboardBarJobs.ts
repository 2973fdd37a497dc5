import type { CutLimitsInput } from '../design/cutLimits.ts';
import type { BarFile } from '../fileFormats/barFile.ts';
import type { KeyboardFile } from '../fileFormats/keyboardFileTypes.ts';
import { defaultWorkshop, type Workshop } from '../fileFormats/workshopFile.ts';
import type { ScheduledBlank } from './blankSchedule.ts';
import { keyboardLimits, type KeyboardNote } from './keyboardNotes.ts';
import { stableHash } from './stableHash.ts';

/** One bar to design: plain data (structured-clone safe) so any worker can take it. */
export interface KeyboardBarJob {
  /** The note name: the key of the bar in the results. */
  key: string;
  /** Fingerprint of every input below: a stored result with another fingerprint is stale. */
  fingerprint: string;
  note: string;
  midi: number;
  index: number;
  /** The uniform blank cut to its scheduled length. */
  blank: BarFile;
  /** Target fundamental, Hz. */
  target_hz: number;
  ratios: number[];
  tolerance_cents: number[];
  /** Limits the keyboard file gives in the designer's input form (mm): each overrides the workshop's. */
  limits: CutLimitsInput;
  /** The workshop whose tools set the other limits and whose drill makes the cord holes. */
  workshop: Workshop;
  resonator?: { inner_diameter_mm: number; air_temperature_c: number; open_end: 'unflanged' | 'flanged' };
  /** The blank schedule's flag for this note, carried into the result. */
  schedule_note?: string;
  /** The blank's length was given in the keyboard file (a blank already cut): the plan never changes it. */
  blank_given?: boolean;
  /** `solid`: the design's partials are the 3D model's (designBarSolid); absent: the line model's. */
  theory?: 'solid';
}

/**
 * The design jobs of a keyboard, lowest note first: each note's blank (scheduled length × its
 * section width × thickness, its material), target, ratios, tolerances, the workshop (the file's,
 * else barwright's default) with the limits the file sets over it (keyboardLimits) and resonator,
 * with a fingerprint of them all for resuming; `theory` 'solid' asks for designs on the 3D model
 * (part of the fingerprint, so a line-model plan is not taken for a solid one).
 */
export function keyboardBarJobs(file: KeyboardFile, notes: readonly KeyboardNote[], schedule: readonly ScheduledBlank[], theory: 'timoshenko' | 'solid' = 'timoshenko'): KeyboardBarJob[] {
  return notes.map((note, i) => {
    const blank = schedule[i]!;
    const bar: BarFile = {
      format: 'barwright.bar',
      version: 1,
      label: `${note.name} blank`,
      length_mm: blank.length_mm,
      section: { shape: 'rect', width_mm: note.width_mm, thickness_mm: note.thickness_mm },
      material: { ...note.material },
    };
    const inputs = {
      blank: bar,
      target_hz: note.target_hz,
      ratios: note.ratios,
      tolerance_cents: note.tolerance_cents,
      limits: keyboardLimits(file, note),
      workshop: file.workshop ?? defaultWorkshop,
      ...(file.resonators && note.resonator_inner_diameter_mm !== undefined
        ? { resonator: { inner_diameter_mm: note.resonator_inner_diameter_mm, air_temperature_c: file.resonators.air_temperature_c, open_end: file.resonators.open_end } }
        : {}),
      ...(blank.reason ? { schedule_note: blank.reason } : {}),
      ...(blank.fixed ? { blank_given: true } : {}),
      ...(theory === 'solid' ? { theory } : {}),
    };
    return { key: note.name, fingerprint: stableHash(inputs), note: note.name, midi: note.midi, index: note.index, ...inputs };
  });
}

