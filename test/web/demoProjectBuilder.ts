// Builds fixtures/demo.project.json, the workbench's demo project: the invented workshop of the
// contract's demo scenario, building a 4⅓-octave wooden keyboard (A2–C7) at A4 = 442 Hz in a
// generic dense tropical hardwood, plus a set of aluminium chime tubes. The measurements are
// invented but plausible: each is the model's prediction for the bar as shaped, with a "real
// blank" whose stiffness differs from the workshop's starting guess (as real wood does), rounded
// to 0.1 Hz. Run: `npx tsx test/web/demoProjectBuilder.ts` (about a minute: it plans arches).
import { writeFileSync } from 'node:fs';
import { resolve } from 'node:path';
import { analyzeBar, cents, chimePieceBlank, noteToHz, parseChimeSetFile, parseProjectFile, serializeProjectFile, type BarFile, type ProjectBar, type ProjectFile, type Register } from '../../src/index.ts';

const a4 = 442;
/** The workshop's starting guess for its timber (the demo preset's values). */
const guess = { E_GPa: 18, G_GPa: 1.3, density_kg_m3: 1000, label: 'Dense tropical hardwood (workshop stock)' };
const aluminium = { E_GPa: 68.9, poisson: 0.33, density_kg_m3: 2700, label: 'Aluminium 6061-T6 tube' };

const registers: Register[] = [
  { id: 'bass', label: 'Bass (A2–B3)', family: 'keyboard', ratios: [1, 4, 10], tolerance_cents: [2, 5, 15], resonator_inner_diameter_mm: 88 },
  { id: 'middle', label: 'Middle (C4–B5)', family: 'keyboard', ratios: [1, 4, 10], tolerance_cents: [2, 5, 15], resonator_inner_diameter_mm: 58 },
  { id: 'treble', label: 'Treble (C6–C7)', family: 'keyboard', ratios: [1, 4], tolerance_cents: [2, 5], resonator_inner_diameter_mm: 40 },
  { id: 'chimes', label: 'Chime tubes', family: 'chime', ratios: [1], tolerance_cents: [3] },
];

/** A symmetric arch: full thickness at the ends, `minimum` mm at the middle, over `span` mm. */
function arch(length: number, thickness: number, minimum: number, span: number, power: number, intervals = 24): [number, number][] {
  const start = (length - span) / 2;
  const profile: [number, number][] = [[0, thickness]];
  for (let index = 0; index <= intervals; index += 1) {
    const x = start + (span * index) / intervals;
    const u = Math.abs((2 * index) / intervals - 1);
    profile.push([Math.round(x * 100) / 100, Math.round((minimum + (thickness - minimum) * u ** power) * 100) / 100]);
  }
  profile.push([length, thickness]);
  return profile.filter((pair, index, all) => index === 0 || pair[0] > all[index - 1]![0]);
}

function rectBar(label: string, length: number, width: number, thickness: number, material: BarFile['material'], profile?: [number, number][]): BarFile {
  const bar: BarFile = { format: 'barwright.bar', version: 1, label, length_mm: length, section: { shape: 'rect', width_mm: width, thickness_mm: thickness }, material };
  if (profile) bar.profile_mm = profile;
  return bar;
}

/** Nelder–Mead minimiser (small, for the fixture only). */
function minimise(f: (x: number[]) => number, start: number[], steps: number[], iterations: number): number[] {
  let simplex = [start, ...start.map((_, i) => start.map((v, j) => v + (i === j ? steps[i]! : 0)))].map((x) => ({ x, v: f(x) }));
  const n = start.length;
  for (let k = 0; k < iterations; k += 1) {
    simplex.sort((a, b) => a.v - b.v);
    const centre = start.map((_, j) => simplex.slice(0, n).reduce((sum, p) => sum + p.x[j]!, 0) / n);
    const worst = simplex[n]!;
    const along = (t: number) => centre.map((c, j) => c + t * (c - worst.x[j]!));
    const reflected = along(1);
    const fr = f(reflected);
    if (fr < simplex[0]!.v) {
      const expanded = along(2);
      const fe = f(expanded);
      simplex[n] = fe < fr ? { x: expanded, v: fe } : { x: reflected, v: fr };
    } else if (fr < simplex[n - 1]!.v) simplex[n] = { x: reflected, v: fr };
    else {
      const contracted = along(-0.5);
      const fc = f(contracted);
      if (fc < worst.v) simplex[n] = { x: contracted, v: fc };
      else simplex = simplex.map((p, i) => (i === 0 ? p : { x: p.x.map((v, j) => simplex[0]!.x[j]! + 0.5 * (v - simplex[0]!.x[j]!)), v: 0 })).map((p, i) => (i === 0 ? p : { x: p.x, v: f(p.x) }));
    }
  }
  simplex.sort((a, b) => a.v - b.v);
  return simplex[0]!.x;
}

