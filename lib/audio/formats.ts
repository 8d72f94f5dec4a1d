/**
 * Which sniffed recording types get an audio signature (decoded in lib/audio/decode.ts) and what
 * is said about the others. Kept apart from the decoders so that the upload route can ask without
 * loading them: only the worker decodes.
 */
export const ANALYSED = {
  'audio/wav': 'WAV',
  'audio/mpeg': 'MP3',
  'audio/ogg': 'Ogg Vorbis',
  'audio/ogg; codecs=opus': 'Ogg Opus',
  'audio/opus': 'Ogg Opus',
} as const;

export type AnalysedMime = keyof typeof ANALYSED;
export type AnalysedFormat = (typeof ANALYSED)[AnalysedMime];

/** Whether recordings of this sniffed type get an audio signature. */
export const isAnalysable = (mime: string): mime is AnalysedMime => Object.hasOwn(ANALYSED, mime);

/** What the case page says about a recording kept but not analysed. */
export const notAnalysedMessage = (mime: string): string =>
  `This recording (${mime === 'audio/mp4' || mime === 'audio/x-m4a' ? 'M4A/AAC' : mime}) is stored and can be played, but its format is not analysed here, so it has no audio signature. For one, upload it as WAV, MP3 or OGG (Vorbis or Opus).`;
