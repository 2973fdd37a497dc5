import { checkA4, midiToHz, midiToNoteName, parseNote, InputError, roundDecimals as round } from '../../fileFormats/index.ts';
import { calibrateEndCorrection, endCorrectionFactors, type OpenEnd, tubeListCsv, tubeSet, type TubeRow, type AirConditions } from '../../resonator/index.ts';
import { fixed, formatTable, numberOption, parseOptions, toJson, type Command } from '../command.ts';

const source = 'command line';


/** Parses "1:4:10" into ratios, each ≥ 1 and the first exactly 1. */
function parseRatios(text: string): number[] {
  const ratios = text.split(':').map((part) => Number(part));
  if (ratios.length < 1 || ratios.some((r) => !Number.isFinite(r) || r < 1) || ratios[0] !== 1) {
    throw new InputError(source, '--ratios', `"${text}" must read like 1:4:10 (starting at 1, each ≥ 1)`);
  }
  return ratios;
}

/** One tube as `tubes --json` prints it. */
function tubeJson(row: TubeRow, extra: Record<string, unknown>): Record<string, unknown> {
  return {
    ...(row.label ? { note: row.label } : {}),
    target_hz: round(row.targetHz, 3),
    length_mm: round(row.lengthMm, 1),
    speed_of_sound_m_s: round(row.speedOfSoundMS, 2),
    end_correction_mm: round(row.endCorrectionMm, 2),
    harmonics_hz: row.harmonicsHz.map((h) => round(h, 2)),
    inner_diameter_mm: round(row.innerDiameterMm, 2),
    reinforces_partials: row.reinforcedPartials,
    detune_cents_per_c: round(row.detuneCentsPerDegree, 3),
    ...extra,
  };
}

