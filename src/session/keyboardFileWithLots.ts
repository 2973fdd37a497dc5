import type { BarFileMaterial } from '../fileFormats/barFile.ts';
import type { KeyboardFile } from '../fileFormats/keyboardFileTypes.ts';
import type { LotFile } from '../fileFormats/lotFile.ts';
import { midiToNoteName, parseNote } from '../fileFormats/noteName.ts';
import { roundDecimals as round } from '../fileFormats/roundDecimals.ts';
import { materialFromFile } from '../modes/BarModel.ts';
import { lotPrior } from './lotPrior.ts';

/** A note whose planning material now comes from a lot. */
export interface LotMaterialNote {
  note: string;
  lot: string;
  /** The material it is planned with: the lot's moduli (GPa) at the keyboard's density (kg/m³). */
  material: { E_GPa: number; G_GPa: number; density_kg_m3: number; poisson?: number; pitch_cents_per_c?: number };
}

/**
 * The keyboard file with the remaining bars of each lot planned from what the lot's finished bars
 * taught: every note in a lot's `notes` span that has no characterised material of its own
 * (`bar_materials`) gets the lot's E/ρ and G/ρ at the keyboard material's density (and the lot's
 * temperature coefficient when learnt), so `plan` re-advises its blank and redesigns it (the plan's
 * fingerprints see the new material). Lots without a span or without finished bars change nothing.
 */
export function keyboardFileWithLots(file: KeyboardFile, lots: LotFile): { file: KeyboardFile; notes: LotMaterialNote[] } {
  const density = materialFromFile(file.material).density;
  const lowest = parseNote(file.range.lowest).midi;
  const highest = parseNote(file.range.highest).midi;
  const own = new Set(Object.keys(file.bar_materials).map((name) => parseNote(name).midi));
  const bar_materials: Record<string, BarFileMaterial> = { ...file.bar_materials };
  const notes: LotMaterialNote[] = [];
  for (const [name, entry] of Object.entries(lots.lots)) {
    const prior = lotPrior(name, entry.bars);
    if (!prior || !entry.notes) continue;
    const material: LotMaterialNote['material'] = {
      E_GPa: round((Math.exp(prior.lnSpecificYoung.mean) * density) / 1e9, 4),
      G_GPa: round((Math.exp(prior.lnSpecificShear.mean) * density) / 1e9, 5),
      density_kg_m3: density,
    };
    if ('poisson' in file.material && file.material.poisson !== undefined) material.poisson = file.material.poisson;
    if (prior.pitch) material.pitch_cents_per_c = round(prior.pitch.centsPerC, 3);
    const from = Math.max(lowest, parseNote(entry.notes.from).midi);
    const to = Math.min(highest, parseNote(entry.notes.to).midi);
    for (let midi = from; midi <= to; midi++) {
      if (own.has(midi)) continue;
      const note = midiToNoteName(midi, file.spelling);
      bar_materials[note] = material;
      notes.push({ note, lot: name, material });
    }
  }
  return { file: { ...file, bar_materials }, notes };
}
