import type { Knex } from 'knex';
import { db } from './index';

/** Evidence files on a case (migrations/20261202060000_case_files.ts). */
export type FileKind = 'audio' | 'photo' | 'document';
export type AudioAnalysis = {
  /** refused: damaged or an unsupported variant; not-analysed: a format kept but never decoded (M4A) */
  status: 'queued' | 'ready' | 'refused' | 'not-analysed' | 'failed';
  mainsHz: 50 | 60 | null;
  mainsFamilyDb: number | null;
  pulseRateHz: number | null;
  broadband: boolean;
  hint: string;
  /** why it was refused, not analysed, or failed */
  message?: string;
};
export type CaseFile = {
  id: string;
  caseId: string;
  uploadedBy: string | null;
  uploaderName: string | null;
  name: string;
  declaredType: string;
  size: number;
  objectKey: string;
  status: 'pending' | 'ready';
  kind: FileKind | null;
  contentType: string | null;
  publicKey: string | null;
  thumbKey: string | null;
  analysis: AudioAnalysis | null;
  createdAt: Date;
  completedAt: Date | null;
};

const fromDb = (r: Record<string, any>): CaseFile => ({
  id: r.id,
  caseId: r.case_id,
  uploadedBy: r.uploaded_by,
  uploaderName: r.uploader_name ?? null,
  name: r.name,
  declaredType: r.declared_type,
  size: Number(r.size),
  objectKey: r.object_key,
  status: r.status,
  kind: r.kind,
  contentType: r.content_type,
  publicKey: r.public_key,
  thumbKey: r.thumb_key,
  analysis: r.analysis,
  createdAt: r.created_at,
  completedAt: r.completed_at,
});

const withUploader = (q: Knex) => q('case_files as f').leftJoin('users as u', 'u.id', 'f.uploaded_by').select('f.*', 'u.name as uploader_name');

export async function insertFile(trx: Knex, f: { id: string; caseId: string; uploadedBy: string; name: string; declaredType: string; size: number; objectKey: string }): Promise<void> {
  await trx('case_files').insert({ id: f.id, case_id: f.caseId, uploaded_by: f.uploadedBy, name: f.name, declared_type: f.declaredType, size: f.size, object_key: f.objectKey });
}

export async function getFile(caseId: string, id: string, q: Knex = db): Promise<CaseFile | undefined> {
  const r = await withUploader(q).where({ 'f.case_id': caseId, 'f.id': id }).first();
  return r && fromDb(r);
}

export async function getFileById(id: string, q: Knex = db): Promise<CaseFile | undefined> {
  const r = await withUploader(q).where({ 'f.id': id }).first();
  return r && fromDb(r);
}

export async function lockFile(trx: Knex.Transaction, caseId: string, id: string): Promise<CaseFile | undefined> {
  const r = await trx('case_files').where({ case_id: caseId, id }).forUpdate().first();
  return r && fromDb(r);
}

/** Completed files of a case, newest first. */
export async function listFiles(caseId: string, q: Knex = db): Promise<CaseFile[]> {
  const rows = await withUploader(q).where({ 'f.case_id': caseId, 'f.status': 'ready' }).orderBy('f.created_at', 'desc');
  return rows.map(fromDb);
}

export async function markFileReady(trx: Knex, id: string, p: { kind: FileKind; contentType: string; analysis: AudioAnalysis | null }): Promise<void> {
  await trx('case_files')
    .where({ id })
    .update({ status: 'ready', kind: p.kind, content_type: p.contentType, analysis: p.analysis ? JSON.stringify(p.analysis) : null, completed_at: trx.fn.now() });
}

export async function saveAnalysis(q: Knex, id: string, analysis: AudioAnalysis, signature: unknown | null): Promise<void> {
  await q('case_files').where({ id }).update({ analysis: JSON.stringify(analysis), signature: signature === null ? null : JSON.stringify(signature) });
}

export async function getSignature(id: string, q: Knex = db): Promise<unknown | null> {
  const r = await q('case_files').where({ id }).first('signature');
  return r?.signature ?? null;
}

export async function savePhotoCopies(q: Knex, id: string, p: { publicKey: string; thumbKey: string }): Promise<void> {
  await q('case_files').where({ id }).update({ public_key: p.publicKey, thumb_key: p.thumbKey });
}

export async function deleteFileRow(trx: Knex, id: string): Promise<void> {
  await trx('case_files').where({ id }).delete();
}

/** Uploads never completed within `hours`: their rows go, their objects are deleted by the caller. */
export async function takeStaleUploads(trx: Knex, hours: number, limit = 200): Promise<{ id: string; objectKey: string }[]> {
  const rows = await trx('case_files')
    .where({ status: 'pending' })
    .andWhereRaw("created_at < now() - make_interval(hours => ?)", [hours])
    .orderBy('created_at')
    .limit(limit)
    .forUpdate()
    .skipLocked()
    .select('id', 'object_key');
  if (rows.length) await trx('case_files').whereIn('id', rows.map((r) => r.id)).delete();
  return rows.map((r) => ({ id: r.id, objectKey: r.object_key }));
}