/** `barwright tubes`: closed-bottom resonator length for a note, or a whole range as CSV (contract). */
export const tubesCommand: Command = {
  name: 'tubes',
  summary: 'closed-bottom resonator tubes: length for a note from bore and air temperature; a set as CSV',
  usage:
    'barwright tubes (--note NAME | --hz F | --range LOW:HIGH) [--a4 HZ] --inner-diameter-mm D [--temp-c T] [--humidity-pct RH] [--flanged] [--ratios 1:4:10] [--calibrate-length-mm L --calibrate-hz F [--calibrate-diameter-mm D] [--calibrate-temp-c T]] [--csv | --json]',
  async run(args, io) {
    const { values, positionals } = parseOptions(args, {
      note: { type: 'string' },
      hz: { type: 'string' },
      range: { type: 'string' },
      a4: { type: 'string' },
      'inner-diameter-mm': { type: 'string' },
      'temp-c': { type: 'string' },
      'humidity-pct': { type: 'string' },
      flanged: { type: 'boolean' },
      ratios: { type: 'string' },
      'calibrate-length-mm': { type: 'string' },
      'calibrate-hz': { type: 'string' },
      'calibrate-diameter-mm': { type: 'string' },
      'calibrate-temp-c': { type: 'string' },
      csv: { type: 'boolean' },
      json: { type: 'boolean' },
    });
    if (positionals.length > 0) throw new InputError(source, 'arguments', `unexpected "${positionals[0]}" (tubes takes options only)`);
    const chosen = [values.note, values.hz, values.range].filter((v) => v !== undefined).length;
    if (chosen !== 1) throw new InputError(source, '--note', 'give exactly one of --note NAME, --hz F or --range LOW:HIGH');
    if (values.csv && values.json) throw new InputError(source, '--csv', 'choose --csv or --json, not both');
    const positive = (n: number) => (n > 0 ? null : 'must be greater than 0');
    const a4Hz = checkA4(numberOption(values.a4, 'a4') ?? 440, source, '--a4');
    const diameterMm = numberOption(values['inner-diameter-mm'], 'inner-diameter-mm', positive);
    if (diameterMm === undefined) throw new InputError(source, '--inner-diameter-mm', 'the tube\'s inner diameter is required');
    const temperatureRule = (n: number) => (n >= -30 && n <= 60 ? null : `${n} °C is outside −30…60 °C`);
    const air: AirConditions = {
      temperatureC: numberOption(values['temp-c'], 'temp-c', temperatureRule) ?? 20,
      relativeHumidityPercent: numberOption(values['humidity-pct'], 'humidity-pct', (n) => (n >= 0 && n <= 100 ? null : `${n} % is outside 0…100 %`)) ?? 0,
    };
    const openEnd: OpenEnd = values.flanged ? 'flanged' : 'unflanged';
    const ratios = parseRatios(values.ratios ?? '1:4:10');

    let endCorrectionFactor: number | undefined;
    let calibration: Record<string, unknown> = {};
    if (values['calibrate-length-mm'] !== undefined || values['calibrate-hz'] !== undefined) {
      const lengthMm = numberOption(values['calibrate-length-mm'], 'calibrate-length-mm', positive);
      const measuredHz = numberOption(values['calibrate-hz'], 'calibrate-hz', positive);
      if (lengthMm === undefined || measuredHz === undefined) throw new InputError(source, '--calibrate-hz', 'calibration needs both --calibrate-length-mm and --calibrate-hz');
      const measuredDiameterMm = numberOption(values['calibrate-diameter-mm'], 'calibrate-diameter-mm', positive) ?? diameterMm;
      const measuredTempC = numberOption(values['calibrate-temp-c'], 'calibrate-temp-c', temperatureRule) ?? air.temperatureC;
      const result = calibrateEndCorrection(
        { lengthM: lengthMm / 1000, innerDiameterM: measuredDiameterMm / 1000, measuredHz, air: { ...air, temperatureC: measuredTempC } },
        source,
      );
      endCorrectionFactor = result.factorOfRadius;
      calibration = { end_correction_factor: round(result.factorOfRadius, 4), calibrated_from: { length_mm: lengthMm, hz: measuredHz, inner_diameter_mm: measuredDiameterMm, temp_c: measuredTempC } };
    }

    const requests: { label: string; targetHz: number; innerDiameterM: number }[] = [];
    if (values.range !== undefined) {
      const [low, high, ...rest] = values.range.split(':');
      if (low === undefined || high === undefined || rest.length > 0) throw new InputError(source, '--range', `"${values.range}" must read like A2:C7`);
      const from = parseNote(low, source, '--range').midi;
      const to = parseNote(high, source, '--range').midi;
      if (to < from || to - from > 96) throw new InputError(source, '--range', `"${values.range}" must go upwards, at most 8 octaves`);
      for (let midi = from; midi <= to; midi++) requests.push({ label: midiToNoteName(midi), targetHz: midiToHz(midi, a4Hz), innerDiameterM: diameterMm / 1000 });
    } else if (values.note !== undefined) {
      requests.push({ label: values.note.trim(), targetHz: midiToHz(parseNote(values.note, source, '--note').midi, a4Hz), innerDiameterM: diameterMm / 1000 });
    } else {
      const hz = numberOption(values.hz, 'hz', (n) => (n >= 20 && n <= 20_000 ? null : 'must be between 20 and 20000 Hz'))!;
      requests.push({ label: '', targetHz: hz, innerDiameterM: diameterMm / 1000 });
    }
    const rows = tubeSet(requests, { air, openEnd, endCorrectionFactor }, ratios, source);
    const extra = {
      temp_c: air.temperatureC,
      relative_humidity_pct: air.relativeHumidityPercent,
      open_end: openEnd,
      end_correction_factor: round(endCorrectionFactor ?? endCorrectionFactors[openEnd], 4),
      a4_hz: a4Hz,
      ...calibration,
    };

    if (values.csv) {
      io.stdout(tubeListCsv(rows, air.temperatureC));
      return 0;
    }
    if (values.json) {
      io.stdout(toJson(values.range !== undefined ? { ...extra, tubes: rows.map((row) => tubeJson(row, {})) } : tubeJson(rows[0]!, extra)));
      return 0;
    }
    const lines = [
      `Closed-bottom tubes, ${openEnd} open end (end correction ${fixed(endCorrectionFactor ?? endCorrectionFactors[openEnd], 4)} × radius${endCorrectionFactor !== undefined ? ', calibrated' : ''}), air ${fixed(air.temperatureC, 1)} °C, ${fixed(air.relativeHumidityPercent ?? 0, 0)} % RH, A4 = ${a4Hz} Hz`,
      `speed of sound ${fixed(rows[0]!.speedOfSoundMS, 2)} m/s; pitch drifts ${fixed(rows[0]!.detuneCentsPerDegree, 2)} cents per °C (flat when colder)`,
      '',
      formatTable([
        ['note', 'target Hz', 'bore mm', 'length mm', 'end corr. mm', 'resonances Hz', `reinforces partials (bar ${ratios.join(':')})`],
        ...rows.map((row) => [
          row.label || '—',
          fixed(row.targetHz, 2),
          fixed(row.innerDiameterMm, 1),
          fixed(row.lengthMm, 1),
          fixed(row.endCorrectionMm, 1),
          row.harmonicsHz.map((h) => fixed(h, 1)).join(', '),
          row.reinforcedPartials.join(', ') || '—',
        ]),
      ]),
      '',
      ...rows.flatMap((row) => row.warnings.map((warning) => `${row.label ? `${row.label}: ` : ''}${warning.message} ${warning.remedies.join(' ')}`)),
      'Length is from the closed bottom (inside face of the stopper) to the open end. Cut long, then trim while listening.',
    ];
    io.stdout(lines.join('\n'));
    return 0;
  },
};
