import { describe, expect, it } from 'vitest';
import { decodeWav, encodeWav } from '../../src/audio/index.ts';
import { InputError } from '../../src/fileFormats/InputError.ts';

/**
 * Builds a WAV file byte by byte from the RIFF/WAVE layout (Microsoft's RIFF specification):
 * "RIFF" size "WAVE", a "fmt " chunk (16 bytes, or 40 for WAVE_FORMAT_EXTENSIBLE with the
 * sub-format GUID), then "data".
 */
function buildWav(options: { tag: number; channels: number; rate: number; bits: number; data: Uint8Array; extensibleSubformat?: number }): Uint8Array {
  const extensible = options.extensibleSubformat !== undefined;
  const fmtSize = extensible ? 40 : 16;
  const bytes = new Uint8Array(12 + 8 + fmtSize + 8 + options.data.length);
  const view = new DataView(bytes.buffer);
  const text = (offset: number, value: string) => [...value].forEach((ch, i) => view.setUint8(offset + i, ch.charCodeAt(0)));
  text(0, 'RIFF');
  view.setUint32(4, bytes.length - 8, true);
  text(8, 'WAVE');
  text(12, 'fmt ');
  view.setUint32(16, fmtSize, true);
  const blockAlign = (options.channels * options.bits) / 8;
  view.setUint16(20, extensible ? 0xfffe : options.tag, true);
  view.setUint16(22, options.channels, true);
  view.setUint32(24, options.rate, true);
  view.setUint32(28, options.rate * blockAlign, true);
  view.setUint16(32, blockAlign, true);
  view.setUint16(34, options.bits, true);
  if (extensible) {
    view.setUint16(36, 22, true);
    view.setUint16(38, options.bits, true);
    view.setUint32(40, options.channels === 1 ? 4 : 3, true);
    // KSDATAFORMAT_SUBTYPE GUID: {0000000X-0000-0010-8000-00aa00389b71}.
    view.setUint32(44, options.extensibleSubformat!, true);
    [0x00, 0x00, 0x10, 0x00, 0x80, 0x00, 0x00, 0xaa, 0x00, 0x38, 0x9b, 0x71].forEach((b, i) => view.setUint8(48 + i, b));
  }
  const dataOffset = 20 + fmtSize;
  text(dataOffset, 'data');
  view.setUint32(dataOffset + 4, options.data.length, true);
  bytes.set(options.data, dataOffset + 8);
  return bytes;
}

function littleEndian(values: number[], bytesEach: number, write: (view: DataView, offset: number, value: number) => void): Uint8Array {
  const out = new Uint8Array(values.length * bytesEach);
  const view = new DataView(out.buffer);
  values.forEach((v, i) => write(view, i * bytesEach, v));
  return out;
}

