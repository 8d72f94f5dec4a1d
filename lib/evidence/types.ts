import type { AudioAnalysis, FileKind } from '@/db/files';

/** The signature fields of a recording that has none (yet). */
export const NO_SIGNATURE = { mainsHz: null, mainsFamilyDb: null, pulseRateHz: null, broadband: false, hint: '' } as const satisfies Omit<AudioAnalysis, 'status'>;

/**
 * What may be uploaded, decided from the content (file-type's sniffing), never the name or the
 * browser's claim. HEIC is refused: sharp's prebuilt build has no HEVC; libheif-js (wasm) could
 * decode it, but without an honest HEIC test input (no npm encoder, no shipped sample) the
 * metadata-free copy could not be tested, so its location could leak (DEVELOPERS.md, Evidence).
 */
const SNIFFED: Record<string, FileKind> = {
  'audio/wav': 'audio',
  'audio/mpeg': 'audio',
  'audio/ogg': 'audio',
  'audio/ogg; codecs=opus': 'audio',
  'audio/opus': 'audio',
  'audio/mp4': 'audio',
  'audio/x-m4a': 'audio',
  'image/jpeg': 'photo',
  'image/png': 'photo',
  'image/webp': 'photo',
  'application/pdf': 'document',
};

export const KIND_WORDS: Record<FileKind, string> = { audio: 'a recording', photo: 'a photo', document: 'a PDF' };

/** The kind a sniffed type belongs to, or null when it may not be uploaded. */
export const kindOfSniffed = (mime: string): FileKind | null => SNIFFED[mime] ?? null;

/** The kind the browser claims (from its Content-Type), or null when no upload of that kind exists. */
export function kindOfDeclared(type: string): FileKind | null {
  const t = type.toLowerCase().split(';')[0].trim();
  if (t.startsWith('audio/')) return 'audio';
  if (['image/jpeg', 'image/png', 'image/webp'].includes(t)) return 'photo';
  if (t === 'application/pdf') return 'document';
  return null;
}

/** Shown inline in the browser (never anything that could be HTML or script): images and audio only. */
export const showsInline = (kind: FileKind | null) => kind === 'audio' || kind === 'photo';

/** A Content-Disposition with an ASCII fallback and the UTF-8 name (RFC 6266, RFC 8187). */
export function disposition(kind: FileKind | null, name: string): string {
  const ascii = name.replace(/[^\x20-\x7e]/g, '_').replace(/["\\]/g, '_');
  return `${showsInline(kind) ? 'inline' : 'attachment'}; filename="${ascii}"; filename*=UTF-8''${encodeURIComponent(name)}`;
}
