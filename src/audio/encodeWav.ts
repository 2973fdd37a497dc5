import { WaveFile } from './waveFileClass.ts';
import { InputError } from '../fileFormats/InputError.ts';

/** Sample encodings encodeWav writes. */
export type WavEncoding = { kind: 'integer'; bits: 8 | 16 | 24 | 32 } | { kind: 'float'; bits: 32 };

/**
 * Encodes channels of samples (full scale = 1) as a RIFF/WAVE file (wavefile library):
 * integers by rounding x · 2^(bits−1), clipped to the format's range (8-bit stored unsigned with
 * offset 128), or 32-bit IEEE float. All channels must be the same length.
 */
export function encodeWav(channels: readonly Float64Array[], sampleRate: number, encoding: WavEncoding = { kind: 'integer', bits: 16 }): Uint8Array {
  const channelCount = channels.length;
  const frameCount = channels[0]?.length ?? 0;
  if (channelCount < 1 || channels.some((c) => c.length !== frameCount)) throw new InputError('encodeWav', 'channels', 'one or more channels of equal length are needed');
  const interleaved = new Float64Array(frameCount * channelCount);
  const scale = encoding.kind === 'float' ? 1 : 2 ** (encoding.bits - 1);
  const low = encoding.kind === 'float' ? -Infinity : -scale;
  const high = encoding.kind === 'float' ? Infinity : scale - 1;
  const offset = encoding.kind === 'integer' && encoding.bits === 8 ? 128 : 0;
  for (let frame = 0; frame < frameCount; frame++) {
    for (let channel = 0; channel < channelCount; channel++) {
      const x = channels[channel]![frame]!;
      const value = encoding.kind === 'float' ? x : Math.min(high, Math.max(low, Math.round(x * scale)));
      interleaved[frame * channelCount + channel] = value + offset;
    }
  }
  const wave = new WaveFile();
  wave.fromScratch(channelCount, sampleRate, encoding.kind === 'float' ? '32f' : String(encoding.bits), interleaved);
  return wave.toBuffer();
}
