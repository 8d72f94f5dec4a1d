import { PDFDocument, StandardFonts, rgb, type PDFFont, type PDFPage } from 'pdf-lib';
import { ellipsePolygon, excessOverNoiseDb, geodesicLine, type Fix } from '@/lib/df';
import type { NoiseEnvironment } from '@/lib/df';
import { fixRegion } from '@/lib/hunt/candidates';
import type { ExportBearing } from '@/lib/export/case-geojson';

export type DossierInput = {
  clubName: string;
  contactEmail: string;
  noiseEnvironment: NoiseEnvironment;
  c: { reference: string; title: string; status: string; bands: string[]; createdAt: Date; outcome: string | null; levelBeforeDbm: number | null; levelAfterDbm: number | null; resolvedAt: Date | null; reportLevelDbm: number | null; frequencyKhz: number | null };
  /** the reporter's name only when they agreed to share it */
  reporterName: string | null;
  /** the reporter's account, so that their own timeline entries are not signed with their name without consent */
  reporterId: string | null;
  premises: { address: string; how: string } | null;
  bearings: ExportBearing[];
  fix: Fix | undefined;
  events: { kind: string; actorId: string | null; actorName: string | null; createdAt: Date }[];
  notices: { id: string; templateKey: string; status: string; postalAddress: string; sentAt: Date | null; deliveredOn: string | null }[];
  answers: { noticeId: string; kind: string; message: string; createdAt: Date }[];
};

const A4: [number, number] = [595.28, 841.89];
const MARGIN = 48;
const INK = rgb(0.06, 0.11, 0.17);
const SOFT = rgb(0.36, 0.43, 0.51);
const LINE = rgb(0.04, 0.37, 0.33);
const FLARE = rgb(0.78, 0.47, 0.04);

/** Standard PDF fonts speak WinAnsi: typographic marks become plain ones, anything else a '?'. */
function winAnsi(s: string): string {
  return s
    .replace(/[\u2192\u2794]/g, '->')
    .replace(/[\u00A0\u2009\u202F]/g, ' ')
    .replace(/[^\x20-\x7E\u00A1-\u00FF\u2013\u2014\u2018\u2019\u201C\u201D\u2026\u20AC]/g, '?');
}
const day = (d: Date | string | null) => (d ? new Date(d).toISOString().slice(0, 10) : '—');

class Writer {
  page: PDFPage;
  y: number;
  constructor(private doc: PDFDocument, private font: PDFFont, private bold: PDFFont) {
    this.page = doc.addPage(A4);
    this.y = A4[1] - MARGIN;
  }
  ensure(h: number) {
    if (this.y - h < MARGIN) {
      this.page = this.doc.addPage(A4);
      this.y = A4[1] - MARGIN;
    }
  }
  text(s: string, opts: { size?: number; bold?: boolean; color?: ReturnType<typeof rgb>; indent?: number } = {}) {
    const size = opts.size ?? 10;
    const font = opts.bold ? this.bold : this.font;
    const width = A4[0] - 2 * MARGIN - (opts.indent ?? 0);
    const words = winAnsi(s).split(/\s+/);
    let line = '';
    const lines: string[] = [];
    for (const w of words) {
      const next = line ? `${line} ${w}` : w;
      if (font.widthOfTextAtSize(next, size) > width && line) {
        lines.push(line);
        line = w;
      } else line = next;
    }
    if (line) lines.push(line);
    for (const l of lines) {
      this.ensure(size + 4);
      this.page.drawText(l, { x: MARGIN + (opts.indent ?? 0), y: this.y - size, size, font, color: opts.color ?? INK });
      this.y -= size + 4;
    }
  }
  heading(s: string) {
    this.y -= 8;
    this.text(s, { size: 13, bold: true });
  }
  row(cells: string[], widths: number[], bold = false) {
    this.ensure(14);
    let x = MARGIN;
    cells.forEach((c, i) => {
      this.page.drawText(winAnsi(c).slice(0, Math.floor(widths[i] / 4.6)), { x, y: this.y - 9, size: 8.5, font: bold ? this.bold : this.font, color: INK });
      x += widths[i];
    });
    this.y -= 13;
  }
}

