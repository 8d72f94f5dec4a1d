import { beforeAll, describe, expect, it } from 'vitest';
import { DOMParser } from '@xmldom/xmldom';
import { kml } from '@tmcw/togeojson';
import { parse } from 'csv-parse/sync';
import { booleanClockwise } from '@turf/turf';
import { Geodesic } from 'geographiclib-geodesic';
import { PDFDocument } from 'pdf-lib';
import yauzl from 'yauzl';
import { getDocument } from 'pdfjs-dist/legacy/build/pdf.mjs';
import { db } from '@/db';
import { api, BASE_URL, signIn, type Session } from '../support/http';
import { noiseReport } from '../support/fixtures';

/**
 * Exports checked against the standards and reference libraries, not against our own code:
 * GeoJSON against RFC 7946 (positions lon,lat §3.1.1; closed rings of four or more positions
 * §3.1.6; exterior rings counter-clockwise, the right-hand rule, §3.1.6, checked with Turf's
 * booleanClockwise; no "crs" member, §4), bearing lines against GeographicLib's geodesic
 * (Karney 2013), KML 2.2 read back by @tmcw/togeojson with @xmldom/xmldom, CSV (RFC 4180) read by
 * csv-parse and fed back through the import's dry run, the dossier opened by pdf-lib and its page text read by PDF.js (Mozilla's reader, pdfjs-dist).
 */
let coordinator: Session;
let hunter: Session;
let admin: Session;
let locatedId: string;
let openId: string;
let locatedRef: string;

const raw = async (path: string, session: Session, init: RequestInit = {}) =>
  fetch(`${BASE_URL}${path}`, { ...init, headers: { cookie: session.cookie, origin: new URL(BASE_URL).origin, ...(init.headers ?? {}) } });

beforeAll(async () => {
  [coordinator, hunter, admin] = await Promise.all([signIn('coordinator@example.test'), signIn('hunter@example.test'), signIn('chair@example.test')]);
  const located = (await api('/api/cases?q=Warbling', { session: coordinator })).json.items[0];
  locatedId = located.id;
  locatedRef = located.reference;
  // A case of this test's own, assigned to the demo hunter: imports here leave the demo's cases alone.
  const filed = await api('/api/cases', { session: coordinator, body: noiseReport({ title: `Import target ${Date.now()}` }) });
  openId = filed.json.case.id;
  const hunterId = (await db('users').where({ email: 'hunter@example.test' }).first()).id;
  const a = await api(`/api/cases/${openId}`, { method: 'PATCH', session: coordinator, body: { version: filed.json.case.version, assigneeId: hunterId } });
  expect(a.status, a.text).toBe(200);
});

/** Every entry of a ZIP, read by yauzl (a reader apart from the writer, yazl), in the archive's order. */
function unzip(buf: Buffer): Promise<Map<string, string>> {
  return new Promise((resolve, reject) => {
    yauzl.fromBuffer(buf, { lazyEntries: true }, (err, zip) => {
      if (err || !zip) return reject(err);
      const out = new Map<string, string>();
      zip.on('entry', (entry: yauzl.Entry) => {
        zip.openReadStream(entry, (e, stream) => {
          if (e || !stream) return reject(e);
          const chunks: Buffer[] = [];
          stream.on('data', (c: Buffer) => chunks.push(c));
          stream.on('end', () => {
            out.set(entry.fileName, Buffer.concat(chunks).toString('utf8'));
            zip.readEntry();
          });
        });
      });
      zip.on('end', () => resolve(out));
      zip.on('error', reject);
      zip.readEntry();
    });
  });
}

function checkPosition(p: unknown) {
  expect(Array.isArray(p) && p.length >= 2).toBe(true);
  const [lon, lat] = p as number[];
  expect(lon).toBeGreaterThanOrEqual(-180);
  expect(lon).toBeLessThanOrEqual(180);
  expect(lat).toBeGreaterThanOrEqual(-90);
  expect(lat).toBeLessThanOrEqual(90);
}

