// The resonator tubes of a project: one closed-bottom tube under each keyboard bar, tuned to its
// target fundamental at the playing temperature, with the partials it reinforces and the warnings
// of an impractical tube; the list as CSV; and the two settings that size them (each register's
// bore, the frame's longest tube), checked against physically sensible ranges.
import { InputError, isInputError } from '../fileFormats/InputError.ts';
import { reinforcedPartials } from '../resonator/closedTube.ts';
import { endCorrectionFactors } from '../resonator/endCorrection.ts';
import { speedOfSound } from '../resonator/speedOfSound.ts';
import { tubeListCsv, tubeSet, type TubeRow } from '../resonator/tubeListCsv.ts';
import { tubePracticality, type TubeWarning } from '../resonator/tubePracticality.ts';
import { barTargetHz, registerOf } from './projectFileTargets.ts';
import { syncSessionTargets } from './projectFileEdits.ts';
import type { ProjectFile } from './projectFileTypes.ts';

/** Inner diameters a resonator bore may have, mm (narrower than a finger or wider than a bucket is a typing slip). */
export const resonatorBoreRangeMm = { min: 10, max: 250 } as const;
/** Longest-tube settings a frame may have, mm. */
export const resonatorFrameRangeMm = { min: 50, max: 3000 } as const;

/** One tube of the project's list. */
export interface ProjectTube {
  barId: string;
  note: string;
  /** The bar's target fundamental, Hz. */
  targetHz: number;
  /** The bar's target partial ratios (its register's). */
  ratios: number[];
  /** Inner diameter, mm, or null when the register has none set. */
  innerDiameterMm: number | null;
  /** The sized tube, or null when it cannot be sized (no bore set, or the bore is too wide for the note). */
  tube: TubeRow | null;
  /** Which bar partials a tube resonance meets (within 50 cents): partial number, its ratio, the tube resonance (1 = f, 2 = 3f, 3 = 5f). */
  reinforces: { partial: number; ratio: number; resonance: number }[];
  /** Why the tube is impractical, with remedies (also when it cannot be sized at all). */
  warnings: TubeWarning[];
  /** What is missing, in words (no bore set), or null. */
  missing: string | null;
}

/**
 * Sizes the tube under every keyboard bar of the project (chime tubes hang free and get none):
 * tubeSet at the instrument's air temperature and open end, with the register's bore and ratios
 * and the frame's longest tube. A bore too wide for a note gives a row with no tube and the
 * shorter-than-its-bore warning with its remedies, never an error.
 */
export function projectResonatorTubes(project: ProjectFile): ProjectTube[] {
  const instrument = project.instrument;
  const air = { temperatureC: instrument.air_temperature_c, relativeHumidityPercent: 0 };
  const frame = instrument.resonator_max_length_mm !== undefined ? { maxLengthM: instrument.resonator_max_length_mm / 1000 } : {};
  return project.bars
    .filter((bar) => registerOf(project, bar).family === 'keyboard')
    .map((bar) => {
      const register = registerOf(project, bar);
      const targetHz = barTargetHz(project, bar)[0]!;
      const bore = register.resonator_inner_diameter_mm ?? null;
      const row: ProjectTube = { barId: bar.id, note: bar.note, targetHz, ratios: [...register.ratios], innerDiameterMm: bore, tube: null, reinforces: [], warnings: [], missing: null };
      if (bore === null) return { ...row, missing: `no resonator bore set for ${register.label}` };
      try {
        const [tube] = tubeSet([{ label: bar.note, targetHz, innerDiameterM: bore / 1000 }], { air, openEnd: instrument.resonator_end }, register.ratios, 'resonator', frame);
        const partialsHz = register.ratios.map((ratio) => ratio * targetHz);
        const reinforces = reinforcedPartials(tube!.harmonicsHz, partialsHz).map((found) => ({ partial: found.partial, ratio: register.ratios[found.partial - 1]!, resonance: found.resonance }));
        return { ...row, tube: tube!, reinforces, warnings: tube!.warnings };
      } catch (error) {
        if (!isInputError(error)) throw error;
        // The bore is too wide for the note (closedTube refuses a tube shorter than its radius).
        const quarterWaveM = speedOfSound(air) / (4 * targetHz);
        const factor = endCorrectionFactors[instrument.resonator_end];
        const lengthM = quarterWaveM - (factor * bore) / 2000;
        return { ...row, warnings: tubePracticality({ lengthM, innerDiameterM: bore / 1000, quarterWaveM, endCorrectionFactor: factor, openEnd: instrument.resonator_end }) };
      }
    });
}

/** The project's tube list as CSV (tubeListCsv: RFC 4180, one row per sized tube, warnings included). */
export function projectTubeListCsv(project: ProjectFile): string {
  const rows = projectResonatorTubes(project)
    .map((entry) => entry.tube)
    .filter((tube): tube is TubeRow => tube !== null);
  return tubeListCsv(rows, project.instrument.air_temperature_c);
}

/** Sets a register's resonator bore (inner diameter, mm), within 10–250 mm. */
export function setResonatorBore(project: ProjectFile, registerId: string, innerDiameterMm: number): ProjectFile {
  const { min, max } = resonatorBoreRangeMm;
  if (!Number.isFinite(innerDiameterMm) || innerDiameterMm < min || innerDiameterMm > max) throw new InputError('resonators', 'inner diameter', `must lie within ${min}–${max} mm (got ${String(innerDiameterMm)})`);
  if (!project.instrument.registers.some((register) => register.id === registerId)) throw new InputError('project', 'register', `no register with id "${registerId}"`);
  const registers = project.instrument.registers.map((register) => (register.id === registerId ? { ...register, resonator_inner_diameter_mm: innerDiameterMm } : register));
  return syncSessionTargets({ ...project, instrument: { ...project.instrument, registers } });
}

/** Sets the longest tube the frame takes (mm, within 50–3000), or clears it (null: no limit). */
export function setResonatorFrame(project: ProjectFile, maxLengthMm: number | null): ProjectFile {
  const instrument = { ...project.instrument };
  if (maxLengthMm === null) {
    delete instrument.resonator_max_length_mm;
    return { ...project, instrument };
  }
  const { min, max } = resonatorFrameRangeMm;
  if (!Number.isFinite(maxLengthMm) || maxLengthMm < min || maxLengthMm > max) throw new InputError('resonators', 'longest tube', `must lie within ${min}–${max} mm (got ${String(maxLengthMm)})`);
  return { ...project, instrument: { ...instrument, resonator_max_length_mm: maxLengthMm } };
}