/** Lines of bearing, crossings region and fix, drawn from our own geometry (no map tiles), north up, with a scale bar. */
function drawMap(w: Writer, bearings: ExportBearing[], fix: Fix | undefined) {
  const size = 300;
  w.ensure(size + 30);
  const top = w.y;
  const left = MARGIN;
  const page = w.page;
  page.drawRectangle({ x: left, y: top - size, width: size, height: size, borderColor: SOFT, borderWidth: 0.8, color: rgb(0.96, 0.97, 0.95) });
  const active = bearings.filter((b) => !b.excluded);
  const centre = fix?.ok ? { lat: fix.lat, lon: fix.lon } : active[0] ? { lat: active[0].lat, lon: active[0].lon } : null;
  if (!centre) {
    page.drawText('No bearings yet.', { x: left + 10, y: top - 20, size: 10, color: SOFT });
    w.y = top - size - 10;
    return;
  }
  // Local east/north metres around the centre (equirectangular; fine over a few kilometres).
  const mPerDegLat = 111_320;
  const mPerDegLon = 111_320 * Math.cos((centre.lat * Math.PI) / 180);
  const en = (lat: number, lon: number) => [(lon - centre.lon) * mPerDegLon, (lat - centre.lat) * mPerDegLat];
  const extent = Math.max(200, ...active.map((b) => Math.hypot(...en(b.lat, b.lon)) * 1.3));
  const scale = size / 2 / extent;
  const px = (lat: number, lon: number) => {
    const [e, n] = en(lat, lon);
    return { x: left + size / 2 + e * scale, y: top - size / 2 + n * scale };
  };
  const inside = (p: { x: number; y: number }) => p.x >= left && p.x <= left + size && p.y >= top - size && p.y <= top;
  const poly = (pts: { x: number; y: number }[], color: ReturnType<typeof rgb>, thickness: number, opacity = 1) => {
    for (let i = 1; i < pts.length; i++) if (inside(pts[i - 1]) && inside(pts[i])) page.drawLine({ start: pts[i - 1], end: pts[i], thickness, color, opacity });
  };
  for (const b of bearings) {
    const pts = geodesicLine({ lat: b.lat, lon: b.lon, azimuthDeg: b.azimuthTrueDeg, oneWay: b.oneWay }, extent * 2, 64).map(([lat, lon]) => px(lat, lon));
    poly(pts, b.excluded ? SOFT : LINE, b.excluded ? 0.5 : 1, b.excluded ? 0.6 : 1);
    const o = px(b.lat, b.lon);
    if (inside(o)) page.drawCircle({ x: o.x, y: o.y, size: 2.5, color: INK });
  }
  if (fix?.ok) {
    const ring = fixRegion(fix).coordinates[0].map(([lon, lat]) => px(lat, lon));
    poly(ring, FLARE, 1.4);
    const ell = ellipsePolygon(fix, fix.ellipse, 72).map(([lat, lon]) => px(lat, lon));
    if (ring.length !== ell.length) poly(ell, FLARE, 0.5, 0.6);
    const f = px(fix.lat, fix.lon);
    page.drawLine({ start: { x: f.x - 5, y: f.y }, end: { x: f.x + 5, y: f.y }, thickness: 1.5, color: FLARE });
    page.drawLine({ start: { x: f.x, y: f.y - 5 }, end: { x: f.x, y: f.y + 5 }, thickness: 1.5, color: FLARE });
  }
  // Scale bar: a round number of metres near a quarter of the frame.
  const target = extent / 2;
  const bar = [10, 20, 50, 100, 200, 500, 1000, 2000, 5000, 10000].reduce((best, m) => (Math.abs(m - target) < Math.abs(best - target) ? m : best), 100);
  page.drawLine({ start: { x: left + 10, y: top - size + 12 }, end: { x: left + 10 + bar * scale, y: top - size + 12 }, thickness: 2, color: INK });
  page.drawText(bar >= 1000 ? `${bar / 1000} km` : `${bar} m`, { x: left + 12, y: top - size + 16, size: 8, color: INK });
  page.drawText('N ^', { x: left + size - 22, y: top - 14, size: 9, color: INK });
  const legend = ['bearing lines (green; grey: set aside)', 'dots: where each bearing was taken', 'orange: fix (+) and its 95 % region'];
  legend.forEach((l, i) => page.drawText(l, { x: left + size + 12, y: top - 12 - i * 13, size: 8.5, color: SOFT }));
  w.y = top - size - 10;
}

/**
 * The case dossier for referring a stubborn case to the utility or the regulator: the case, a map
 * of the lines and the region, the bearings, the levels against the expected man-made noise
 * (ITU-R P.372), the timeline, the notices sent and the answers. Names: the reporter's only with
 * their consent; neighbours are never named, only the premises' address.
 */