describe('one case as GeoJSON (RFC 7946)', () => {
  it('lines are geodesics through the observer at the true azimuth; the region is a closed counter-clockwise ring', async () => {
    const res = await raw(`/api/cases/${locatedId}/export?format=geojson`, coordinator);
    expect(res.status).toBe(200);
    expect(res.headers.get('content-type')).toBe('application/geo+json');
    const fc = await res.json();
    expect(fc.type).toBe('FeatureCollection');
    expect(fc).not.toHaveProperty('crs');
    const bearings = (await api(`/api/cases/${locatedId}/bearings`, { session: coordinator })).json.items;
    const lines = fc.features.filter((f: any) => f.properties.kind === 'bearing');
    expect(lines).toHaveLength(bearings.length);
    for (const f of lines) {
      expect(f.geometry.type).toBe('LineString');
      expect(f.geometry.coordinates.length).toBeGreaterThanOrEqual(2);
      f.geometry.coordinates.forEach(checkPosition);
      const [olon, olat] = f.properties.observer;
      const [elon, elat] = f.geometry.coordinates.at(-1);
      // GeographicLib: the azimuth from the observer to the line's far end is the bearing's true azimuth.
      const inv = Geodesic.WGS84.Inverse(olat, olon, elat, elon) as { azi1: number };
      const diff = ((inv.azi1 - f.properties.azimuthTrueDeg + 540) % 360) - 180;
      expect(Math.abs(diff)).toBeLessThan(0.01);
    }
    const region = fc.features.find((f: any) => f.properties.kind === 'region');
    expect(region.geometry.type).toBe('Polygon');
    const ring = region.geometry.coordinates[0];
    expect(ring.length).toBeGreaterThanOrEqual(4);
    expect(ring[0]).toEqual(ring.at(-1));
    ring.forEach(checkPosition);
    expect(booleanClockwise(ring)).toBe(false);
    const fix = fc.features.find((f: any) => f.properties.kind === 'fix');
    expect(fix.geometry.type).toBe('Point');
    checkPosition(fix.geometry.coordinates);
  });

  it('KML 2.2 reads back with the same features', async () => {
    const gj = await (await raw(`/api/cases/${locatedId}/export?format=geojson`, coordinator)).json();
    const res = await raw(`/api/cases/${locatedId}/export?format=kml`, coordinator);
    expect(res.headers.get('content-type')).toMatch(/kml/);
    const text = await res.text();
    const doc = new DOMParser().parseFromString(text, 'text/xml');
    expect(doc.documentElement!.getAttribute('xmlns')).toBe('http://www.opengis.net/kml/2.2');
    const back = kml(doc as unknown as Document);
    expect(back.features.map((f) => f.geometry?.type)).toEqual(gj.features.map((f: any) => f.geometry.type));
    expect(back.features.map((f) => f.properties?.name)).toEqual(gj.features.map((f: any) => f.properties.name));
  });

  it('bearings CSV round trip: exported rows pass the import dry run and give the same true azimuths', async () => {
    const res = await raw(`/api/cases/${locatedId}/export?format=csv`, coordinator);
    expect(res.headers.get('content-type')).toMatch(/text\/csv/);
    const text = await res.text();
    const rows = parse(text, { columns: true }) as Record<string, string>[];
    expect(rows.length).toBeGreaterThan(0);
    const dry = await api(`/api/cases/${openId}/bearings/import?dryRun=1`, { session: coordinator, body: text, headers: { 'content-type': 'text/csv' } });
    expect(dry.status, dry.text).toBe(200);
    expect(dry.json.problems).toEqual([]);
    expect(dry.json.valid).toBe(rows.length);
    dry.json.rows.forEach((r: any, i: number) => expect(r.azimuthTrueDeg).toBeCloseTo(Number(rows[i].azimuth_true_deg), 3));
  });

  it('a hunter not assigned, or a member, gets no export', async () => {
    const member = await signIn('member@example.test');
    expect((await raw(`/api/cases/${locatedId}/export?format=geojson`, member)).status).toBe(403);
    expect((await raw(`/api/cases/${locatedId}/export?format=zip`, coordinator)).status).toBe(400);
  });
});

