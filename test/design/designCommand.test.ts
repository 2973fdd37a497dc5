// `barwright design` against the contract: JSON shape, written files, exit codes and messages.
import { describe, expect, it } from 'vitest';
import { main } from '../../src/cli/main.ts';
import { parseBarFile } from '../../src/fileFormats/barFile.ts';
import { captureIo as capture } from '../cli/captureIo.ts';


describe('barwright design', () => {
  it('prints one JSON document with the contract fields, and writes the bar, template and table', async () => {
    const io = capture();
    const code = await main(['design', 'fixtures/c5-blank.bar.json', '--note', 'C5', '--a4', '442', '--ratios', '1:4', '--out', 'x.bar.json', '--template', 'x.svg', '--table', 'x.csv', '--json'], io);
    expect(io.err).toEqual([]);
    expect(code).toBe(0);
    expect(io.out).toHaveLength(1);
    const result = JSON.parse(io.out[0]!);
    expect(result.feasible).toBe(true);
    expect(result.bar.format).toBe('barwright.bar');
    expect(result.bar.profile_mm.length).toBeGreaterThan(10);
    // C5 at A4 = 442: 442·2^(3/12) Hz (MIDI 1.0), ratios 1:4.
    expect(result.target_hz[0]).toBeCloseTo(442 * 2 ** (3 / 12), 2);
    expect(result.target_hz[1]).toBeCloseTo(4 * 442 * 2 ** (3 / 12), 2);
    expect(result.predicted_hz).toHaveLength(2);
    expect(result.cents_error).toHaveLength(2);
    expect(result.station_table[0]).toEqual({ from_left_mm: 0, from_centre_mm: -140, thickness_mm: 21, depth_mm: 0 });
    expect(result.cautions.join(' ')).toMatch(/respirator.*CITES.*cut less than predicted/is);
    expect(parseBarFile(JSON.parse(io.files.get('x.bar.json')!), 'x.bar.json')).toEqual(result.bar);
    expect(io.files.get('x.svg')).toMatch(/^<\?xml[\s\S]*width="300mm"[\s\S]*<\/svg>\n$/);
    // The designed bar has its cord holes: the table marks them.
    expect(io.files.get('x.csv')!.split('\n')[0]).toBe('from_left_mm,from_centre_mm,thickness_mm,depth_mm,mark');
    expect(io.files.get('x.csv')).toMatch(/\n[\d.]+,-[\d.]+,21,0,cord hole 6 mm\n/);
    expect(io.files.get('x.svg')).toMatch(/cord hole 6 mm at [\d.]+/);
    expect(result.limit_sources.tool_radius_mm).toMatch(/spindle sander/);
  });
  it('prints a table a maker can read, with the where-to-cut map on request', async () => {
    const io = capture();
    expect(await main(['design', 'fixtures/c5-blank.bar.json', '--hz', '525.63', '--ratios', '1:4', '--map'], io)).toBe(0);
    const text = io.out[0]!;
    expect(text).toMatch(/Feasible: every partial within tolerance\./);
    expect(text).toMatch(/partial\s+target Hz\s+predicted Hz\s+cents\s+tolerance/);
    expect(text).toMatch(/Cord holes: 6\.0 mm at [\d.]+ mm and [\d.]+ mm from the left end \(the nodes of the fundamental: [\d.]+, [\d.]+ mm\), 3\.0 mm clear of the arch\./);
    expect(text).toMatch(/Drilling them moves the partials by [+−][\d.]+, [+−][\d.]+ cents: drill first/);
    expect(text).toMatch(/Where to cut: cents per 0\.1 mm removed over 10 mm/);
    expect(text).toMatch(/Caution: Power tools/);
    expect(text).not.toMatch(/NaN|Infinity/);
  });
  it('explains an infeasible request, with remedies, and still exits 0', async () => {
    const io = capture();
    expect(await main(['design', 'fixtures/c7-blank.bar.json', '--note', 'C7', '--a4', '442', '--json'], io)).toBe(0);
    const result = JSON.parse(io.out[0]!);
    expect(result.feasible).toBe(false);
    expect(typeof result.reason).toBe('string');
    expect(Array.isArray(result.remedies)).toBe(true);
    for (const remedy of result.remedies) expect(Object.keys(remedy)).toEqual(expect.arrayContaining(['kind', 'value', 'cents_gained']));
  }, 180_000);
  it('takes its limits from a workshop file, explicit options overriding', async () => {
    const io = capture();
    expect(await main(['design', 'fixtures/c5-blank.bar.json', '--note', 'C5', '--a4', '442', '--ratios', '1:4', '--workshop', 'fixtures/demo.workshop.json', '--max-slope', '0.8', '--json'], io)).toBe(0);
    const result = JSON.parse(io.out[0]!);
    expect(result.workshop).toBe('Demo workshop');
    expect(result.limits.max_slope).toBe(0.8);
    expect(result.limit_sources.max_slope).toBe('given on the command line');
    expect(result.limits.min_tool_radius_mm).toBe(9.5);
    expect(result.limit_sources.tool_radius_mm).toMatch(/19 mm sleeve/);
  });
  it.each([
    [['design', 'fixtures/c5-blank.bar.json'], 'command line: --note: give either --note NAME or --hz F'],
    [['design', 'fixtures/c5-blank.bar.json', '--note', 'C5', '--hz', '500'], 'command line: --note: give either --note NAME or --hz F'],
    [['design', 'fixtures/c5-blank.bar.json', '--note', 'Q5'], 'command line: note: "Q5" is not a note name'],
    [['design', 'fixtures/c5-blank.bar.json', '--note', 'C5', '--ratios', '1:2:1'], 'command line: ratios: ratios must increase by more than 5 % each (2 then 1)'],
    [['design', 'fixtures/c5-blank.bar.json', '--note', 'C5', '--min-thickness-mm', '25'], "command line: min_thickness_mm: 25 mm is not less than the blank's 21 mm"],
    [['design', 'fixtures/c5-blank.bar.json', '--note', 'C5', '--max-slope', 'steep'], 'command line: --max-slope: "steep" is not a number'],
    [['design', 'fixtures/c5-blank.bar.json', '--note', 'C5', '--max-shortening-mm', '5'], 'command line: max_shortening_mm: needs allow_shortening: true'],
    [['design', 'fixtures/chime-g4.bar.json', '--note', 'G4'], 'command line: section.shape: only rect bars are undercut (this bar is a tube)'],
    [['design', 'fixtures/missing.bar.json', '--note', 'G4'], 'fixtures/missing.bar.json: file: file not found'],
    [['design', 'fixtures/c5-blank.bar.json', '--note', 'C5', '--workshop', 'fixtures/c5-blank.bar.json'], 'fixtures/c5-blank.bar.json: format: must be "barwright.workshop"'],
  ])('exits 2 with one line for %j', async (args, message) => {
    const io = capture();
    expect(await main(args, io)).toBe(2);
    expect(io.err).toHaveLength(1);
    expect(io.err[0]).toContain(message);
    expect(io.out).toEqual([]);
  });
});
