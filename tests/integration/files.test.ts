/**
 * Evidence files end to end against the real pieces: the app, PostgreSQL, the queue worker and
 * the local S3-compatible store (s3rver). Recordings are synthetic (tests/support/signals.ts);
 * photos are made here with sharp, with GPS EXIF written in. Our own fictional case.
 */
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import sharp from 'sharp';
import { db, inTransaction } from '@/db';
import { insertCase } from '@/db/cases';
import { getUserByEmail } from '@/db/users';
import { cleanStaleUploads } from '@/lib/evidence/tasks';
import { objectSize, putObject } from '@/lib/storage/s3';
import { api, signIn, waitFor, type Session } from '../support/http';
import { m4aHeaderOnly, mp3Bytes, opusBytes } from '../support/encoders';
import { harmonicFamily, mix, pulseTrain, wavBytes, whiteNoise } from '../support/signals';

let hunter: Session;
let coordinator: Session;
let member: Session;
let caseId: string;

beforeAll(async () => {
  [hunter, coordinator, member] = await Promise.all([signIn('hunter@example.test'), signIn('coordinator@example.test'), signIn('member@example.test')]);
  const [m, h] = await Promise.all([getUserByEmail('member@example.test'), getUserByEmail('hunter@example.test')]);
  caseId = await inTransaction(async (trx) => (await insertCase(trx, { title: 'Evidence test', description: '', reporterId: m!.id, reportedLat: -31.058, reportedLon: 129.759, bands: ['40m'], assigneeId: h!.id })).id);
});

afterAll(async () => {
  await db('club_settings').where({ id: 1 }).update({ upload_max_mb: 25 });
  await db('cases').where({ id: caseId }).del();
});

type Sent = { ticket: any; put: number; complete: Awaited<ReturnType<typeof api>>; ms: { presign: number; put: number; complete: number } };

/** The browser's three steps: ask, PUT the bytes to the presigned URL, complete. */
async function upload(session: Session, bytes: Uint8Array, name: string, contentType: string, announce = bytes.length): Promise<Sent> {
  const t0 = Date.now();
  const ask = await api(`/api/cases/${caseId}/files`, { session, body: { name, size: announce, contentType } });
  expect(ask.status, ask.text).toBe(201);
  const t1 = Date.now();
  const put = await fetch(ask.json.uploadUrl, { method: 'PUT', headers: ask.json.headers, body: Buffer.from(bytes) });
  const t2 = Date.now();
  const complete = await api(`/api/cases/${caseId}/files/${ask.json.fileId}/complete`, { session, body: {} });
  return { ticket: ask.json, put: put.status, complete, ms: { presign: t1 - t0, put: t2 - t1, complete: Date.now() - t2 } };
}

/** Nothing left of a refused upload: no row and no object. */
async function nothingLeft(fileId: string) {
  expect(await db('case_files').where({ id: fileId }).first()).toBeUndefined();
  expect(await objectSize(`cases/${caseId}/${fileId}`)).toBeNull();
}

const RATE = 8000;

/** The file's answer once the signature job has run (or right away when nothing was queued). */
const analysed = (fileId: string) =>
  waitFor(async () => {
    const r = await api(`/api/cases/${caseId}/files/${fileId}`, { session: member });
    return r.json.file.analysis.status === 'queued' ? undefined : r.json;
  }, 20_000);

