import { midiToNoteName } from '../fileFormats/noteName.ts';
import { hzToNote } from '../pitch/hzToNote.ts';
import { midiToHz } from '../fileFormats/concertPitch.ts';
import { parseNote } from '../fileFormats/noteName.ts';
import type { ChimeSetFile } from '../fileFormats/chimeSetFile.ts';
import type { ChimePartial } from './analyzeChime.ts';
import { chimeForNote } from './chimeForNote.ts';
import type { ChimeStock } from './chimeStock.ts';
import { cuttingPlan, type CuttingPlan } from './cuttingPlan.ts';
import { metalCautions } from './workshopCautions.ts';

/** One chime of a planned set (mm, Hz, cents). */
export interface ChimeRow {
  note: string;
  midi: number;
  target_hz: number;
  length_mm: number;
  /** Tuned pitch minus target at the computed length, cents. */
  cents_error: number;
  /** mm from the top end. */
  hanging_point_mm: number;
  hanging_point_fraction: number;
  lower_node_mm: number;
  hanging_point_shift_mm?: number;
  strike_hz: number;
  /** The strike note's nearest note name and cents from it. */
  strike_note: string;
  strike_cents: number;
  fundamental_hz: number;
  partials: ChimePartial[];
  warnings: string[];
}

/** A planned chime set. */
export interface ChimeSetPlan {
  name: string;
  a4_hz: number;
  tune: 'fundamental' | 'strike';
  stock: ChimeStock;
  chimes: ChimeRow[];
  cutting?: CuttingPlan;
  total_length_mm: number;
  cautions: readonly string[];
}

/** Below this length-to-diameter ratio a 1D beam model of a chime is rough (common practice for beam theory, from memory). */
const slenderLimit = 8;

/**
 * Plans a chime set: for every note (lowest first), the length at which the chosen pitch sounds
 * the note (chimeForNote: Timoshenko with Cowper's κ, plugs as rigid end masses), its partials
 * and intervals, strike note, hanging point and warnings; with a stock length, a cutting plan.
 * Pure and synchronous (about 20 ms a chime).
 */
export function planChimeSet(file: ChimeSetFile): ChimeSetPlan {
  const stock: ChimeStock = { section: file.stock.section, material: file.stock.material, end_masses: file.end_masses };
  const diameter = file.stock.section.shape === 'tube' ? file.stock.section.outer_diameter_mm : file.stock.section.diameter_mm;
  const notes = file.notes.map((name) => parseNote(name).midi).sort((a, b) => a - b);
  const offsetOf = (midi: number): number => {
    for (const [key, value] of Object.entries(file.offsets_cents)) if (parseNote(key).midi === midi) return value;
    return 0;
  };
  const chimes = notes.map((midi): ChimeRow => {
    const name = midiToNoteName(midi, file.spelling);
    const target = midiToHz(midi, file.a4_hz) * 2 ** (offsetOf(midi) / 1200);
    const chime = chimeForNote(stock, target, { tune: file.tune });
    const strike = hzToNote(chime.strike.hz, file.a4_hz, file.spelling);
    const warnings = [...chime.warnings];
    if (chime.length_mm < slenderLimit * diameter) warnings.push(`length is only ${(chime.length_mm / diameter).toFixed(1)} diameters: the beam model is rough for so stubby a piece`);
    const row: ChimeRow = {
      note: name,
      midi,
      target_hz: target,
      length_mm: chime.length_mm,
      cents_error: chime.cents_error,
      hanging_point_mm: chime.hanging_point_mm,
      hanging_point_fraction: chime.hanging_point_fraction,
      lower_node_mm: chime.lower_node_mm,
      strike_hz: chime.strike.hz,
      strike_note: strike.name,
      strike_cents: strike.cents,
      fundamental_hz: chime.partials[0]!.hz,
      partials: chime.partials,
      warnings,
    };
    if (chime.hanging_point_shift_mm !== undefined) row.hanging_point_shift_mm = chime.hanging_point_shift_mm;
    return row;
  });
  const plan: ChimeSetPlan = {
    name: file.name,
    a4_hz: file.a4_hz,
    tune: file.tune,
    stock,
    chimes,
    total_length_mm: chimes.reduce((sum, c) => sum + c.length_mm, 0),
    cautions: metalCautions,
  };
  if (file.stock.bar_length_mm !== undefined)
    plan.cutting = cuttingPlan(chimes.map((c) => ({ label: c.note, length_mm: Math.ceil(c.length_mm * 10) / 10 })), file.stock.bar_length_mm, file.saw_kerf_mm);
  return plan;
}
