import { decode } from 'wav-decoder';
import { MAX_RATE, MIN_RATE, mixToMono } from './pcm';

/**
 * Reading a WAV recording for the audio signature. Pure: bytes in, samples out, no I/O.
 * Accepted: RIFF/WAVE, PCM integer (8/16/24/32 bit) or IEEE float, 8–48 kHz, mono or stereo.
 * Anything else is refused with a message naming what and where (byte offsets from the file start).
 */
/**
 * Why a recording gets no signature: `damaged` (truncated, corrupt), `unsupported` (a variant
 * outside what is analysed, e.g. 96 kHz or µ-law), `not-analysed` (a format kept but never decoded
 * here, e.g. M4A/AAC).
 */
export type RefusalReason = 'damaged' | 'unsupported' | 'not-analysed';

export class AudioRefused extends Error {
  constructor(
    message: string,
    readonly reason: RefusalReason = 'unsupported',
  ) {
    super(message);
    this.name = 'AudioRefused';
  }
}

export type WavInfo = { sampleRate: number; channels: number; bitsPerSample: number; format: 'pcm' | 'float'; dataOffset: number; dataBytes: number; seconds: number };

const ascii = (b: Uint8Array, at: number) => String.fromCharCode(b[at], b[at + 1], b[at + 2], b[at + 3]);

/**
 * Walks the RIFF chunks and checks the format and that the data chunk is complete. `totalBytes`:
 * the whole file's size when `bytes` is only its start (the server reads the first few kB).
 */
export function inspectWav(bytes: Uint8Array, totalBytes = bytes.length): WavInfo {
  if (bytes.length < 12) throw new AudioRefused(`Not a WAV file: only ${bytes.length} bytes, a RIFF header needs 12.`);
  if (ascii(bytes, 0) !== 'RIFF' || ascii(bytes, 8) !== 'WAVE') throw new AudioRefused('Not a WAV file: bytes 0–11 are not "RIFF….WAVE".');
  const view = new DataView(bytes.buffer, bytes.byteOffset, bytes.byteLength);
  let at = 12;
  let fmt: Omit<WavInfo, 'dataOffset' | 'dataBytes' | 'seconds'> | undefined;
  while (at + 8 <= bytes.length && at + 8 <= totalBytes) {
    const id = ascii(bytes, at);
    const size = view.getUint32(at + 4, true);
    const body = at + 8;
    if (id === 'fmt ') {
      if (size < 16 || body + 16 > bytes.length) throw new AudioRefused(`The WAV "fmt " chunk at byte ${at} is cut short.`, 'damaged');
      const tag = view.getUint16(body, true);
      const channels = view.getUint16(body + 2, true);
      const sampleRate = view.getUint32(body + 4, true);
      const bitsPerSample = view.getUint16(body + 14, true);
      if (tag !== 1 && tag !== 3) throw new AudioRefused(`This WAV is encoded as format 0x${tag.toString(16)} (byte ${body}); only plain PCM or float WAV can be analysed. Export it as 16-bit PCM WAV.`);
      if (channels < 1 || channels > 2) throw new AudioRefused(`This WAV has ${channels} channels (byte ${body + 2}); mono or stereo only.`);
      if (sampleRate < MIN_RATE || sampleRate > MAX_RATE) throw new AudioRefused(`This WAV is sampled at ${sampleRate} Hz (byte ${body + 4}); 8000–48000 Hz can be analysed.`);
      if (tag === 1 ? ![8, 16, 24, 32].includes(bitsPerSample) : bitsPerSample !== 32) throw new AudioRefused(`${bitsPerSample}-bit samples (byte ${body + 14}) are not supported.`);
      fmt = { sampleRate, channels, bitsPerSample, format: tag === 1 ? 'pcm' : 'float' };
    } else if (id === 'data') {
      if (!fmt) throw new AudioRefused(`The WAV data chunk at byte ${at} comes before its "fmt " chunk.`);
      const available = totalBytes - body;
      if (size > available) throw new AudioRefused(`The WAV is truncated: its data chunk at byte ${at} declares ${size} bytes but the file ends ${available} bytes later (at byte ${totalBytes}).`, 'damaged');
      const frame = (fmt.bitsPerSample / 8) * fmt.channels;
      if (size < frame) throw new AudioRefused(`The WAV data chunk at byte ${at} holds no samples.`, 'damaged');
      return { ...fmt, dataOffset: body, dataBytes: size, seconds: size / frame / fmt.sampleRate };
    }
    at = body + size + (size % 2); // chunks are padded to an even length
  }
  if (totalBytes > bytes.length && at + 8 > bytes.length) throw new AudioRefused(`The WAV's data chunk starts after byte ${bytes.length}: too much before it to check.`);
  throw new AudioRefused(fmt ? `The WAV has no data chunk (the file ends at byte ${totalBytes}).` : `The WAV has no "fmt " chunk (the file ends at byte ${totalBytes}).`);
}

/** The recording as one mono channel (stereo averaged), at most `maxSeconds` from the start. */
export function decodeWav(bytes: Uint8Array, maxSeconds = 60): { info: WavInfo; sampleRate: number; samples: Float32Array; truncatedTo: number | null } {
  const info = inspectWav(bytes);
  let audio;
  try {
    audio = decode.sync(bytes.slice(0, info.dataOffset + info.dataBytes).buffer);
  } catch (err) {
    throw new AudioRefused(`The WAV could not be decoded: ${(err as Error).message}.`, 'damaged');
  }
  const n = Math.min(audio.channelData[0].length, Math.floor(maxSeconds * audio.sampleRate));
  const samples = mixToMono(audio.channelData, n);
  return { info, sampleRate: audio.sampleRate, samples, truncatedTo: audio.channelData[0].length > n ? maxSeconds : null };
}
