import { describe, expect, it } from 'vitest';
import { decodeRecording, mpegFrameLength } from '@/lib/audio/decode';
import { isAnalysable } from '@/lib/audio/formats';
import { audioSignature } from '@/lib/audio/signature';
import { AudioRefused } from '@/lib/audio/wav';
import { mp3Bytes, opusBytes, vorbisBytes } from '../../support/encoders';
import { harmonicFamily, mix, pulseTrain, tone, wavBytes, whiteNoise } from '../../support/signals';

// The same synthetic signals as signature.test.ts, encoded by the reference encoders (LAME,
// libvorbis, libopus; tests/support/encoders.ts), decoded by lib/audio/decode.ts and analysed.
// The detections must survive the codec, with the same bounds as the WAV tests: lossy codecs keep
// strong tonal lines but add quantisation noise and a low-pass (LAME at 8 kHz cuts near 3.5 kHz;
// Opus resamples to 48 kHz). Measured here (4 s, seed fixed): the 50 Hz family's excess falls from
// 57.7 dB (WAV) to 42.2 (MP3 64 kbit/s), 42.7 (Vorbis q6) and 49.3 dB (Opus 64 kbit/s) — far above the
// 20 dB bound — and the 25 Hz pulse rate stays within 1 %, so no bound had to be widened. The
// detection thresholds are the signature's own (10 dB lines, kurtosis 6, flatness 0.5; common
// practice, no source).
const RATE = 8000;
const N = RATE * 4;
const quiet = () => whiteNoise(N, 0.003, 11);

const CODECS = [
  { name: 'MP3', encode: (x: Float32Array, rate: number) => mp3Bytes(x, rate, 64), mime: 'audio/mpeg', format: 'MP3' },
  { name: 'Ogg Vorbis', encode: (x: Float32Array, rate: number) => vorbisBytes(x, rate, 6), mime: 'audio/ogg', format: 'Ogg Vorbis' },
  { name: 'Ogg Opus', encode: async (x: Float32Array, rate: number) => opusBytes(x, rate, 64), mime: 'audio/ogg; codecs=opus', format: 'Ogg Opus' },
] as const;

describe.each(CODECS)('$name recordings: decoded, then the same detections as the WAV', ({ encode, mime, format }) => {
  const analyse = async (x: Float32Array, rate = RATE) => {
    const d = await decodeRecording(await encode(x, rate), mime);
    expect(d.format).toBe(format);
    expect(d.seconds).toBeGreaterThan(x.length / rate - 0.1);
    return audioSignature(d.samples, d.sampleRate);
  };

  it('a 50 Hz harmonic family is found as 50 Hz', async () => {
    const s = await analyse(mix(harmonicFamily(N, RATE, 50), quiet()));
    expect(s.mainsHz).toBe(50);
    expect(s.mainsFamilyDb).toBeGreaterThan(20);
    expect(s.broadband).toBe(false);
  });

  it('a 60 Hz harmonic family is found as 60 Hz, not 50', async () => {
    const s = await analyse(mix(harmonicFamily(N, RATE, 60), quiet()));
    expect(s.mainsHz).toBe(60);
    expect(s.mainsFamilyDb).toBeGreaterThan(20);
  });

  it('a pulse train at 25 Hz is found at its rate (within 1 %), with no mains family', async () => {
    const s = await analyse(mix(pulseTrain(N, RATE, 25), quiet()));
    expect(s.pulseRateHz).not.toBeNull();
    expect(Math.abs(s.pulseRateHz! - 25) / 25).toBeLessThan(0.01);
    expect(s.mainsHz).toBeNull();
  });

  it('white noise is broadband hiss, with no family and no pulse train', async () => {
    const s = await analyse(whiteNoise(N, 0.2, 21));
    expect(s.broadband).toBe(true);
    expect(s).toMatchObject({ mainsHz: null, pulseRateHz: null });
  });

  it('a pure 1234 Hz tone at 44.1 kHz keeps its peak there', async () => {
    const rate = 44100;
    const d = await decodeRecording(await encode(mix(tone(rate * 2, rate, 1234, 0.5), whiteNoise(rate * 2, 0.003, 5)), rate), mime);
    const s = audioSignature(d.samples, d.sampleRate);
    const peak = s.spectrum.db.indexOf(Math.max(...s.spectrum.db));
    expect(Math.abs(peak * s.spectrum.hzPerPoint - 1234)).toBeLessThanOrEqual(2 * s.spectrum.hzPerPoint);
    expect(s.mainsHz).toBeNull();
  });

  it('a file cut in the middle is refused as truncated, naming where it ends', async () => {
    const whole = await encode(mix(harmonicFamily(N, RATE, 50), quiet()), RATE);
    const cut = whole.slice(0, Math.floor(whole.length * 0.6) + 17);
    const err = await decodeRecording(cut, mime).catch((e) => e);
    expect(err).toBeInstanceOf(AudioRefused);
    expect(err.reason).toBe('damaged');
    expect(err.message).toMatch(new RegExp(`truncated: its last (frame|page) \\(number \\d+\\) has \\d+ of its \\d+ bytes and the file ends at byte ${cut.length}`));
  });
});