export async function renderDossier(d: DossierInput): Promise<Uint8Array> {
  const doc = await PDFDocument.create();
  doc.setTitle(`Case dossier ${d.c.reference}`);
  doc.setSubject(`${d.c.reference}: ${winAnsi(d.c.title)}`);
  doc.setAuthor(winAnsi(d.clubName));
  doc.setCreator('Quietfix');
  const w = new Writer(doc, await doc.embedFont(StandardFonts.Helvetica), await doc.embedFont(StandardFonts.HelveticaBold));
  w.text(`Case dossier ${d.c.reference}`, { size: 18, bold: true });
  w.text(d.c.title, { size: 12 });
  w.text(`Prepared by the interference committee of ${d.clubName} (${d.contactEmail}) on ${day(new Date())}.`, { color: SOFT });
  w.text(
    'This dossier records where a radio noise was measured from public ground and where the measurements point. A candidate house is not an accusation; local law and the licensing regulator decide what is interference and what must be done.',
    { size: 9, color: SOFT },
  );

  w.heading('The case');
  w.text(`Status: ${d.c.status}${d.c.outcome ? ` (${d.c.outcome})` : ''}. Reported ${day(d.c.createdAt)}${d.c.resolvedAt ? `, resolved ${day(d.c.resolvedAt)}` : ''}. Bands: ${d.c.bands.join(', ') || '—'}.`);
  w.text(`Reported by: ${d.reporterName ?? 'a club member (name withheld: no consent to share it)'}.`);
  if (d.premises) w.text(`Premises confirmed on foot: ${d.premises.address} (how: ${d.premises.how}).`);
  if (d.fix?.ok) w.text(`Fix: ${d.fix.lat.toFixed(5)}, ${d.fix.lon.toFixed(5)}; 95 % error ellipse ${Math.round(d.fix.ellipse.semiMajorM)} m x ${Math.round(d.fix.ellipse.semiMinorM)} m, major axis ${Math.round(d.fix.ellipse.majorAxisAzimuthDeg)}° from true north.`);

  w.heading('Map of the lines and the region');
  drawMap(w, d.bearings, d.fix);

  w.heading('Levels against the expected man-made noise');
  const levels: [string, number | null][] = [
    ['as reported', d.c.reportLevelDbm],
    ['before the fix', d.c.levelBeforeDbm],
    ['after the fix', d.c.levelAfterDbm],
  ];
  const f = d.c.frequencyKhz;
  for (const [label, dbm] of levels) {
    if (dbm === null) continue;
    const excess = f ? excessOverNoiseDb(dbm, d.noiseEnvironment, f * 1000, 2700) : NaN;
    w.text(`${label}: ${dbm.toFixed(1)} dBm${Number.isFinite(excess) ? `, ${excess.toFixed(1)} dB above the expected ${d.noiseEnvironment} man-made noise at ${(f! / 1000).toFixed(3)} MHz in 2.7 kHz (ITU-R P.372)` : ''}.`);
  }
  if (d.c.levelBeforeDbm !== null && d.c.levelAfterDbm !== null) w.text(`Noise reduction achieved: ${(d.c.levelBeforeDbm - d.c.levelAfterDbm).toFixed(1)} dB.`, { bold: true });
  if (levels.every(([, v]) => v === null)) w.text('No levels recorded.', { color: SOFT });

  w.heading(`Bearings (${d.bearings.length})`);
  const cols = [78, 62, 62, 58, 46, 52, 60, 81];
  w.row(['taken (UTC)', 'lat', 'lon', 'azimuth', 'ref', 'true az.', '1-sigma', 'note'], cols, true);
  for (const b of d.bearings) {
    w.row([new Date(b.takenAt).toISOString().slice(0, 16).replace('T', ' '), b.lat.toFixed(5), b.lon.toFixed(5), `${b.azimuthEnteredDeg.toFixed(1)}°`, b.reference, `${b.azimuthTrueDeg.toFixed(1)}°`, `${b.sigmaDeg.toFixed(1)}°${b.excluded ? ' (set aside)' : ''}`, b.note], cols);
  }

  w.heading('Notices and answers');
  if (d.notices.length === 0) w.text('No notice was sent.', { color: SOFT });
  for (const n of d.notices) {
    w.text(`${n.templateKey} to the household at ${n.postalAddress}: ${n.status}${n.sentAt ? `, sent ${day(n.sentAt)}` : ''}${n.deliveredOn ? `, delivered by hand ${day(n.deliveredOn)}` : ''}.`);
    for (const a of d.answers.filter((x) => x.noticeId === n.id)) w.text(`Answer ${day(a.createdAt)}: ${a.kind}${a.message ? ` — "${a.message}"` : ''}`, { indent: 14, size: 9 });
  }

  w.heading('Timeline');
  const actor = (e: DossierInput['events'][number]) => (d.reporterName === null && e.actorId !== null && e.actorId === d.reporterId ? 'the reporter' : e.actorName);
  for (const e of d.events) w.text(`${new Date(e.createdAt).toISOString().slice(0, 16).replace('T', ' ')}  ${e.kind}${actor(e) ? ` (${actor(e)})` : ''}`, { size: 9 });
  return doc.save();
}
