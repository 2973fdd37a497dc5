import { WaveFile } from './waveFileClass.ts';
import { InputError } from '../fileFormats/InputError.ts';

/** A decoded recording: one Float64Array per channel, samples scaled to −1 … +1 (full scale). */
export interface DecodedAudio {
  /** Samples per second, Hz. */
  sampleRate: number;
  /** One array per channel, de-interleaved, full scale = 1. */
  channels: Float64Array[];
  /** Stored sample format: 8/16/24/32-bit integer or 32/64-bit float. */
  encoding: { kind: 'integer' | 'float'; bits: number };
  /** Length of the recording, s. */
  durationS: number;
}


/** WAVE format tags (RIFF/WAVE specification, Microsoft's mmreg.h). */
const formatPcm = 1;
const formatFloat = 3;
const formatExtensible = 0xfffe;

interface FmtChunk {
  audioFormat: number;
  numChannels: number;
  sampleRate: number;
  bitsPerSample: number;
  blockAlign: number;
  subformat: number[];
}

/**
 * Decodes a PCM WAV file (RIFF, RIFX or RF64 container, parsed by the wavefile library):
 * 8-bit unsigned, 16/24/32-bit signed integer, 32/64-bit IEEE float, plain or
 * WAVE_FORMAT_EXTENSIBLE, any sample rate, any number of channels. Integers are scaled by
 * 2^(bits−1) (8-bit: offset 128 first), so full scale reads ±1.
 * Throws InputError(source, …) for a file that is not such a WAV.
 */
export function decodeWav(bytes: Uint8Array, source = 'recording'): DecodedAudio {
  const wave = new WaveFile();
  try {
    wave.fromBuffer(bytes);
  } catch (error) {
    throw new InputError(source, 'file', `not a readable WAV file (${error instanceof Error ? error.message : String(error)})`);
  }
  const fmt = wave.fmt as FmtChunk;
  const tag = fmt.audioFormat === formatExtensible ? (fmt.subformat[0] ?? 0) : fmt.audioFormat;
  const bits = fmt.bitsPerSample;
  const channelCount = fmt.numChannels;
  let kind: 'integer' | 'float';
  if (tag === formatPcm && [8, 16, 24, 32].includes(bits)) kind = 'integer';
  else if (tag === formatFloat && (bits === 32 || bits === 64)) kind = 'float';
  else throw new InputError(source, 'format', `unsupported WAV encoding (format tag ${tag}, ${bits} bits); use PCM 8/16/24/32-bit integer or 32-bit float`);
  if (!(channelCount >= 1)) throw new InputError(source, 'channels', 'the file declares no channels');
  if (!(fmt.sampleRate >= 1000 && fmt.sampleRate <= 768_000)) throw new InputError(source, 'sample_rate', `sample rate ${fmt.sampleRate} Hz is outside 1000–768000 Hz`);

  const data = (wave as unknown as { data: { samples: Uint8Array } }).data.samples;
  const bytesPerSample = bits / 8;
  const frameBytes = bytesPerSample * channelCount;
  const frameCount = Math.floor(data.length / frameBytes);
  if (frameCount < 1) throw new InputError(source, 'data', 'the file holds no samples');
  const littleEndian = wave.container !== 'RIFX';
  const view = new DataView(data.buffer, data.byteOffset, frameCount * frameBytes);
  const channels = Array.from({ length: channelCount }, () => new Float64Array(frameCount));

  const read = sampleReader(kind, bits, littleEndian, view);
  for (let frame = 0, offset = 0; frame < frameCount; frame++) {
    for (let channel = 0; channel < channelCount; channel++, offset += bytesPerSample) channels[channel]![frame] = read(offset);
  }
  for (const samples of channels) {
    for (let i = 0; i < samples.length; i++) if (!Number.isFinite(samples[i]!)) throw new InputError(source, 'data', `sample ${i} is not a finite number`);
  }
  return { sampleRate: fmt.sampleRate, channels, encoding: { kind, bits }, durationS: frameCount / fmt.sampleRate };
}

/** A function reading one sample at a byte offset, scaled to full scale = 1. */
function sampleReader(kind: 'integer' | 'float', bits: number, littleEndian: boolean, view: DataView): (offset: number) => number {
  if (kind === 'float') return bits === 32 ? (o) => view.getFloat32(o, littleEndian) : (o) => view.getFloat64(o, littleEndian);
  switch (bits) {
    case 8:
      return (o) => (view.getUint8(o) - 128) / 128;
    case 16:
      return (o) => view.getInt16(o, littleEndian) / 32768;
    case 24:
      return littleEndian
        ? (o) => ((view.getInt8(o + 2) << 16) | (view.getUint8(o + 1) << 8) | view.getUint8(o)) / 8388608
        : (o) => ((view.getInt8(o) << 16) | (view.getUint8(o + 1) << 8) | view.getUint8(o + 2)) / 8388608;
    default:
      return (o) => view.getInt32(o, littleEndian) / 2147483648;
  }
}
