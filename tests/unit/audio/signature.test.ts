import { describe, expect, it } from 'vitest';
import { audioSignature } from '@/lib/audio/signature';
import { AudioRefused, decodeWav, inspectWav } from '@/lib/audio/wav';
import { harmonicFamily, mix, pulseTrain, tone, wavBytes, whiteNoise } from '../../support/signals';

// Synthetic signals made here; the expected detections follow from how each was built.
// The thresholds themselves (10 dB lines, kurtosis 6, flatness 0.5) are common practice, no source.
const RATE = 8000;
const N = RATE * 4; // 4 s
const quiet = () => whiteNoise(N, 0.003, 11); // about -50 dBFS: a receiver's own hiss, far below the lines

describe('audio signature on synthetic recordings', () => {
  it('a pure 1234 Hz tone: the spectrum peaks there, and nothing is detected', () => {
    const s = audioSignature(mix(tone(N, RATE, 1234, 0.5), quiet()), RATE);
    const peak = s.spectrum.db.indexOf(Math.max(...s.spectrum.db));
    expect(Math.abs(peak * s.spectrum.hzPerPoint - 1234)).toBeLessThanOrEqual(2 * s.spectrum.hzPerPoint);
    expect(s).toMatchObject({ mainsHz: null, pulseRateHz: null, broadband: false });
    expect(s.hint).toMatch(/No mains family/);
  });

  it('a 50 Hz harmonic family is found as 50 Hz, with its strength in dB', () => {
    const s = audioSignature(mix(harmonicFamily(N, RATE, 50), quiet()), RATE);
    expect(s.mainsHz).toBe(50);
    expect(s.mainsFamilyDb).toBeGreaterThan(20);
    expect(s.mainsLines[0].hz).toBe(50);
    expect(s.broadband).toBe(false);
    expect(s.hint).toMatch(/harmonics of 50 Hz/);
    expect(s.hint).toMatch(/not a finding/);
  });

  it('a 60 Hz harmonic family is found as 60 Hz, not 50', () => {
    const s = audioSignature(mix(harmonicFamily(N, RATE, 60), quiet()), RATE);
    expect(s.mainsHz).toBe(60);
    expect(s.mainsFamilyDb).toBeGreaterThan(20);
  });

  it('a family led by 100 Hz reads as the 100/200 Hz family (rectifier or arcing, as common practice)', () => {
    const fam = mix(tone(N, RATE, 100, 0.3), tone(N, RATE, 200, 0.15, 1), tone(N, RATE, 300, 0.1, 2), tone(N, RATE, 50, 0.02), quiet());
    const s = audioSignature(fam, RATE);
    expect(s.mainsHz).toBe(50);
    expect(s.mainsLines[0].hz).toBe(100);
    expect(s.hint).toMatch(/Strong 100\/200 Hz family/);
  });

  it('a pulse train at 25 Hz is found at its rate (within 1 %)', () => {
    const s = audioSignature(mix(pulseTrain(N, RATE, 25), quiet()), RATE);
    expect(s.pulseRateHz).not.toBeNull();
    expect(Math.abs(s.pulseRateHz! - 25) / 25).toBeLessThan(0.01);
    expect(s.kurtosis).toBeGreaterThan(6);
    // Its lines at every 25 Hz also sit on 50 Hz multiples, and half-way between them: no mains family.
    expect(s.mainsHz).toBeNull();
  });

  it('pulses at 100 Hz are both a pulse train and a 50 Hz family, and the hint says mains-locked', () => {
    const s = audioSignature(mix(pulseTrain(N, RATE, 100), quiet()), RATE);
    expect(Math.abs(s.pulseRateHz! - 100)).toBeLessThan(1);
    expect(s.mainsHz).toBe(50);
    expect(s.hint).toMatch(/Pulses at 100 Hz, locked to the mains/);
    expect(s.hint).toMatch(/never approach or touch it/);
  });

  it('a pulse train at 137 Hz (not a mains multiple) at 44.1 kHz stereo, through the WAV decoder', () => {
    const rate = 44100;
    const x = mix(pulseTrain(rate * 3, rate, 137), whiteNoise(rate * 3, 0.003, 5));
    const wav = decodeWav(wavBytes(x, rate, 2));
    expect(wav.info).toMatchObject({ sampleRate: 44100, channels: 2, bitsPerSample: 16 });
    const s = audioSignature(wav.samples, wav.sampleRate);
    expect(Math.abs(s.pulseRateHz! - 137) / 137).toBeLessThan(0.01);
  });

  it('slow pulses about once a second (an energiser-like rate) over 12 s', () => {
    const n = RATE * 12;
    const s = audioSignature(mix(pulseTrain(n, RATE, 1.1, 0.002), whiteNoise(n, 0.003, 9)), RATE);
    expect(Math.abs(s.pulseRateHz! - 1.1) / 1.1).toBeLessThan(0.02);
    expect(s.hint).toMatch(/electric fence/);
  });

  it('white noise is broadband hiss, with no family and no pulse train', () => {
    const s = audioSignature(whiteNoise(N, 0.2, 21), RATE);
    expect(s.broadband).toBe(true);
    expect(s.flatness).toBeGreaterThan(0.8);
    expect(s).toMatchObject({ mainsHz: null, pulseRateHz: null });
    expect(s.hint).toMatch(/Broadband hiss/);
  });

  it('analyses at most the first 60 s and gives a spectrogram matrix', () => {
    const rate = 8000;
    const s = audioSignature(whiteNoise(rate * 65, 0.1, 4), rate);
    expect(s.seconds).toBe(60);
    expect(s.spectrogram.db.length).toBe(120);
    expect(s.spectrogram.db[0].length).toBe(128);
    expect(s.spectrogram.secondsPerColumn * 120).toBeCloseTo(60, 0);
  });
});

describe('WAV input that cannot be analysed', () => {
  const good = wavBytes(tone(8000, 8000, 440), 8000);
  it('a truncated file names the data chunk, its declared size and where the file ends', () => {
    const cut = good.slice(0, 3000);
    expect(() => inspectWav(cut)).toThrow(AudioRefused);
    expect(() => inspectWav(cut)).toThrow(/truncated: its data chunk at byte 36 declares 16000 bytes but the file ends 2956 bytes later \(at byte 3000\)/);
  });
  it('an HTML page named .wav is not a WAV', () => {
    expect(() => inspectWav(new TextEncoder().encode('<!doctype html><html><body>hi</body></html>'))).toThrow(/bytes 0–11 are not "RIFF….WAVE"/);
  });
  it('96 kHz and µ-law are refused with the byte where the header says so', () => {
    const hi = wavBytes(tone(100, 96000, 440), 96000);
    expect(() => inspectWav(hi)).toThrow(/96000 Hz \(byte 24\); 8000–48000 Hz/);
    const mulaw = good.slice();
    new DataView(mulaw.buffer).setUint16(20, 7, true);
    expect(() => inspectWav(mulaw)).toThrow(/format 0x7 \(byte 20\)/);
  });
});