/** Plans a finished arch (length, minimum thickness, span fraction, arch power) for a note. */
function planArch(note: string, ratios: number[], startLength: number, width: number, thickness: number, material: BarFile['material'], iterations = 220) {
  const targets = ratios.map((ratio) => noteToHz(note, a4) * ratio);
  const make = (x: number[]) => {
    const length = Math.round(x[0]! * 10) / 10;
    return rectBar(note, length, width, thickness, material, arch(length, thickness, x[1]!, length * x[2]!, x[3]!));
  };
  const cost = (x: number[]) => {
    if (x[1]! < thickness * 0.22 || x[1]! > thickness || x[2]! < 0.25 || x[2]! > 0.8 || x[3]! < 1 || x[3]! > 4) return 1e12;
    const result = analyzeBar(make(x), { modes: ratios.length });
    return result.bending.reduce((sum, mode, i) => sum + cents(mode.hz, targets[i]!) ** 2, 0);
  };
  const x = minimise(cost, [startLength, thickness * 0.35, 0.54, 3.4], [15, 1.5, 0.05, 0.3], iterations);
  return { length: Math.round(x[0]! * 10) / 10, minimum: x[1]!, spanFraction: x[2]!, power: x[3]! };
}

/** The partials a real blank (material `real`) gives for a shape, rounded to 0.1 Hz. */
function measure(bar: BarFile, real: BarFile['material'], partials: number): number[] {
  return analyzeBar({ ...bar, material: real }, { modes: partials }).bending.map((mode) => Math.round(mode.hz * 10) / 10);
}

function day(dayOfMarch: number, hour: number, minute: number): string {
  return new Date(Date.UTC(2025, 2, dayOfMarch, hour, minute)).toISOString();
}

interface BarPlanInput {
  note: string;
  register: string;
  width: number;
  thickness: number;
  startLength: number;
  /** Stiffness of the real blank against the guess (E factor, G factor). */
  real: [number, number];
  /** Depth of each measured shape as a fraction of the planned arch's depth (0 = uncut blank). */
  rounds: number[];
  state: ProjectBar['state'];
  notes: string;
  /** Plan against the real blank (a bar tuned to the end) rather than the guess. */
  finishedTo?: 'real';
}

function keyboardBar(input: BarPlanInput, registersById: Map<string, Register>, firstDay: number): ProjectBar {
  const register = registersById.get(input.register)!;
  const real = { E_GPa: Math.round(guess.E_GPa * input.real[0] * 100) / 100, G_GPa: Math.round(guess.G_GPa * input.real[1] * 1000) / 1000, density_kg_m3: guess.density_kg_m3 };
  const planned = planArch(input.note, register.ratios, input.startLength, input.width, input.thickness, input.finishedTo === 'real' ? real : guess, input.finishedTo === 'real' ? 500 : 220);
  const blank = rectBar(input.note, planned.length, input.width, input.thickness, guess);
  const shapeAt = (fraction: number): BarFile => {
    if (fraction === 0) return structuredClone(blank);
    const minimum = input.thickness - fraction * (input.thickness - planned.minimum);
    return rectBar(input.note, planned.length, input.width, input.thickness, guess, arch(planned.length, input.thickness, Math.round(minimum * 100) / 100, planned.length * planned.spanFraction, planned.power));
  };
  const partials = Math.max(3, register.ratios.length);
  const steps = input.rounds.map((fraction, index) => {
    const bar = shapeAt(fraction);
    const count = Math.min(partials, register.ratios.length);
    const predicted = analyzeBar(bar, { modes: count }).bending.map((mode) => Math.round(mode.hz * 10) / 10);
    return { bar, measured_hz: measure(bar, real, count), predicted_hz: predicted, recorded_at: day(firstDay + index, 9 + index, 15), source: index % 2 === 0 ? ('microphone' as const) : ('typed' as const) };
  });
  const current = input.state === 'rough' ? shapeAt(0.7) : steps.length > 0 ? structuredClone(steps[steps.length - 1]!.bar) : structuredClone(blank);
  return {
    id: `bar-${input.note}`,
    note: input.note,
    register: input.register,
    state: input.state,
    blank,
    current,
    design: null,
    session: {
      format: 'barwright.session',
      version: 1,
      target: { note: input.note, a4, ratios: [...register.ratios], tolerance_cents: [...register.tolerance_cents] },
      limits: { min_thickness_mm: Math.round(input.thickness * 0.25 * 10) / 10 },
      steps,
    },
    advice: null,
    notes: input.notes,
    updated_at: steps.length > 0 ? steps[steps.length - 1]!.recorded_at : day(firstDay, 8, 0),
  };
}

function uniformBar(note: string, register: string, length: number, width: number, thickness: number, registersById: Map<string, Register>, notes: string): ProjectBar {
  const reg = registersById.get(register)!;
  const blank = rectBar(note, length, width, thickness, guess);
  return {
    id: `bar-${note}`,
    note,
    register,
    state: 'not-started',
    blank,
    current: structuredClone(blank),
    design: null,
    session: { format: 'barwright.session', version: 1, target: { note, a4, ratios: [...reg.ratios], tolerance_cents: [...reg.tolerance_cents] }, limits: { min_thickness_mm: Math.round(thickness * 0.25 * 10) / 10 }, steps: [] },
    advice: null,
    notes,
    updated_at: day(1, 8, 0),
  };
}

