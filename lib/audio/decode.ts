import CodecParser from 'codec-parser';
import { isAnalysable, notAnalysedMessage, type AnalysedFormat, type AnalysedMime } from './formats';
import { MAX_RATE, MIN_RATE, mixToMono } from './pcm';
import { AudioRefused, decodeWav } from './wav';

/**
 * One entry for every recording format: bytes and the type sniffed from them (file-type) in, one
 * mono channel of PCM out (at most the first `maxSeconds`), or an AudioRefused saying why not.
 * WAV goes through wav.ts; MP3 (MPEG layer I/II/III) and Ogg (Vorbis, Opus) are split into frames
 * or pages by codec-parser and decoded by the wasm-audio-decoders family (their wasm is inside
 * the JS: nothing is fetched), loaded on first use so that the worker starts as fast as before.
 * M4A/AAC is kept but not decoded here (see DEVELOPERS.md).
 */
export type DecodedRecording = {
  format: AnalysedFormat;
  sampleRate: number;
  channels: number;
  samples: Float32Array;
  /** the whole recording's length, seconds */
  seconds: number;
  /** set when only the first `maxSeconds` were decoded */
  truncatedTo: number | null;
  /** plain-language remarks for the hint (damaged frames skipped) */
  notes: string[];
};

type Decoder = (bytes: Uint8Array, maxSeconds: number) => Promise<DecodedRecording>;

const DECODERS: Record<AnalysedMime, Decoder> = {
  'audio/wav': async (bytes, maxSeconds) => {
    const w = decodeWav(bytes, maxSeconds);
    return { format: 'WAV', sampleRate: w.sampleRate, channels: w.info.channels, samples: w.samples, seconds: w.info.seconds, truncatedTo: w.truncatedTo, notes: [] };
  },
  'audio/mpeg': decodeMpeg,
  'audio/ogg': decodeOgg,
  'audio/ogg; codecs=opus': decodeOgg,
  'audio/opus': decodeOgg,
};

export async function decodeRecording(bytes: Uint8Array, mime: string, maxSeconds = 60): Promise<DecodedRecording> {
  if (!isAnalysable(mime)) throw new AudioRefused(notAnalysedMessage(mime), 'not-analysed');
  const decode = DECODERS[mime];
  let out: DecodedRecording;
  try {
    out = await decode(bytes, maxSeconds);
  } catch (err) {
    if (err instanceof AudioRefused) throw err;
    throw new AudioRefused(`The recording could not be read as ${mime}: ${(err as Error).message}.`, 'damaged');
  }
  if (out.sampleRate < MIN_RATE || out.sampleRate > MAX_RATE)
    throw new AudioRefused(`This ${out.format} is sampled at ${out.sampleRate} Hz; ${MIN_RATE}–${MAX_RATE} Hz can be analysed.`);
  return out;
}

type Decoded = { channelData: Float32Array[]; samplesDecoded: number; sampleRate: number; errors: { message: string; frameNumber: number }[] };
type WasmDecoder<I> = { ready: Promise<void>; free: () => void; run: (input: I) => Decoded | Promise<Decoded> };

/** Runs one wasm decoder and shapes its output; the decoder is freed whatever happens. */
async function finish<I>(format: DecodedRecording['format'], d: WasmDecoder<I>, input: I, seconds: number, maxSeconds: number): Promise<DecodedRecording> {
  let r: Decoded;
  try {
    await d.ready;
    r = await d.run(input);
  } catch (err) {
    throw new AudioRefused(`The ${format} could not be decoded: ${(err as Error).message}.`, 'damaged');
  } finally {
    d.free();
  }
  if (!r.samplesDecoded || !r.channelData.length) {
    const why = r.errors[0] ? `: ${r.errors[0].message} (frame ${r.errors[0].frameNumber})` : '';
    throw new AudioRefused(`The ${format} holds no audio that could be decoded${why}.`, 'damaged');
  }
  const n = Math.min(r.samplesDecoded, Math.floor(maxSeconds * r.sampleRate));
  const notes = r.errors.length ? [`${r.errors.length} damaged frame(s) were skipped.`] : [];
  return { format, sampleRate: r.sampleRate, channels: r.channelData.length, samples: mixToMono(r.channelData, n), seconds, truncatedTo: seconds > maxSeconds ? maxSeconds : null, notes };
}

/** Bit rates in kbit/s by bitrate index, per MPEG version and layer (ISO/IEC 11172-3 §2.4.2.3, ISO/IEC 13818-3 §2.4.2.3; recalled, not re-read). */
const KBPS = {
  v1: { 1: [0, 32, 64, 96, 128, 160, 192, 224, 256, 288, 320, 352, 384, 416, 448], 2: [0, 32, 48, 56, 64, 80, 96, 112, 128, 160, 192, 224, 256, 320, 384], 3: [0, 32, 40, 48, 56, 64, 80, 96, 112, 128, 160, 192, 224, 256, 320] },
  v2: { 1: [0, 32, 48, 56, 64, 80, 96, 112, 128, 144, 160, 176, 192, 224, 256], 2: [0, 8, 16, 24, 32, 40, 48, 56, 64, 80, 96, 112, 128, 144, 160], 3: [0, 8, 16, 24, 32, 40, 48, 56, 64, 80, 96, 112, 128, 144, 160] },
} as const;
const RATES = { 3: [44100, 48000, 32000], 2: [22050, 24000, 16000], 0: [11025, 12000, 8000] } as Record<number, number[]>;

