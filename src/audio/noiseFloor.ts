/** A spectrum's noise floor, read at any (fractional) bin, in the spectrum's power units. */
export interface NoiseFloor {
  at: (bin: number) => number;
}

/**
 * Noise floor of a power spectrum (same units as `power`): the median power over blocks
 * of `blockBins` bins (sampling every `stride`-th bin: neighbouring bins of a zero-padded spectrum
 * are not independent), interpolated linearly in log power between block centres. The median
 * ignores the few bins a peak occupies, so the floor follows coloured noise but not the partials.
 * For complex Gaussian noise the median of |X|² is ln 2 times its mean.
 */
export function noiseFloor(power: Float64Array, blockBins: number, stride = 1): NoiseFloor {
  const size = power.length;
  const step = Math.max(1, Math.floor(stride));
  const block = Math.max(8 * step, Math.min(size, Math.round(blockBins)));
  const blockCount = Math.max(1, Math.floor(size / block));
  const centres = new Float64Array(blockCount);
  const logMedians = new Float64Array(blockCount);
  const scratch = new Float64Array(Math.ceil((block + size - blockCount * block) / step) + 1);
  for (let b = 0; b < blockCount; b++) {
    const from = b * block;
    const to = b === blockCount - 1 ? size : from + block;
    let count = 0;
    for (let k = from; k < to; k += step) scratch[count++] = power[k]!;
    const median = selectKth(scratch, count, count >> 1);
    logMedians[b] = Math.log(Math.max(median, Number.MIN_VALUE));
    centres[b] = (from + to - 1) / 2;
  }
  const last = blockCount - 1;
  return {
    at(bin: number): number {
      if (blockCount === 1 || bin <= centres[0]!) return Math.exp(logMedians[0]!);
      if (bin >= centres[last]!) return Math.exp(logMedians[last]!);
      let b = Math.min(last - 1, Math.max(0, Math.floor((bin - centres[0]!) / block)));
      while (b < last - 1 && bin > centres[b + 1]!) b++;
      const fraction = (bin - centres[b]!) / (centres[b + 1]! - centres[b]!);
      return Math.exp(logMedians[b]! + fraction * (logMedians[b + 1]! - logMedians[b]!));
    },
  };
}

/** The k-th smallest of values[0, count) by Hoare's quickselect (reorders the values). */
function selectKth(values: Float64Array, count: number, k: number): number {
  let low = 0;
  let high = count - 1;
  while (low < high) {
    const pivot = values[(low + high) >> 1]!;
    let i = low;
    let j = high;
    while (i <= j) {
      while (values[i]! < pivot) i++;
      while (values[j]! > pivot) j--;
      if (i <= j) {
        const t = values[i]!;
        values[i] = values[j]!;
        values[j] = t;
        i++;
        j--;
      }
    }
    if (k <= j) high = j;
    else if (k >= i) low = i;
    else return values[k]!;
  }
  return values[k]!;
}