describe('level log as CSV (what=levels)', () => {
  // Rec. ITU-R P.372, Table 1 (man-made noise, median): Fam = c − d·log10(f/MHz) dB above kT0b,
  // written here from the Recommendation, not from lib/df; noise power in b Hz = Fam − 174 + 10·log10(b) dBm.
  const P372: Record<string, [number, number]> = { city: [76.8, 27.7], residential: [72.5, 27.7], rural: [67.2, 27.7], 'quiet-rural': [53.6, 28.6] };
  const floorDbm = (env: string, fKhz: number, bHz: number) => P372[env][0] - P372[env][1] * Math.log10(fKhz / 1000) - 174 + 10 * Math.log10(bHz);
  const COLUMNS = ['taken_at', 'frequency_khz', 'level_dbm', 'bandwidth_hz', 'expected_dbm', 'excess_db', 'phase', 'lat', 'lon'];

  beforeAll(async () => {
    const t0 = Date.now() - 7_200_000;
    const readings = [
      { frequencyKhz: 3650, level: { unit: 'S', value: 8 }, bandwidthHz: 2400, takenAt: new Date(t0).toISOString(), phase: 'before', lat: -31.0502, lon: 129.7488 },
      { frequencyKhz: 7100, level: { unit: 'dBm', value: -81.5 }, bandwidthHz: 500, takenAt: new Date(t0 + 60_000).toISOString(), phase: 'before' },
      { frequencyKhz: 7100, level: { unit: 'S', value: 9, overS9Db: 10 }, bandwidthHz: 2400, takenAt: new Date(t0 + 120_000).toISOString(), phase: 'after' },
    ];
    for (const r of readings) expect((await api(`/api/cases/${openId}/levels`, { session: hunter, body: r })).status).toBe(201);
  });

  /** The same readings straight from case_levels, the test's own SQL. */
  async function fromSql(where: string, bindings: unknown[]) {
    const { rows } = await db.raw(
      `SELECT c.reference, l.taken_at, l.frequency_khz, l.level_dbm, l.bandwidth_hz, l.phase, l.lat, l.lon
         FROM case_levels l JOIN cases c ON c.id = l.case_id WHERE ${where} ORDER BY c.reference, l.taken_at, l.id`,
      bindings as never[],
    );
    return rows as { reference: string; taken_at: Date; frequency_khz: number; level_dbm: number; bandwidth_hz: number; phase: string; lat: number | null; lon: number | null }[];
  }

  function expectSameReadings(csvRows: Record<string, string>[], sqlRows: Awaited<ReturnType<typeof fromSql>>, env: string) {
    expect(csvRows).toHaveLength(sqlRows.length);
    sqlRows.forEach((s, i) => {
      const c = csvRows[i];
      expect(c.taken_at).toBe(s.taken_at.toISOString()); // ISO 8601 UTC
      expect(Number(c.frequency_khz)).toBe(s.frequency_khz);
      expect(Number(c.bandwidth_hz)).toBe(s.bandwidth_hz);
      expect(Number(c.level_dbm)).toBeCloseTo(s.level_dbm, 1);
      const floor = floorDbm(env, s.frequency_khz, s.bandwidth_hz);
      expect(Number(c.expected_dbm)).toBeCloseTo(floor, 1);
      expect(Number(c.excess_db)).toBeCloseTo(s.level_dbm - floor, 1);
      expect(c.phase).toBe(s.phase);
      expect(c.lat === '' ? null : Number(c.lat)).toBe(s.lat);
      expect(c.lon === '' ? null : Number(c.lon)).toBe(s.lon);
    });
  }

  it('one case: every reading of the log, with units in the column names, read back by csv-parse equals the table', async () => {
    const [{ noise_environment: env }] = (await db.raw('SELECT noise_environment FROM club_settings WHERE id = 1')).rows;
    const res = await raw(`/api/cases/${openId}/export?format=csv&what=levels`, hunter);
    expect(res.status).toBe(200);
    expect(res.headers.get('content-type')).toMatch(/text\/csv/);
    const text = await res.text();
    expect(text.split('\n')[0].trim()).toBe(COLUMNS.join(','));
    const rows = parse(text, { columns: true }) as Record<string, string>[];
    const sql = await fromSql('l.case_id = ?', [openId]);
    expect(sql.length).toBeGreaterThanOrEqual(3);
    expectSameReadings(rows, sql, env);
    // IARU Region 1 (Technical Recommendation R.1): S9 = −73 dBm below 30 MHz, so S9+10 dB = −63 dBm.
    expect(rows.some((r) => r.phase === 'after' && Number(r.level_dbm) === -63)).toBe(true);
    console.log(`[exports] levels CSV of one case: ${rows.length} rows, environment ${env}`);
  });

  it('the filtered set: each reading under its case reference, the same as SQL over the same cases', async () => {
    const [{ noise_environment: env }] = (await db.raw('SELECT noise_environment FROM club_settings WHERE id = 1')).rows;
    const res = await raw('/api/cases/export?format=csv&what=levels&q=Import%20target', coordinator);
    expect(res.status).toBe(200);
    const rows = parse(await res.text(), { columns: true }) as Record<string, string>[];
    expect(Object.keys(rows[0])).toEqual(['case_reference', ...COLUMNS]);
    const sql = await fromSql("(c.reference || ' ' || c.title || ' ' || c.description) ILIKE '%Import target%'", []);
    expect(rows.map((r) => r.case_reference)).toEqual(sql.map((s) => s.reference));
    expectSameReadings(rows, sql, env);
  });

  it('a table other than the default is CSV only; an unknown one is a 400; a member gets none', async () => {
    expect((await raw(`/api/cases/${openId}/export?format=geojson&what=levels`, coordinator)).status).toBe(400);
    expect((await raw(`/api/cases/${openId}/export?format=csv&what=passwords`, coordinator)).status).toBe(400);
    expect((await raw('/api/cases/export?format=kml&what=levels', coordinator)).status).toBe(400);
    expect((await raw(`/api/cases/${openId}/export?format=csv&what=levels`, await signIn('member@example.test'))).status).toBe(403); // members never see the hunt
  });
});

