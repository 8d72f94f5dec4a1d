import { PDFDocument, StandardFonts, rgb, type PDFFont } from 'pdf-lib';
import QRCode from 'qrcode';

/** Characters outside the printable ASCII and Latin-1 ranges that WinAnsi (Helvetica's encoding) still has. */
const WIN_ANSI_EXTRA = new Set('€‚ƒ„…†‡ˆ‰Š‹ŒŽ‘’“”•–—˜™š›œžŸ');
const SUBSTITUTES: Record<string, string> = { '\u2212': '-', '\u2010': '-', '\u2011': '-', '\u00a0': ' ', '\u2009': ' ', '\u202f': ' ', '\u2032': "'", '\u2033': '"', '\u2192': '->', '\u2248': '~', '\u2264': '<=', '\u2265': '>=' };

/** Text Helvetica can encode: known substitutes, accents folded where needed, else "?". */
export function toWinAnsi(s: string): string {
  let out = '';
  for (const ch of s.replace(/\r\n?/g, '\n')) {
    const code = ch.codePointAt(0)!;
    if (ch === '\n' || (code >= 0x20 && code <= 0x7e) || (code >= 0xa1 && code <= 0xff) || WIN_ANSI_EXTRA.has(ch)) out += ch;
    else if (SUBSTITUTES[ch] !== undefined) out += SUBSTITUTES[ch];
    else if (ch === '\t') out += ' ';
    else {
      const folded = ch.normalize('NFKD').replace(/[\u0300-\u036f]/g, '');
      out += /^[\x20-\x7e]+$/.test(folded) ? folded : '?';
    }
  }
  return out;
}

function wrap(text: string, font: PDFFont, size: number, width: number): string[] {
  const lines: string[] = [];
  for (const para of text.split('\n')) {
    if (!para.trim()) {
      lines.push('');
      continue;
    }
    const indent = para.startsWith('- ') ? '   ' : '';
    let line = '';
    for (const word of para.split(/ +/)) {
      const next = line ? `${line} ${word}` : word;
      if (font.widthOfTextAtSize(next, size) <= width || !line) line = next;
      else {
        lines.push(line);
        line = indent + word;
      }
    }
    lines.push(line);
  }
  return lines;
}

export type LetterInput = {
  clubName: string;
  clubContactEmail: string;
  recipientName: string;
  postalAddress: string;
  date: string;
  subject: string;
  text: string;
  /** null before approval: the letter then says so instead of a code */
  link: string | null;
};

/** The printable letter: A4, Helvetica, club name, address block, the text, the response link and its QR code. */
export async function letterPdf(l: LetterInput): Promise<Uint8Array> {
  const doc = await PDFDocument.create();
  doc.setTitle(toWinAnsi(`${l.clubName}: ${l.subject}`));
  doc.setCreator('Quietfix');
  const font = await doc.embedFont(StandardFonts.Helvetica);
  const bold = await doc.embedFont(StandardFonts.HelveticaBold);
  const [W, H, M] = [595.28, 841.89, 56];
  const size = 10.5;
  const lead = size * 1.45;
  let page = doc.addPage([W, H]);
  let y = H - M;
  const put = (s: string, f: PDFFont = font, sz = size, colour = rgb(0.11, 0.16, 0.21)) => {
    if (y < M + lead) {
      page = doc.addPage([W, H]);
      y = H - M;
    }
    page.drawText(toWinAnsi(s), { x: M, y, size: sz, font: f, color: colour });
    y -= sz * 1.45;
  };

  put(l.clubName, bold, 15, rgb(0.06, 0.37, 0.4));
  put(`Interference committee · ${l.clubContactEmail}`, font, 9);
  y -= lead;
  for (const line of [l.recipientName, ...l.postalAddress.split(/\n|,\s*/).filter(Boolean)]) put(line);
  y -= lead;
  put(l.date);
  y -= lead / 2;
  for (const line of wrap(toWinAnsi(l.subject), bold, 12, W - 2 * M)) put(line, bold, 12);
  y -= lead / 2;
  // The link is printed below with its QR code; the body keeps it inline too so the text reads whole.
  for (const line of wrap(toWinAnsi(l.text.trim()), font, size, W - 2 * M)) put(line);

  const qrSize = 110;
  if (y < M + qrSize + 3 * lead) {
    page = doc.addPage([W, H]);
    y = H - M;
  }
  y -= lead;
  if (l.link) {
    const png = await QRCode.toBuffer(l.link, { type: 'png', errorCorrectionLevel: 'M', margin: 1, width: 330 });
    const img = await doc.embedPng(png);
    page.drawImage(img, { x: M, y: y - qrSize, width: qrSize, height: qrSize });
    const tx = M + qrSize + 14;
    page.drawText('Answer us online (no account needed):', { x: tx, y: y - 20, size, font: bold });
    // A URL has no spaces to wrap at: cut it where the width runs out.
    const linkLines: string[] = [''];
    for (const ch of toWinAnsi(l.link)) {
      if (font.widthOfTextAtSize(linkLines[linkLines.length - 1] + ch, 9) > W - tx - M) linkLines.push('');
      linkLines[linkLines.length - 1] += ch;
    }
    linkLines.forEach((s, i) => page.drawText(s, { x: tx, y: y - 38 - i * 12, size: 9, font }));
    page.drawText('Scan the code with a phone camera, or type the address.', { x: tx, y: y - 44 - linkLines.length * 12, size: 9, font });
  } else {
    page.drawText('Draft: the response link and its code appear once a coordinator approves this notice.', { x: M, y: y - 20, size, font: bold });
  }
  return doc.save();
}
