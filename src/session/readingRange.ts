// What a reading of a partial can be for the piece on the bench: refused at the field beyond it.

/** How far a reading may lie from what the piece's shape should sound: two octaves either way (a factor of 4). */
export const readingSpanFactor = 4;

/**
 * The range each partial's reading may lie in, Hz: from a quarter to four times what the present
 * shape should sound (`expectedHz`: the calibrated prediction, else the target), rounded outward
 * to three significant figures. Two octaves either side covers any starting guess of the timber
 * (±20 % in E is ±1.6 semitones) and any octave slip worth catching later; a reading beyond it is
 * a typo or another piece, never this bar.
 */
export function readingRangesHz(expectedHz: readonly number[]): [number, number][] {
  const round = (value: number, direction: 'down' | 'up'): number => {
    const scale = 10 ** (Math.floor(Math.log10(value)) - 2);
    return Number(((direction === 'down' ? Math.floor(value / scale) : Math.ceil(value / scale)) * scale).toPrecision(12));
  };
  return expectedHz.map((hz) => [round(hz / readingSpanFactor, 'down'), round(hz * readingSpanFactor, 'up')]);
}
