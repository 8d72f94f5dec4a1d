import { route } from '@/lib/api/handler';
import { db } from '@/db';
import { noticeForRequest } from '@/lib/notices/request';
import { letterPdf } from '@/lib/notices/letter';
import { renderCurrent } from '@/lib/notices/values';

/** The printable letter (PDF): club name, address, text, response link and its QR code (committee only). */
export const GET = route<{ id: string; noticeId: string }>(async (_req, ctx) => {
  const { me, c, n } = await noticeForRequest(ctx, 'contact');
  const m = await renderCurrent(db, c, n, me.name);
  const pdf = await letterPdf({
    clubName: m.clubName,
    clubContactEmail: m.values.clubContactEmail ?? '',
    recipientName: n.recipientName,
    postalAddress: n.postalAddress,
    date: m.values.noticeDate ?? '',
    subject: m.subject,
    text: m.text,
    link: m.link,
  });
  return new Response(Buffer.from(pdf), {
    headers: {
      'content-type': 'application/pdf',
      'content-disposition': `inline; filename="letter-${c.reference}-${n.id.slice(0, 8)}.pdf"`,
      'cache-control': 'private, no-store',
    },
  });
});
