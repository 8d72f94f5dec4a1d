import type { Knex } from 'knex';
import type { TaskList } from 'graphile-worker';
import sharp from 'sharp';
import { db } from '@/db';
import { getFileById, saveAnalysis, savePhotoCopies, takeStaleUploads, type AudioAnalysis } from '@/db/files';
import { audioSignature } from '@/lib/audio/signature';
import { decodeRecording } from '@/lib/audio/decode';
import { AudioRefused } from '@/lib/audio/wav';
import { JOB } from '@/lib/jobs/names';
import { jobPayload } from '@/lib/jobs/tasks';
import { NO_SIGNATURE } from './types';
import { deleteObjects, putObject, readObject } from '@/lib/storage/s3';

/**
 * The audio signature of one uploaded recording (WAV, MP3, Ogg Vorbis/Opus): decoded
 * (lib/audio/decode.ts, at most the first 60 s), analysed (lib/audio/signature.ts), stored on the
 * file. A recording that cannot be decoded gets a status and a message, never a failed job loop.
 */
export async function analyseAudio(fileId: string, q: Knex = db, lastTry = true): Promise<AudioAnalysis['status'] | 'gone'> {
  const f = await getFileById(fileId, q);
  if (!f || f.status !== 'ready') return 'gone';
  try {
    const bytes = await readObject(f.objectKey);
    const rec = await decodeRecording(bytes, f.contentType ?? '', 60);
    const s = audioSignature(rec.samples, rec.sampleRate, 60);
    const { spectrum, spectrogram, ...figures } = s;
    const notes = [...(rec.truncatedTo ? [`The first ${rec.truncatedTo} s of ${rec.seconds.toFixed(0)} s were analysed.`] : []), ...rec.notes];
    const hint = notes.length ? `${s.hint} (${notes.join(' ')})` : s.hint;
    await saveAnalysis(q, f.id, { status: 'ready', mainsHz: s.mainsHz, mainsFamilyDb: s.mainsFamilyDb, pulseRateHz: s.pulseRateHz, broadband: s.broadband, hint }, { ...figures, hint, spectrum, spectrogram });
    return 'ready';
  } catch (err) {
    if (err instanceof AudioRefused) {
      const status = err.reason === 'not-analysed' ? 'not-analysed' : 'refused';
      await saveAnalysis(q, f.id, { status, ...NO_SIGNATURE, message: err.message }, null);
      return status;
    }
    if (lastTry) await saveAnalysis(q, f.id, { status: 'failed', ...NO_SIGNATURE, message: 'The analysis could not be run; the recording itself is kept.' }, null);
    throw err;
  }
}

/**
 * A photo's two copies: the one everyone but the committee downloads (turned upright, then
 * re-encoded without EXIF/GPS/XMP — sharp writes no metadata unless asked), and a 320-px JPEG
 * thumbnail made the same way.
 */
export async function makePhotoCopies(fileId: string, q: Knex = db): Promise<'done' | 'gone'> {
  const f = await getFileById(fileId, q);
  if (!f || f.status !== 'ready' || f.kind !== 'photo' || !f.contentType) return 'gone';
  const bytes = await readObject(f.objectKey);
  const format = f.contentType === 'image/png' ? 'png' : f.contentType === 'image/webp' ? 'webp' : 'jpeg';
  const stripped = await sharp(bytes).rotate().toFormat(format).toBuffer();
  const thumb = await sharp(bytes).rotate().resize(320, 320, { fit: 'inside', withoutEnlargement: true }).jpeg({ quality: 75 }).toBuffer();
  const publicKey = `${f.objectKey}.public`;
  const thumbKey = `${f.objectKey}.thumb.jpg`;
  await putObject(publicKey, stripped, f.contentType);
  await putObject(thumbKey, thumb, 'image/jpeg');
  await savePhotoCopies(q, f.id, { publicKey, thumbKey });
  return 'done';
}

/** Uploads never completed within a day: their rows and objects go. */
export async function cleanStaleUploads(q: Knex = db, hours = 24): Promise<number> {
  const gone = await q.transaction((trx) => takeStaleUploads(trx, hours));
  await deleteObjects(gone.map((g) => g.objectKey));
  return gone.length;
}

/** The evidence jobs for the worker's task list. */
export function evidenceTasks(): TaskList {
  return {
    [JOB.analyseAudio]: async (payload, helpers) => {
      const r = await analyseAudio(jobPayload(payload, 'fileId').fileId, db, helpers.job.attempts >= helpers.job.max_attempts);
      helpers.logger.info(`audio signature: ${r}`);
    },
    [JOB.makeThumbnail]: async (payload) => {
      await makePhotoCopies(jobPayload(payload, 'fileId').fileId);
    },
    [JOB.cleanUploads]: async (_payload, helpers) => {
      const n = await cleanStaleUploads();
      if (n) helpers.logger.info(`removed ${n} upload(s) never completed`);
    },
  };
}
