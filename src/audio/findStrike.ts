/** Where the strike is in a recording. */
export interface Strike {
  /** First sample of the strike's rise: the end of the quiet before it, where the partials start. */
  onsetIndex: number;
  /** Sample of the largest magnitude: the strike itself. */
  peakIndex: number;
  /** Largest magnitude, full scale = 1. */
  peakMagnitude: number;
}

/**
 * Finds the strike: the sample of largest magnitude, and the onset: walking back from it in 1 ms
 * blocks while each block's peak magnitude stays above a tenth of the strike's (−20 dB), then
 * forward to the first sample of that run reaching a tenth. One strike per recording is
 * assumed; the loudest event is taken.
 */
export function findStrike(samples: Float64Array, sampleRate: number): Strike {
  let peakIndex = 0;
  let peakMagnitude = 0;
  for (let i = 0; i < samples.length; i++) {
    const magnitude = Math.abs(samples[i]!);
    if (magnitude > peakMagnitude) {
      peakMagnitude = magnitude;
      peakIndex = i;
    }
  }
  const block = Math.max(1, Math.round(sampleRate / 1000));
  let onsetIndex = peakIndex;
  for (let end = peakIndex; end > 0; end -= block) {
    const from = Math.max(0, end - block);
    let blockPeak = 0;
    for (let i = from; i < end; i++) blockPeak = Math.max(blockPeak, Math.abs(samples[i]!));
    if (blockPeak < 0.1 * peakMagnitude) break;
    onsetIndex = from;
  }
  // Within that block, the onset is the first sample reaching a tenth of the strike's magnitude.
  while (onsetIndex < peakIndex && Math.abs(samples[onsetIndex]!) < 0.1 * peakMagnitude) onsetIndex++;
  return { onsetIndex, peakIndex, peakMagnitude };
}