describe('CSV injection (OWASP "CSV Injection": a cell starting with = + - @ is a formula to a spreadsheet)', () => {
  it('free text that starts like a formula leaves with a leading apostrophe and comes back unchanged through the import', async () => {
    const note = `=HYPERLINK("http://evil.example.test","x") ${Date.now()}`;
    const csv = ['lat,lon,azimuth_deg,reference,sigma_deg,note', `-31.0495,129.7480,75,true,3,"${note.replace(/"/g, '""')}"`].join('\n');
    expect((await api(`/api/cases/${openId}/bearings/import`, { session: hunter, body: csv, headers: { 'content-type': 'text/csv' } })).status).toBe(201);
    const out = parse(await (await raw(`/api/cases/${openId}/export?format=csv`, hunter)).text(), { columns: true }) as Record<string, string>[];
    const cell = out.find((r) => r.note.includes(String(note.split(' ').at(-1))))!.note;
    expect(cell).toBe(`'${note}`);
    expect(out.every((r) => !/^[=+\-@]/.test(r.note) && !/^[=+\-@]/.test(r.author))).toBe(true);
    const title = `@SUM(1+1) formula title ${Date.now()}`;
    expect((await api('/api/cases', { session: coordinator, body: noiseReport({ title }) })).status).toBe(201);
    const set = parse(await (await raw(`/api/cases/export?format=csv&q=${encodeURIComponent('formula title')}`, coordinator)).text(), { columns: true }) as Record<string, string>[];
    expect(set.find((r) => r.title.endsWith(title))!.title).toBe(`'${title}`);
  });
});

describe('bearings import', () => {
  const count = async (id: string) => Number((await db('bearings').where({ case_id: id }).count<{ n: string }[]>({ n: '*' }))[0].n);
  const BAD = ['lat,lon,azimuth_deg,reference,sigma_deg', '-31.05,129.75,45,true,3', '95,129.75,45,true,3', '-31.05,129.75,abc,true,3', '-31.05,129.75,45,grid,3'].join('\n');

  it('the dry run names each problem by line and column and writes nothing', async () => {
    const before = await count(openId);
    const r = await api(`/api/cases/${openId}/bearings/import?dryRun=1`, { session: hunter, body: BAD, headers: { 'content-type': 'text/csv' } });
    expect(r.status, r.text).toBe(200);
    expect(r.json.valid).toBe(1);
    expect(r.json.problems.map((p: any) => [p.line, p.field])).toEqual([
      [3, 'lat'],
      [4, 'azimuth_deg'],
      [5, 'reference'],
    ]);
    expect(await count(openId)).toBe(before);
  });

  it('a real import with problems writes nothing (400); a clean one writes every row (201)', async () => {
    const before = await count(openId);
    const bad = await api(`/api/cases/${openId}/bearings/import`, { session: hunter, body: BAD, headers: { 'content-type': 'text/csv' } });
    expect(bad.status).toBe(400);
    expect(bad.json.problems).toHaveLength(3);
    expect(await count(openId)).toBe(before);
    const good = ['lat,lon,azimuth_deg,reference,sigma_deg,note', '-31.0490,129.7470,60,true,3,from the lane', '-31.0510,129.7520,330,true,3,from the park gate'].join('\n');
    const ok = await api(`/api/cases/${openId}/bearings/import`, { session: hunter, body: good, headers: { 'content-type': 'text/csv' } });
    expect(ok.status, ok.text).toBe(201);
    expect(ok.json.imported).toBe(2);
    expect(await count(openId)).toBe(before + 2);
  });

  it('someone without the hunt right may not import, not even a dry run', async () => {
    const member = await signIn('member@example.test');
    const r = await api(`/api/cases/${openId}/bearings/import?dryRun=1`, { session: member, body: BAD, headers: { 'content-type': 'text/csv' } });
    expect(r.status).toBe(403); // members never hunt
  });

  it('a CSV without the needed columns, or not CSV at all, is a plain 400', async () => {
    for (const body of ['lat,lon\n1,2', 'lat,lon,azimuth_deg,reference\n"unclosed,1,2,true']) {
      const r = await api(`/api/cases/${openId}/bearings/import?dryRun=1`, { session: hunter, body, headers: { 'content-type': 'text/csv' } });
      expect(r.status).toBe(400);
      expect(typeof r.json.error).toBe('string');
    }
  });
});

