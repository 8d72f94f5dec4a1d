/** Shared by the decoders in lib/audio: the sample rates a signature is made for, and the mono mix. */
export const MIN_RATE = 8000;
export const MAX_RATE = 48000;

/** The first `n` samples of every channel averaged into one (stereo: (L + R) / 2). */
export function mixToMono(channelData: Float32Array[], n: number): Float32Array {
  const out = new Float32Array(n);
  for (const ch of channelData) for (let i = 0; i < n; i++) out[i] += ch[i] / channelData.length;
  return out;
}