describe('decoding limits and refusals', () => {
  it('MPEG frame lengths from the header alone (values recalled from memory of the ISO/IEC 11172-3 formula, checked against LAME output below)', () => {
    expect(mpegFrameLength(Uint8Array.of(0xff, 0xfb, 0x90, 0x00))).toBe(417); // MPEG-1 layer III, 128 kbit/s, 44.1 kHz
    expect(mpegFrameLength(Uint8Array.of(0xff, 0xfb, 0x92, 0x00))).toBe(418); // the same, padded
    expect(mpegFrameLength(Uint8Array.of(0xff, 0xe3, 0x88, 0xc4))).toBe(576); // MPEG-2.5 layer III, 64 kbit/s, 8 kHz
    expect(mpegFrameLength(Uint8Array.of(0xff, 0xfb, 0xf0, 0x00))).toBeNull(); // bitrate index 15 is not allowed
  });

  it('a truncated MP3 names the frame and its full length (LAME: 64 kbit/s at 8 kHz is 576-byte frames)', async () => {
    const whole = await mp3Bytes(whiteNoise(8000 * 3, 0.1, 6), 8000, 64);
    await expect(decodeRecording(whole.slice(0, 10_001), 'audio/mpeg')).rejects.toThrow(/its last frame \(number 18\) has 209 of its 576 bytes and the file ends at byte 10001/);
    await expect(decodeRecording(whole.slice(0, 9792), 'audio/mpeg')).resolves.toMatchObject({ format: 'MP3' }); // cut exactly after frame 17: a cut on a frame boundary cannot be told from a whole file
  });

  it('decodes at most the first 60 s of a longer MP3, and says how long the whole is', async () => {
    const rate = 8000;
    const t = performance.now();
    const d = await decodeRecording(await mp3Bytes(whiteNoise(rate * 75, 0.1, 4), rate, 32), 'audio/mpeg', 60);
    expect(d.samples.length).toBe(60 * rate);
    expect(d.truncatedTo).toBe(60);
    expect(d.seconds).toBeGreaterThan(74.9);
    expect(performance.now() - t).toBeLessThan(30_000); // encode + decode on a slow machine, common practice, no source
  });

  it('a stereo 48 kHz MP3 comes out as one channel at 48 kHz', async () => {
    const d = await decodeRecording(await mp3Bytes(tone(48000, 48000, 440, 0.3), 48000, 128, 2), 'audio/mpeg');
    expect(d).toMatchObject({ sampleRate: 48000, channels: 2 });
    expect(d.samples.length).toBeGreaterThan(47000);
  });

  it('bytes sniffed as MP3 that hold no frames are refused as damaged', async () => {
    const junk = new Uint8Array(5000).map((_, i) => (i * 37) % 251);
    await expect(decodeRecording(junk, 'audio/mpeg')).rejects.toThrow(/No MPEG audio frames were found in these 5000 bytes/);
  });

  it('M4A/AAC is stored but not analysed, with a message that suggests WAV, MP3 or OGG', async () => {
    expect(isAnalysable('audio/mp4')).toBe(false);
    expect(isAnalysable('audio/mpeg') && isAnalysable('audio/ogg') && isAnalysable('audio/ogg; codecs=opus') && isAnalysable('audio/wav')).toBe(true);
    const err = await decodeRecording(new Uint8Array(100), 'audio/x-m4a').catch((e) => e);
    expect(err.reason).toBe('not-analysed');
    expect(err.message).toMatch(/M4A\/AAC.*stored.*not analysed.*WAV, MP3 or OGG/);
  });

  it('WAV goes through the same entry (wav.ts)', async () => {
    const d = await decodeRecording(wavBytes(tone(8000, 8000, 440), 8000, 2), 'audio/wav');
    expect(d).toMatchObject({ format: 'WAV', sampleRate: 8000, channels: 2, truncatedTo: null });
  });
});
