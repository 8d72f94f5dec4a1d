/** opus-encdec 0.1 ships no types; the parts the tests use (tests/support/encoders.ts). */
declare module 'opus-encdec/dist/libopus-encoder.js' {
  const Module: { isReady: boolean; onready?: () => void };
  export = Module;
}
declare module 'opus-encdec/src/oggOpusEncoder.js' {
  type Page = { page: Uint8Array };
  export class OggOpusEncoder {
    constructor(config: { originalSampleRate: number; numberOfChannels: number; encoderSampleRate?: number; encoderApplication?: number; serial?: number; encoderBitRate?: number }, Module: unknown);
    generateIdPage(): Page;
    generateCommentPage(): Page;
    encode(buffers: Float32Array[]): Page[];
    encodeFinalFrame(): Page[];
    destroy(): void;
  }
}