describe('set and club exports, streamed', () => {
  it('the filtered set as GeoJSON, KML and CSV', async () => {
    const [{ n }] = (await db.raw("SELECT count(*)::int AS n FROM cases WHERE map_point IS NOT NULL AND (reference || ' ' || title || ' ' || description) ILIKE '%Warbling%'")).rows;
    const gj = await (await raw('/api/cases/export?format=geojson&q=Warbling', coordinator)).json();
    expect(gj.features).toHaveLength(n);
    gj.features.forEach((f: any) => expect(f.geometry.type).toBe('Point'));
    const k = kml(new DOMParser().parseFromString(await (await raw('/api/cases/export?format=kml&q=Warbling', coordinator)).text(), 'text/xml') as unknown as Document);
    expect(k.features).toHaveLength(n);
    const csv = parse(await (await raw('/api/cases/export?format=csv&q=Warbling', coordinator)).text(), { columns: true }) as Record<string, string>[];
    expect(csv.map((r) => r.reference)).toContain(locatedRef);
  });

  it('the club export is a ZIP: one JSON-lines file per table, a manifest whose counts match SQL, no password anywhere; admins only', async () => {
    const res = await raw('/api/club/export', admin);
    expect(res.status).toBe(200);
    expect(res.headers.get('content-type')).toBe('application/zip');
    expect(res.headers.get('content-length')).toBeNull(); // streamed, not a buffer of known size
    const files = await unzip(Buffer.from(await res.arrayBuffer()));
    const names = [...files.keys()];
    expect(names.at(-1)).toBe('manifest.json');
    const manifest = JSON.parse(files.get('manifest.json')!);
    expect(manifest.format).toBe('quietfix-club-export');
    expect(manifest.schemaVersion).toBeGreaterThanOrEqual(2);
    expect(Math.abs(Date.parse(manifest.exportedAt) - Date.now())).toBeLessThan(60_000);
    expect(Object.keys(manifest.files).sort()).toEqual(names.filter((n) => n !== 'manifest.json').sort());
    for (const t of ['users', 'cases', 'bearings', 'case_levels', 'notices', 'notice_templates']) expect(names).toContain(`${t}.jsonl`);
    for (const [file, { table, rows }] of Object.entries(manifest.files) as [string, { table: string; rows: number }][]) {
      const lines = files.get(file)!.split('\n').filter(Boolean).map((l) => JSON.parse(l) as Record<string, unknown>);
      const [{ n }] = (await db.raw('SELECT count(*)::int AS n FROM ??', [table])).rows; // the test's own count
      expect(lines, file).toHaveLength(n);
      expect(rows, file).toBe(n);
      for (const row of lines) expect(Object.keys(row).filter((k) => /password|token|secret|hash/i.test(k)), file).toEqual([]);
    }
    const everything = [...files.values()].join('\n');
    expect(everything).not.toMatch(/"password[^"]*"\s*:/i);
    expect(everything).not.toMatch(/\$2[aby]\$\d\d\$/); // bcrypt's modular crypt format
    const [{ n: cases }] = (await db.raw('SELECT count(*)::int AS n FROM cases')).rows;
    console.log(`[exports] club zip: ${names.length} files, ${cases} cases, ${everything.length} characters of JSON lines`);
    expect((await raw('/api/club/export', coordinator)).status).toBe(403);
  });
});

