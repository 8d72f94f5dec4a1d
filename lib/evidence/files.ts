import type { Knex } from 'knex';
import { randomUUID } from 'node:crypto';
import { fileTypeFromBuffer } from 'file-type';
import type { z } from 'zod';
import { appendEvent } from '@/db/cases';
import { deleteFileRow, insertFile, lockFile, markFileReady, type AudioAnalysis, type CaseFile } from '@/db/files';
import { addJob } from '@/db/jobs';
import { getClubSettings } from '@/db/settings';
import type { User } from '@/db/types';
import { AppError, forbidden, notFound, payloadTooLarge, unsupportedMediaType } from '@/lib/errors';
import { fileAccess } from '@/lib/hunt/access';
import { lockVisibleCase } from '@/lib/hunt/case-detail';
import { isAnalysable, notAnalysedMessage } from '@/lib/audio/formats';
import { AudioRefused, inspectWav } from '@/lib/audio/wav';
import { JOB } from '@/lib/jobs/names';
import { deleteObjects, objectSize, presignPut, readObject } from '@/lib/storage/s3';
import type { uploadRequestSchema } from '@/lib/validation/files';
import { KIND_WORDS, kindOfDeclared, kindOfSniffed, NO_SIGNATURE } from './types';

/**
 * Evidence uploads: presign -> the browser PUTs the bytes to object storage -> complete, where
 * the server reads the first bytes and decides the type from the content. A refused upload
 * leaves nothing: its object and its row are deleted in the same request.
 */
const SNIFF_BYTES = 4100; // what file-type needs for every format it knows
const MB = 1_000_000;

export type UploadTicket = { fileId: string; uploadUrl: string; method: 'PUT'; headers: Record<string, string>; maxBytes: number };

export async function createUpload(trx: Knex.Transaction, me: User, caseId: string, input: z.output<typeof uploadRequestSchema>): Promise<UploadTicket> {
  const { access } = await lockVisibleCase(trx, me, caseId);
  if (!fileAccess(me, access).add) throw forbidden('Files can be added by those who may add to this case.');
  const maxBytes = (await getClubSettings(trx)).uploadMaxMb * MB;
  if (input.size > maxBytes) throw payloadTooLarge(`The file is ${(input.size / MB).toFixed(1)} MB; the club's limit is ${maxBytes / MB} MB.`);
  if (!kindOfDeclared(input.contentType)) throw unsupportedMediaType(`"${input.contentType}" files cannot be attached: recordings (WAV, MP3, OGG/Opus, M4A), photos (JPEG, PNG, WebP) or PDFs only.`);
  const fileId = randomUUID();
  const objectKey = `cases/${caseId}/${fileId}`;
  await insertFile(trx, { id: fileId, caseId, uploadedBy: me.id, name: input.name, declaredType: input.contentType, size: input.size, objectKey });
  const uploadUrl = await presignPut(objectKey, { size: input.size, contentType: input.contentType });
  return { fileId, uploadUrl, method: 'PUT', headers: { 'Content-Type': input.contentType }, maxBytes };
}

export type Refused = { refused: AppError };

/** Refuses the upload: the object and the row go (the deletion commits), the caller answers with the error. */
async function refuse(trx: Knex.Transaction, f: CaseFile, err: AppError): Promise<Refused> {
  await deleteObjects([f.objectKey]);
  await deleteFileRow(trx, f.id);
  return { refused: err };
}

/**
 * The uploader says the bytes are there: check size and content, then the file is ready and its
 * jobs (audio signature, photo copies) are queued in the same transaction. A refusal is returned,
 * not thrown, so that the row's deletion commits; the route then answers with it.
 */
