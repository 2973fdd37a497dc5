// How far bars and their tubes drift apart with the air temperature: a wooden bar goes flat as
// the room warms while a closed tube's air column goes sharp, so a keyboard tuned at one
// temperature and played at another has its tubes off their bars by the sum of the two.
import { pitchTemperatureCoefficient } from '../material/pitchTemperatureCoefficient.ts';
import { detuneCentsPerDegree } from '../resonator/closedTube.ts';
import { barTemperature } from './projectSessionContext.ts';
import type { ProjectFile } from './projectFileTypes.ts';

/** One bar coefficient and how far a tube drifts from a bar with it. */
export interface BarTubeDrift {
  /** The bar's pitch coefficient, cents per °C (negative: flatter when warmer). */
  barCentsPerC: number;
  /** Where the bar's coefficient comes from (the material, a default, or learnt from its rounds). */
  source: string;
  /** Which kind of source: the material as given, a preset, the stated default, or the bar's own rounds. */
  from: 'bar file' | 'preset' | 'default' | 'learnt';
  /** Tube minus bar, cents per °C: how far the tube's pitch moves away from its bar per °C. */
  apartCentsPerC: number;
}

/** The playing temperature's drift between bars and tubes: the instrument's material, and each bar that learnt its own. */
export interface TemperatureDrift {
  /** The playing temperature, °C (tubes are sized for it and readings are projected to it). */
  playingC: number;
  /** The tube's pitch coefficient at the playing temperature, cents per °C (dry air, closed form). */
  tubeCentsPerC: number;
  /** For the instrument's starting material. */
  instrument: BarTubeDrift;
  /** Bars whose rounds taught them their own coefficient, by note. */
  learnt: (BarTubeDrift & { barId: string; note: string })[];
}

/**
 * How far bar and tube drift apart per °C around the playing temperature: the tube's coefficient
 * (detuneCentsPerDegree, f ∝ √T) minus the bar's (the material's `pitch_cents_per_c`, a preset's,
 * or the stated default; a bar's own once two readings of its unchanged shape at different
 * temperatures decided it).
 */
export function temperatureDrift(project: ProjectFile): TemperatureDrift {
  const playingC = project.instrument.air_temperature_c;
  const tubeCentsPerC = detuneCentsPerDegree(playingC);
  const material = pitchTemperatureCoefficient(project.instrument.material);
  const drift = (barCentsPerC: number, source: string, from: BarTubeDrift['from']): BarTubeDrift => ({ barCentsPerC, source, from, apartCentsPerC: tubeCentsPerC - barCentsPerC });
  const learnt = project.bars.flatMap((bar) => {
    const temperature = barTemperature(project, bar);
    return temperature?.from === 'learnt' ? [{ barId: bar.id, note: bar.note, ...drift(temperature.centsPerC, 'learnt from its rounds', 'learnt') }] : [];
  });
  return { playingC, tubeCentsPerC, instrument: drift(material.centsPerC, material.source, material.from), learnt };
}