/**
 * The length in bytes of the MPEG audio frame whose 4-byte header starts `h`, from the header
 * alone (same standards): layer I (12·bitrate/rate + padding)·4, layer II and MPEG-1 layer III
 * 144·bitrate/rate + padding, MPEG-2/2.5 layer III 72·bitrate/rate + padding. Null for no valid header.
 * (codec-parser's own frame length is internal, and the bitrate it reports is the one measured.)
 */
export function mpegFrameLength(h: Uint8Array): number | null {
  if (h.length < 4 || h[0] !== 0xff || (h[1] & 0xe0) !== 0xe0) return null;
  const version = (h[1] >> 3) & 3; // 3 MPEG-1, 2 MPEG-2, 0 MPEG-2.5
  const layer = 4 - ((h[1] >> 1) & 3); // bits 11 -> I, 10 -> II, 01 -> III
  const kbps = version === 1 || layer === 4 ? undefined : KBPS[version === 3 ? 'v1' : 'v2'][layer as 1 | 2 | 3][h[2] >> 4];
  const rate = RATES[version]?.[(h[2] >> 2) & 3];
  if (!kbps || !rate) return null;
  const pad = (h[2] >> 1) & 1;
  if (layer === 1) return (Math.floor((12 * kbps * 1000) / rate) + pad) * 4;
  return Math.floor(((layer === 3 && version !== 3 ? 72 : 144) * kbps * 1000) / rate) + pad;
}

/**
 * MP3 (and MPEG layer I/II): every frame is found by codec-parser; a last frame shorter than its
 * header says (mpegFrameLength) means the file was cut off. Only the frames that start in the
 * first `maxSeconds` are decoded.
 */
async function decodeMpeg(bytes: Uint8Array, maxSeconds: number): Promise<DecodedRecording> {
  const frames = new CodecParser('audio/mpeg', { enableLogging: false }).parseAll(bytes) as unknown as MpegFrame[];
  if (!frames.length) throw new AudioRefused(`No MPEG audio frames were found in these ${bytes.length} bytes: the file is damaged or not an MP3.`, 'damaged');
  const last = frames[frames.length - 1];
  const frameLength = mpegFrameLength(last.data);
  if (frameLength !== null && last.data.length < frameLength)
    throw new AudioRefused(
      `The MP3 is truncated: its last frame (number ${frames.length}) has ${last.data.length} of its ${frameLength} bytes and the file ends at byte ${bytes.length}. Upload the whole recording.`,
      'damaged',
    );
  const take = frames.filter((f) => f.totalDuration < maxSeconds * 1000).map((f) => f.data);
  const seconds = (last.totalDuration + last.duration) / 1000;
  const { MPEGDecoder } = await import('mpg123-decoder');
  const d = new MPEGDecoder();
  return finish('MP3', { ready: d.ready, free: () => d.free(), run: (x: Uint8Array[]) => d.decodeFrames(x) }, take, seconds, maxSeconds);
}

/**
 * Ogg Vorbis and Ogg Opus: pages found by codec-parser; a last page shorter than its own header
 * says (27 bytes + segment table + the segments' lengths, RFC 3533 §6) means the file was cut off.
 * The pages that start in the first `maxSeconds` (with the header pages) are decoded.
 */
async function decodeOgg(bytes: Uint8Array, maxSeconds: number): Promise<DecodedRecording> {
  let codec = '';
  const pages = new CodecParser('application/ogg', { enableLogging: false, onCodec: (c) => (codec = c) }).parseAll(bytes) as unknown as OggPage[];
  if (!pages.length) throw new AudioRefused(`No Ogg pages were found in these ${bytes.length} bytes: the file is damaged or not an Ogg file.`, 'damaged');
  const last = pages[pages.length - 1].rawData;
  const declared = last.length >= 27 ? 27 + last[26] + last.subarray(27, 27 + last[26]).reduce((a, b) => a + b, 0) : 27;
  if (last.length < declared)
    throw new AudioRefused(
      `The Ogg file is truncated: its last page (number ${pages.length}) has ${last.length} of its ${declared} bytes and the file ends at byte ${bytes.length}. Upload the whole recording.`,
      'damaged',
    );
  const take = pages.filter((p) => p.totalDuration - p.duration < maxSeconds * 1000).map((p) => p.rawData);
  const input: Uint8Array = Buffer.concat(take);
  const seconds = pages[pages.length - 1].totalDuration / 1000;
  if (codec === 'opus') {
    const { OggOpusDecoder } = await import('ogg-opus-decoder');
    const d = new OggOpusDecoder();
    return finish('Ogg Opus', { ready: d.ready, free: () => d.free(), run: (x: Uint8Array) => d.decodeFile(x) }, input, seconds, maxSeconds);
  }
  if (codec === 'vorbis') {
    const { OggVorbisDecoder } = await import('@wasm-audio-decoders/ogg-vorbis');
    const d = new OggVorbisDecoder();
    return finish('Ogg Vorbis', { ready: d.ready, free: () => d.free(), run: (x: Uint8Array) => d.decodeFile(x) }, input, seconds, maxSeconds);
  }
  throw new AudioRefused(`This Ogg file holds ${codec || 'an unknown codec'}, not Vorbis or Opus; only those are analysed. Export it as WAV, MP3 or OGG.`);
}

/** The fields used here of codec-parser's frames (its index.d.ts declares them but exports only the parser). */
type MpegFrame = { data: Uint8Array; duration: number; totalDuration: number };
type OggPage = { rawData: Uint8Array; duration: number; totalDuration: number };