describe('decodeWav', () => {
  it('reads 8-bit unsigned PCM: 128 is zero, full scale ±1 (RIFF spec: 8-bit samples are unsigned)', () => {
    const audio = decodeWav(buildWav({ tag: 1, channels: 1, rate: 8000, bits: 8, data: new Uint8Array([128, 255, 0, 192]) }));
    expect(Array.from(audio.channels[0]!)).toEqual([0, 127 / 128, -1, 0.5]);
    expect(audio.encoding).toEqual({ kind: 'integer', bits: 8 });
    expect(audio.durationS).toBe(4 / 8000);
  });

  it('reads 16-bit stereo and de-interleaves the channels', () => {
    const data = littleEndian([16384, -32768, 32767, 0], 2, (v, o, x) => v.setInt16(o, x, true));
    const audio = decodeWav(buildWav({ tag: 1, channels: 2, rate: 44100, bits: 16, data }));
    expect(audio.sampleRate).toBe(44100);
    expect(Array.from(audio.channels[0]!)).toEqual([0.5, 32767 / 32768]);
    expect(Array.from(audio.channels[1]!)).toEqual([-1, 0]);
  });

  it('reads 24-bit samples, sign-extended', () => {
    const values = [0x7fffff, -0x800000, -1, 0x400000];
    const data = new Uint8Array(values.length * 3);
    values.forEach((value, i) => {
      const u = value & 0xffffff;
      data[3 * i] = u & 0xff;
      data[3 * i + 1] = (u >> 8) & 0xff;
      data[3 * i + 2] = (u >> 16) & 0xff;
    });
    const audio = decodeWav(buildWav({ tag: 1, channels: 1, rate: 96000, bits: 24, data }));
    expect(Array.from(audio.channels[0]!)).toEqual([0x7fffff / 0x800000, -1, -1 / 0x800000, 0.5]);
  });

  it('reads 32-bit integer and 32-bit float, plain and WAVE_FORMAT_EXTENSIBLE', () => {
    const ints = littleEndian([-2147483648, 1073741824], 4, (v, o, x) => v.setInt32(o, x, true));
    expect(Array.from(decodeWav(buildWav({ tag: 1, channels: 1, rate: 48000, bits: 32, data: ints })).channels[0]!)).toEqual([-1, 0.5]);
    const floats = littleEndian([0.25, -0.75, 1], 4, (v, o, x) => v.setFloat32(o, x, true));
    const plain = decodeWav(buildWav({ tag: 3, channels: 1, rate: 48000, bits: 32, data: floats }));
    expect(Array.from(plain.channels[0]!)).toEqual([0.25, -0.75, 1]);
    expect(plain.encoding).toEqual({ kind: 'float', bits: 32 });
    const extensible = decodeWav(buildWav({ tag: 0, channels: 1, rate: 48000, bits: 32, data: floats, extensibleSubformat: 3 }));
    expect(Array.from(extensible.channels[0]!)).toEqual([0.25, -0.75, 1]);
    const extensiblePcm = decodeWav(buildWav({ tag: 0, channels: 1, rate: 48000, bits: 32, data: ints, extensibleSubformat: 1 }));
    expect(Array.from(extensiblePcm.channels[0]!)).toEqual([-1, 0.5]);
  });

  it('reads what encodeWav writes, within half a quantisation step', () => {
    const left = Float64Array.from({ length: 64 }, (_, i) => 0.9 * Math.sin(i / 3));
    const right = left.map((v) => -0.5 * v);
    for (const bits of [8, 16, 24, 32] as const) {
      const audio = decodeWav(encodeWav([left, right], 22050, { kind: 'integer', bits }));
      const step = 2 ** -(bits - 1);
      audio.channels[0]!.forEach((v, i) => expect(Math.abs(v - left[i]!)).toBeLessThanOrEqual(step / 2 + 1e-12));
      audio.channels[1]!.forEach((v, i) => expect(Math.abs(v - right[i]!)).toBeLessThanOrEqual(step / 2 + 1e-12));
    }
    const float = decodeWav(encodeWav([left], 22050, { kind: 'float', bits: 32 }));
    // Float32 keeps 24 significant bits: relative error ≤ 2^-24.
    float.channels[0]!.forEach((v, i) => expect(Math.abs(v - left[i]!)).toBeLessThanOrEqual(Math.abs(left[i]!) * 2 ** -24));
  });

  it('rejects what is not a usable PCM WAV with an InputError naming the file', () => {
    expect(() => decodeWav(new TextEncoder().encode('not a wav file at all'), 'strike.wav')).toThrow(/^strike\.wav: file: not a readable WAV file/);
    const adpcm = buildWav({ tag: 17, channels: 1, rate: 8000, bits: 4, data: new Uint8Array(16) });
    expect(() => decodeWav(adpcm, 'strike.wav')).toThrow(/^strike\.wav: format: unsupported WAV encoding/);
    expect(() => decodeWav(buildWav({ tag: 1, channels: 1, rate: 8000, bits: 16, data: new Uint8Array(0) }), 'empty.wav')).toThrow(InputError);
    const nan = littleEndian([Number.NaN], 4, (v, o, x) => v.setFloat32(o, x, true));
    expect(() => decodeWav(buildWav({ tag: 3, channels: 1, rate: 8000, bits: 32, data: nan }), 'nan.wav')).toThrow(/^nan\.wav: data: sample 0 is not a finite number/);
  });
});