/** The demo's chime set: a C5 pentatonic octave of 1 in aluminium tube (25.4 × 1.6 mm), fundamental tuned, open tops. */
const chimeSet = parseChimeSetFile(
  {
    format: 'barwright.chime-set',
    version: 1,
    name: 'Demo workshop chime tubes',
    a4_hz: a4,
    notes: ['C5', 'D5', 'E5', 'G5', 'A5', 'C6'],
    tune: 'fundamental',
    stock: { section: { shape: 'tube', outer_diameter_mm: 25.4, wall_mm: 1.6 }, material: { E_GPa: aluminium.E_GPa, density_kg_m3: aluminium.density_kg_m3, poisson: aluminium.poisson }, bar_length_mm: 2000 },
    end_masses: [],
    saw_kerf_mm: 2,
  },
  'demo chime set',
);

/** An aluminium chime tube cut to the chime set's length for its note (fundamental only), 25.4 × 1.6 mm. */
function chimeTube(note: string, measured: boolean, registersById: Map<string, Register>): ProjectBar {
  const reg = registersById.get('chimes')!;
  const bar: BarFile = { ...chimePieceBlank(chimeSet, note), label: `${note} chime` };
  // The real tube is a shade stiffer than the data sheet (+0.15 %): it rings about a cent sharp, within tolerance.
  const real = { ...chimeSet.stock.material, E_GPa: 69.0 };
  const steps = measured ? [{ bar, measured_hz: measure(bar, real, 1), recorded_at: day(6, 14, 40), source: 'microphone' as const }] : [];
  return {
    id: `chime-${note}`,
    note,
    register: 'chimes',
    state: measured ? 'done' : 'not-started',
    blank: bar,
    current: structuredClone(bar),
    design: null,
    session: { format: 'barwright.session', version: 1, target: { note, a4, ratios: [...reg.ratios], tolerance_cents: [...reg.tolerance_cents] }, limits: { min_thickness_mm: 1 }, steps },
    advice: null,
    notes: measured ? 'Hung at the first node with 1.5 mm cord.' : '',
    updated_at: measured ? day(6, 14, 40) : day(1, 8, 0),
  };
}

/** Builds the demo project (validated). */
export function buildDemoProject(): ProjectFile {
  const byId = new Map(registers.map((register) => [register.id, register]));
  const bars: ProjectBar[] = [
    keyboardBar({ note: 'A2', register: 'bass', width: 62, thickness: 24, startLength: 558, real: [0.95, 0.9], rounds: [0, 0.8, 0.96], state: 'tuning', notes: 'Slight curl in the grain near the left end.' }, byId, 3),
    keyboardBar({ note: 'E3', register: 'bass', width: 60, thickness: 23, startLength: 450, real: [1, 1], rounds: [], state: 'rough', notes: 'Rough arch cut with the band saw; resting before tuning.' }, byId, 4),
    keyboardBar({ note: 'A3', register: 'bass', width: 56, thickness: 22, startLength: 362, real: [1.04, 0.95], rounds: [0, 0.97], state: 'tuning', notes: '' }, byId, 7),
    keyboardBar({ note: 'C4', register: 'middle', width: 52, thickness: 21, startLength: 320, real: [0.97, 1.05], rounds: [0, 0.6, 0.9, 0.9996], state: 'done', notes: 'Finished; cord holes drilled at the final nodes.', finishedTo: 'real' }, byId, 10),
    uniformBar('A4', 'middle', 300, 46, 20, byId, ''),
    uniformBar('E5', 'middle', 262, 43, 19, byId, ''),
    uniformBar('C7', 'treble', 170, 38, 18, byId, 'Top bar: fundamental and second partial only.'),
    chimeTube('C5', true, byId),
    chimeTube('E5', false, byId),
    chimeTube('G5', false, byId),
  ];
  const project: ProjectFile = {
    format: 'barwright.project',
    version: 2,
    id: 'demo-workshop-keyboard',
    name: 'Demo workshop: keyboard A2–C7 and chimes',
    revision: 0,
    saved_at: null,
    instrument: {
      name: '4⅓-octave wooden keyboard with chime set',
      lowest_note: 'A2',
      highest_note: 'C7',
      a4_hz: a4,
      material: guess,
      registers,
      air_temperature_c: 22,
      resonator_end: 'unflanged',
    },
    bars,
    chime_set: chimeSet,
  };
  return parseProjectFile(project, 'demo project');
}

if (process.argv[1] && resolve(process.argv[1]) === resolve(import.meta.filename)) {
  const target = resolve(import.meta.dirname, '../../fixtures/demo.project.json');
  writeFileSync(target, serializeProjectFile(buildDemoProject(), 'demo project'));
  console.log(`wrote ${target}`);
}