describe('case dossier', () => {
  /** The text of every page, as PDF.js (Mozilla's reference reader, a package apart from the writer pdf-lib) extracts it. */
  async function pdfText(bytes: Uint8Array): Promise<string[]> {
    const doc = await getDocument({ data: bytes, isEvalSupported: false, useSystemFonts: false, disableFontFace: true, verbosity: 0 }).promise;
    const pages: string[] = [];
    for (let i = 1; i <= doc.numPages; i++) {
      const content = await (await doc.getPage(i)).getTextContent();
      pages.push(content.items.map((it) => ('str' in it ? it.str : '')).join('\n'));
    }
    await doc.destroy();
    return pages;
  }
  const dossier = async (id: string) => {
    const res = await raw(`/api/cases/${id}/dossier.pdf`, coordinator);
    expect(res.status).toBe(200);
    return new Uint8Array(await res.arrayBuffer());
  };

  it('is a PDF that opens and names the case; committee only', async () => {
    const res = await raw(`/api/cases/${locatedId}/dossier.pdf`, coordinator);
    expect(res.status).toBe(200);
    expect(res.headers.get('content-type')).toBe('application/pdf');
    const pdf = await PDFDocument.load(new Uint8Array(await res.arrayBuffer()));
    expect(pdf.getPageCount()).toBeGreaterThanOrEqual(1);
    expect(pdf.getTitle()).toBe(`Case dossier ${locatedRef}`);
    expect(pdf.getSubject()).toContain(locatedRef);
    expect((await raw(`/api/cases/${locatedId}/dossier.pdf`, hunter)).status).toBe(403);
  });

  it('its pages read: the reference and title, one bearings row per bearing as in the table, the reporter withheld without consent', async () => {
    const text = (await pdfText(await dossier(locatedId))).join('\n');
    const { rows: [c] } = await db.raw('SELECT c.reference, c.title, c.consent_share_name, u.name AS reporter FROM cases c JOIN users u ON u.id = c.reporter_id WHERE c.id = ?', [locatedId]);
    expect(text).toContain(`Case dossier ${c.reference}`);
    expect(text).toContain(c.title);
    const { rows: bearings } = await db.raw('SELECT lat, lon, azimuth_entered_deg, azimuth_true_deg, taken_at FROM bearings WHERE case_id = ? ORDER BY taken_at', [locatedId]);
    expect(bearings.length).toBeGreaterThan(0);
    expect(text).toContain(`Bearings (${bearings.length})`);
    for (const b of bearings) {
      for (const cell of [new Date(b.taken_at).toISOString().slice(0, 16).replace('T', ' '), Number(b.lat).toFixed(5), Number(b.lon).toFixed(5), `${Number(b.azimuth_true_deg).toFixed(1)}°`]) {
        expect(text, cell).toContain(cell);
      }
    }
    expect(c.consent_share_name).toBe(false);
    expect(text).toContain('name withheld');
    expect(text).not.toContain(c.reporter); // nowhere: not in the case part, not in the timeline
  });

  it('with the reporter\'s consent their name is printed', async () => {
    const member = await signIn('member@example.test');
    const filed = await api('/api/cases', { session: member, body: noiseReport({ title: `Consenting reporter ${Date.now()}`, consentShareName: true }) });
    expect(filed.status, filed.text).toBe(201);
    const { rows: [u] } = await db.raw("SELECT name FROM users WHERE email = 'member@example.test'");
    const text = (await pdfText(await dossier(filed.json.case.id))).join('\n');
    expect(text).toContain(`Reported by: ${u.name}`);
    expect(text).not.toContain('name withheld');
  });
});

describe('club settings', () => {
  it('an admin changes settings; each change lands on the settings timeline; bad values are 400', async () => {
    const before = (await api('/api/settings', { session: admin })).json.settings;
    const r = await api('/api/settings', { method: 'PATCH', session: admin, body: { reminderDays: before.reminderDays + 1, noiseEnvironment: 'rural' } });
    expect(r.status, r.text).toBe(200);
    expect(r.json.settings.reminderDays).toBe(before.reminderDays + 1);
    const timeline = (await api('/api/settings', { session: admin })).json.timeline;
    expect(timeline[0].changes.reminderDays).toEqual({ from: before.reminderDays, to: before.reminderDays + 1 });
    expect((await api('/api/settings', { method: 'PATCH', session: admin, body: { locateThresholdM: -3 } })).status).toBe(400);
    expect((await api('/api/settings', { method: 'PATCH', session: coordinator, body: { reminderDays: 3 } })).status).toBe(403);
    await api('/api/settings', { method: 'PATCH', session: admin, body: { reminderDays: before.reminderDays, noiseEnvironment: before.noiseEnvironment } });
  });
});