describe('uploading a recording', () => {
  it('presign -> PUT -> complete; the signature job finds the 50 Hz family', async () => {
    const wav = wavBytes(mix(harmonicFamily(RATE * 5, RATE, 50), whiteNoise(RATE * 5, 0.003, 2)), RATE);
    const s = await upload(hunter, wav, 'hum at the gate.wav', 'audio/wav');
    expect(s.put).toBe(200);
    expect(s.complete.status, s.complete.text).toBe(200);
    expect(s.complete.json.file).toMatchObject({ kind: 'audio', contentType: 'audio/wav', analysis: { status: 'queued' }, can: { delete: true } });
    const t = Date.now();
    const done = await analysed(s.ticket.fileId);
    expect(done.file.analysis).toMatchObject({ status: 'ready', mainsHz: 50, pulseRateHz: null, broadband: false });
    expect(done.file.analysis.mainsFamilyDb).toBeGreaterThan(20);
    expect(done.file.analysis.hint).toMatch(/common practice/);
    expect(done.signature.spectrogram.db.length).toBeGreaterThan(10);
    console.log(`[files] 80 kB WAV: presign ${s.ms.presign} ms, PUT ${s.ms.put} ms, complete ${s.ms.complete} ms; signature ready ${Date.now() - t} ms after complete`);
    // The content: a short-lived presigned GET with the sniffed type, inline for audio.
    const c = await api(`/api/cases/${caseId}/files/${s.ticket.fileId}/content`, { session: member });
    expect(c.status).toBe(302);
    const got = await fetch(c.headers.get('location')!);
    expect(got.headers.get('content-type')).toBe('audio/wav');
    expect(got.headers.get('content-disposition')).toMatch(/^inline; filename="hum at the gate.wav"/);
    expect(Buffer.from(await got.arrayBuffer()).equals(Buffer.from(wav))).toBe(true);
    const list = await api(`/api/cases/${caseId}/files`, { session: member });
    expect(list.json.items.map((f: { id: string }) => f.id)).toContain(s.ticket.fileId);
  });

  it('a pulse train at 40 Hz in stereo 16 kHz reads as pulses at 40 Hz', async () => {
    const rate = 16000;
    const wav = wavBytes(mix(pulseTrain(rate * 4, rate, 40), whiteNoise(rate * 4, 0.003, 3)), rate, 2);
    const s = await upload(member, wav, 'ticking.wav', 'audio/x-wav');
    expect(s.complete.status, s.complete.text).toBe(200);
    const a = (await analysed(s.ticket.fileId)).file.analysis;
    expect(a.status).toBe('ready');
    expect(Math.abs(a.pulseRateHz - 40)).toBeLessThan(0.4);
  });
});

// MP3 and Ogg Opus made at test time by LAME and libopus (tests/support/encoders.ts), decoded by
// the worker (lib/audio/decode.ts); expected detections as for the WAV above (by construction).
describe('uploading a compressed recording', () => {
  it('an MP3 with a 50 Hz family: sniffed as audio/mpeg, the worker decodes it and finds 50 Hz', async () => {
    const mp3 = await mp3Bytes(mix(harmonicFamily(RATE * 5, RATE, 50), whiteNoise(RATE * 5, 0.003, 2)), RATE, 64);
    const s = await upload(hunter, mp3, 'hum at the gate.mp3', 'audio/mpeg');
    expect(s.complete.status, s.complete.text).toBe(200);
    expect(s.complete.json.file).toMatchObject({ kind: 'audio', contentType: 'audio/mpeg', analysis: { status: 'queued' } });
    const t = Date.now();
    const done = await analysed(s.ticket.fileId);
    expect(done.file.analysis).toMatchObject({ status: 'ready', mainsHz: 50, pulseRateHz: null, broadband: false });
    expect(done.file.analysis.mainsFamilyDb).toBeGreaterThan(20);
    expect(done.signature.sampleRate).toBe(RATE);
    expect(done.signature.seconds).toBeGreaterThan(4.9);
    expect(done.signature.spectrogram.db.length).toBeGreaterThan(10);
    console.log(`[files] ${(mp3.length / 1000).toFixed(0)} kB MP3 (5 s): signature ready ${Date.now() - t} ms after complete`);
  });

  it('an Ogg Opus with pulses at 40 Hz: decoded at 48 kHz, pulses at 40 Hz', async () => {
    const ogg = opusBytes(mix(pulseTrain(RATE * 4, RATE, 40), whiteNoise(RATE * 4, 0.003, 3)), RATE, 64);
    const s = await upload(member, ogg, 'ticking.opus', 'audio/ogg');
    expect(s.complete.status, s.complete.text).toBe(200);
    expect(s.complete.json.file.contentType).toBe('audio/ogg; codecs=opus');
    const done = await analysed(s.ticket.fileId);
    expect(done.file.analysis.status).toBe('ready');
    expect(Math.abs(done.file.analysis.pulseRateHz - 40)).toBeLessThan(0.4);
    expect(done.signature.sampleRate).toBe(48000);
  });

  it('a truncated MP3 is kept, and its analysis says plainly that it is cut off', async () => {
    const whole = await mp3Bytes(whiteNoise(RATE * 3, 0.1, 6), RATE, 64);
    const cut = whole.slice(0, 10_001);
    const s = await upload(hunter, cut, 'cut.mp3', 'audio/mpeg');
    expect(s.complete.status, s.complete.text).toBe(200);
    const a = (await analysed(s.ticket.fileId)).file.analysis;
    expect(a).toMatchObject({ status: 'refused', mainsHz: null });
    expect(a.message).toMatch(/The MP3 is truncated: its last frame \(number \d+\) has \d+ of its 576 bytes and the file ends at byte 10001\. Upload the whole recording\./);
  });

  it('an M4A is stored but not analysed, and says so with the formats that are', async () => {
    const m4a = m4aHeaderOnly(); // sniffed as audio/x-m4a, never decoded
    const s = await upload(hunter, m4a, 'voice memo.m4a', 'audio/mp4');
    expect(s.complete.status, s.complete.text).toBe(200);
    expect(s.complete.json.file.analysis).toMatchObject({ status: 'not-analysed' });
    expect(s.complete.json.file.analysis.message).toMatch(/M4A\/AAC\) is stored and can be played, but its format is not analysed here.*WAV, MP3 or OGG/);
  });
});

