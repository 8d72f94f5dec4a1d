/** wav-decoder 1.3 ships no types. */
declare module 'wav-decoder' {
  export type AudioData = { sampleRate: number; numberOfChannels: number; length: number; channelData: Float32Array[] };
  export const decode: {
    (buffer: ArrayBuffer | Buffer, opts?: { symmetric?: boolean }): Promise<AudioData>;
    sync(buffer: ArrayBuffer | Buffer, opts?: { symmetric?: boolean }): AudioData;
  };
}