export async function completeUpload(trx: Knex.Transaction, me: User, caseId: string, fileId: string): Promise<CaseFile | Refused> {
  await lockVisibleCase(trx, me, caseId);
  const f = await lockFile(trx, caseId, fileId);
  if (!f || f.uploadedBy !== me.id) throw notFound('No such upload.');
  if (f.status === 'ready') return f;
  const size = await objectSize(f.objectKey);
  if (size === null) throw new AppError(409, 'The file has not arrived yet: send it first, then complete.');
  const maxBytes = (await getClubSettings(trx)).uploadMaxMb * MB;
  if (size > maxBytes) return refuse(trx, f, payloadTooLarge(`The stored file is ${(size / MB).toFixed(1)} MB; the club's limit is ${maxBytes / MB} MB. It was deleted.`));
  if (size !== f.size) return refuse(trx, f, new AppError(400, `The stored file is ${size} bytes, not the ${f.size} announced. It was deleted; try again.`));
  const head = await readObject(f.objectKey, Math.min(size, SNIFF_BYTES));
  const sniffed = await fileTypeFromBuffer(head);
  const kind = sniffed ? kindOfSniffed(sniffed.mime) : null;
  const claimed = kindOfDeclared(f.declaredType);
  if (!sniffed || !kind) {
    const what = sniffed ? `${sniffed.mime} content` : looksLikeText(head) ? 'text (perhaps a web page)' : 'content of no known type';
    return refuse(trx, f, unsupportedMediaType(`"${f.name}" holds ${what}, not a recording, photo or PDF. It was deleted.`));
  }
  if (kind !== claimed) return refuse(trx, f, unsupportedMediaType(`"${f.name}" was sent as ${f.declaredType} but its content is ${KIND_WORDS[kind]} (${sniffed.mime}). It was deleted.`));
  let analysis: AudioAnalysis | null = null;
  if (kind === 'audio') {
    if (sniffed.mime === 'audio/wav') {
      try {
        inspectWav(head, size);
      } catch (err) {
        if (err instanceof AudioRefused) return refuse(trx, f, new AppError(422, `"${f.name}": ${err.message} It was deleted.`));
        throw err;
      }
    }
    analysis = isAnalysable(sniffed.mime) ? { status: 'queued', ...NO_SIGNATURE } : { status: 'not-analysed', ...NO_SIGNATURE, message: notAnalysedMessage(sniffed.mime) };
  }
  await markFileReady(trx, f.id, { kind, contentType: sniffed.mime, analysis });
  if (analysis?.status === 'queued') await addJob(trx, JOB.analyseAudio, { fileId: f.id }, { jobKey: `audio:${f.id}`, maxAttempts: 3 });
  if (kind === 'photo') await addJob(trx, JOB.makeThumbnail, { fileId: f.id }, { jobKey: `photo:${f.id}`, maxAttempts: 3 });
  await appendEvent(trx, { caseId, actorId: me.id, kind: 'comment', data: { text: `Attached ${KIND_WORDS[kind]}: ${f.name}.`, fileId: f.id }, visibility: 'all' });
  return { ...f, status: 'ready', kind, contentType: sniffed.mime, analysis };
}

function looksLikeText(b: Uint8Array): boolean {
  const n = Math.min(b.length, 512);
  let printable = 0;
  for (let i = 0; i < n; i++) if (b[i] === 9 || b[i] === 10 || b[i] === 13 || (b[i] >= 32 && b[i] < 127)) printable++;
  return n > 0 && printable / n > 0.95;
}

/** Deletes a file (uploader or the committee): the row in the transaction, the objects after. */
export async function deleteFile(trx: Knex.Transaction, me: User, caseId: string, fileId: string): Promise<string[]> {
  const { access } = await lockVisibleCase(trx, me, caseId);
  const f = await lockFile(trx, caseId, fileId);
  if (!f) throw notFound('No such file.');
  if (!fileAccess(me, access, f).delete) throw forbidden('A file can be deleted by whoever attached it or by the committee.');
  await deleteFileRow(trx, f.id);
  await appendEvent(trx, { caseId, actorId: me.id, kind: 'comment', data: { text: `Removed the attachment ${f.name}.`, fileId: f.id }, visibility: 'committee' });
  return [f.objectKey, f.publicKey, f.thumbKey].filter((k): k is string => !!k);
}