describe('what the server refuses at complete, leaving nothing behind', () => {
  it('an HTML page named .wav: 415 naming what it is', async () => {
    const s = await upload(hunter, new TextEncoder().encode('<!doctype html><html><script>alert(1)</script></html>'), 'noise.wav', 'audio/wav');
    expect(s.complete.status).toBe(415);
    expect(s.complete.json.error).toMatch(/"noise.wav" holds text \(perhaps a web page\), not a recording, photo or PDF/);
    await nothingLeft(s.ticket.fileId);
  });

  it('a PNG sent as a recording: 415, the content is a photo', async () => {
    const png = await sharp({ create: { width: 8, height: 8, channels: 3, background: '#336699' } }).png().toBuffer();
    const s = await upload(hunter, png, 'noise.wav', 'audio/wav');
    expect(s.complete.status).toBe(415);
    expect(s.complete.json.error).toMatch(/sent as audio\/wav but its content is a photo \(image\/png\)/);
    await nothingLeft(s.ticket.fileId);
  });

  it('a truncated WAV: 422 with the byte offsets', async () => {
    const wav = wavBytes(whiteNoise(RATE, 0.1), RATE).slice(0, 5000);
    const s = await upload(hunter, wav, 'cut.wav', 'audio/wav');
    expect(s.complete.status).toBe(422);
    expect(s.complete.json.error).toMatch(/truncated: its data chunk at byte 36 declares 16000 bytes but the file ends 4956 bytes later \(at byte 5000\)/);
    await nothingLeft(s.ticket.fileId);
  });

  it('the size limit is a club setting: too large to ask, and more bytes than announced', async () => {
    await db('club_settings').where({ id: 1 }).update({ upload_max_mb: 1 });
    const ask = await api(`/api/cases/${caseId}/files`, { session: hunter, body: { name: 'long.wav', size: 1_500_000, contentType: 'audio/wav' } });
    expect(ask.status).toBe(413);
    expect(ask.json.error).toMatch(/1.5 MB; the club's limit is 1 MB/);
    const wav = wavBytes(whiteNoise(RATE * 2, 0.1), RATE);
    const s = await upload(hunter, wav, 'sneaky.wav', 'audio/wav', 1000);
    expect(s.complete.status).toBe(400);
    expect(s.complete.json.error).toMatch(/32044 bytes, not the 1000 announced/);
    await nothingLeft(s.ticket.fileId);
    await db('club_settings').where({ id: 1 }).update({ upload_max_mb: 25 });
  });

  it('a type that cannot be attached is refused before any upload', async () => {
    const r = await api(`/api/cases/${caseId}/files`, { session: hunter, body: { name: 'page.html', size: 100, contentType: 'text/html' } });
    expect(r.status).toBe(415);
    expect(await db('case_files').where({ case_id: caseId, name: 'page.html' }).first()).toBeUndefined();
  });
});

describe('photos and PDFs', () => {
  it('the committee gets the photo as taken; everyone else a copy without EXIF/GPS; a thumbnail for all', async () => {
    const jpeg = await sharp({ create: { width: 640, height: 480, channels: 3, background: '#88aa44' } })
      .withExif({ IFD0: { Make: 'QuietCam', Model: 'Q1' }, IFD3: { GPSLatitudeRef: 'S', GPSLatitude: '31/1 3/1 28/1', GPSLongitudeRef: 'E', GPSLongitude: '129/1 45/1 32/1' } })
      .jpeg()
      .toBuffer();
    expect((await sharp(jpeg).metadata()).exif).toBeDefined();
    const s = await upload(member, jpeg, 'pole.jpg', 'image/jpeg');
    expect(s.complete.status, s.complete.text).toBe(200);
    const f = await waitFor(async () => {
      const r = await api(`/api/cases/${caseId}/files/${s.ticket.fileId}`, { session: member });
      return r.json.file.thumbnailUrl ? r.json.file : undefined;
    }, 20_000);
    const fetchVia = async (path: string, who: Session) => {
      const r = await api(path, { session: who });
      expect(r.status, r.text).toBe(302);
      const res = await fetch(r.headers.get('location')!);
      return { type: res.headers.get('content-type'), disposition: res.headers.get('content-disposition'), bytes: Buffer.from(await res.arrayBuffer()) };
    };
    const asMember = await fetchVia(f.contentUrl, member);
    const asCommittee = await fetchVia(f.contentUrl, coordinator);
    expect(asMember.type).toBe('image/jpeg');
    expect(asMember.disposition).toMatch(/^inline/);
    expect((await sharp(asMember.bytes).metadata()).exif).toBeUndefined();
    expect(asMember.bytes.includes(Buffer.from('QuietCam'))).toBe(false);
    expect((await sharp(asCommittee.bytes).metadata()).exif).toBeDefined();
    expect(asCommittee.bytes.equals(jpeg)).toBe(true);
    const thumb = await fetchVia(f.thumbnailUrl, hunter);
    const tm = await sharp(thumb.bytes).metadata();
    expect([tm.width, tm.height, tm.exif]).toEqual([320, 240, undefined]);
  });

  it('a PDF is always an attachment', async () => {
    const pdf = new TextEncoder().encode('%PDF-1.4\n1 0 obj<<>>endobj\ntrailer<<>>\n%%EOF\n');
    const s = await upload(hunter, pdf, 'utility letter.pdf', 'application/pdf');
    expect(s.complete.status, s.complete.text).toBe(200);
    const r = await api(`/api/cases/${caseId}/files/${s.ticket.fileId}/content`, { session: member });
    const res = await fetch(r.headers.get('location')!);
    expect(res.headers.get('content-disposition')).toMatch(/^attachment; filename="utility letter.pdf"/);
  });
});

describe('deleting and cleaning up', () => {
  it('the uploader or the committee deletes; others may not', async () => {
    const wav = wavBytes(whiteNoise(RATE, 0.1, 8), RATE);
    const s = await upload(hunter, wav, 'delete me.wav', 'audio/wav');
    expect(s.complete.status).toBe(200);
    const byMember = await api(`/api/cases/${caseId}/files/${s.ticket.fileId}`, { method: 'DELETE', session: member });
    expect(byMember.status).toBe(403);
    const byHunter = await api(`/api/cases/${caseId}/files/${s.ticket.fileId}`, { method: 'DELETE', session: hunter });
    expect(byHunter.status, byHunter.text).toBe(200);
    await nothingLeft(s.ticket.fileId);
  });

  it('an upload never completed is removed after a day, with its object', async () => {
    const ask = await api(`/api/cases/${caseId}/files`, { session: hunter, body: { name: 'forgotten.wav', size: 4, contentType: 'audio/wav' } });
    await putObject(`cases/${caseId}/${ask.json.fileId}`, new Uint8Array([1, 2, 3, 4]), 'audio/wav');
    const fresh = await cleanStaleUploads();
    expect(await db('case_files').where({ id: ask.json.fileId }).first()).toBeDefined();
    await db('case_files').where({ id: ask.json.fileId }).update({ created_at: db.raw("now() - interval '25 hours'") });
    const removed = await cleanStaleUploads();
    expect(removed).toBeGreaterThanOrEqual(1);
    await nothingLeft(ask.json.fileId);
    console.log(`[files] clean-up: ${fresh} stale before ageing, ${removed} after`);
  });
});
