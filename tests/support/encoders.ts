/**
 * Real encoded recordings made at test time from the synthetic signals (tests/support/signals.ts),
 * with encoders from npm whose wasm/asm.js is inside the package (nothing is downloaded):
 * MP3 with LAME and Ogg Vorbis with libvorbis (wasm-media-encoders 0.7.0), Ogg Opus with libopus
 * 1.3.1 (opus-encdec 0.1.1). Devtime only: the app decodes, it never encodes.
 */
import { createMp3Encoder, createOggEncoder } from 'wasm-media-encoders';
import Opus from 'opus-encdec/dist/libopus-encoder.js';
import { OggOpusEncoder } from 'opus-encdec/src/oggOpusEncoder.js';

const join = (parts: Uint8Array[]): Uint8Array => {
  const out = new Uint8Array(parts.reduce((a, p) => a + p.length, 0));
  parts.reduce((at, p) => (out.set(p, at), at + p.length), 0);
  return out;
};

type Mp3Rate = 8 | 16 | 24 | 32 | 40 | 48 | 64 | 80 | 96 | 112 | 128 | 160 | 192 | 224 | 256 | 320;

/** A mono (or stereo: the same samples twice) CBR MP3 at `kbps`. */
export async function mp3Bytes(x: Float32Array, rate: number, kbps: Mp3Rate = 64, channels: 1 | 2 = 1): Promise<Uint8Array> {
  const e = await createMp3Encoder();
  e.configure({ sampleRate: rate, channels, bitrate: kbps });
  // encode() returns a view into the encoder's memory, valid until the next call: copy each part
  return join([e.encode(Array(channels).fill(x)).slice(), e.finalize().slice()]);
}

/** A mono Ogg Vorbis at VBR quality `q` (0..10). */
export async function vorbisBytes(x: Float32Array, rate: number, q = 5): Promise<Uint8Array> {
  const e = await createOggEncoder();
  e.configure({ sampleRate: rate, channels: 1, vbrQuality: q, oggSerialNo: 7 });
  return join([e.encode([x]).slice(), e.finalize().slice()]);
}

/**
 * A mono Ogg Opus (libopus resamples to 48 kHz; full-band "audio" application, 20 ms frames).
 * The input is padded with silence to whole 20 ms frames: opus-encdec's last-frame path drops the
 * pages it makes (its encodeFinalFrame ignores what encode() returns), so nothing may be left over.
 */
export function opusBytes(x: Float32Array, rate: number, kbps = 48): Uint8Array {
  const frame = (rate * 20) / 1000;
  const padded = new Float32Array(Math.ceil(x.length / frame) * frame);
  padded.set(x);
  const e = new OggOpusEncoder({ originalSampleRate: rate, numberOfChannels: 1, encoderSampleRate: 48000, encoderApplication: 2049, encoderBitRate: kbps * 1000, serial: 7 }, Opus);
  const pages = [e.generateIdPage(), e.generateCommentPage()];
  for (let i = 0; i < padded.length; i += 4096) pages.push(...e.encode([padded.subarray(i, i + 4096)]));
  pages.push(...e.encodeFinalFrame());
  e.destroy();
  return join(pages.map((p) => p.page));
}

/**
 * Not a recording: an ISO BMFF 'ftyp' box with the M4A brand (ISO/IEC 14496-12 §4.3) and an empty
 * 'mdat', enough for file-type to sniff audio/x-m4a. For the "stored but not analysed" path, where
 * the content is never decoded (no npm package here encodes AAC).
 */
export function m4aHeaderOnly(): Uint8Array {
  const box = (type: string, body: Uint8Array) => {
    const b = new Uint8Array(8 + body.length);
    new DataView(b.buffer).setUint32(0, b.length);
    b.set(new TextEncoder().encode(type), 4);
    b.set(body, 8);
    return b;
  };
  return join([box('ftyp', new TextEncoder().encode('M4A \0\0\0\0M4A mp42isom')), box('mdat', new Uint8Array(64))]);
}
