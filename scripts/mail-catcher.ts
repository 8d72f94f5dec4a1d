/**
 * Local mail catcher: an SMTP server (smtp-server + mailparser) on 127.0.0.1 that keeps every
 * message in a JSON-lines file (so it survives its own restart), and an HTTP JSON API:
 *   GET    /api/v2/messages?start=&limit=   newest first, {total, count, start, items}
 *   GET    /api/v2/search?kind=to|from|containing&query=
 *   GET    /api/v1/messages/:id             one message with headers, text and html
 *   DELETE /api/v1/messages                 delete all
 *   DELETE /api/v1/messages/:id             delete one
 * The list and message shapes follow the common catcher convention (ID, From, To, Content,
 * Created, Raw) and add plain fields (id, subject, text, html, headers, receivedAt).
 * Env: CATCHER_SMTP_PORT (1025), CATCHER_HTTP_PORT (8025), CATCHER_STORE (.data/mail/messages.jsonl),
 * CATCHER_REJECT ("1": answer every message with a temporary failure, for outage tests).
 */
import { SMTPServer } from 'smtp-server';
import { simpleParser, type AddressObject } from 'mailparser';
import http from 'node:http';
import fs from 'node:fs';
import path from 'node:path';
import { randomUUID } from 'node:crypto';

const SMTP_PORT = Number(process.env.CATCHER_SMTP_PORT ?? 1025);
const HTTP_PORT = Number(process.env.CATCHER_HTTP_PORT ?? 8025);
const STORE = path.resolve(process.env.CATCHER_STORE ?? '.data/mail/messages.jsonl');
const HOST = '127.0.0.1';

type Stored = {
  id: string;
  receivedAt: string;
  envelopeFrom: string;
  envelopeTo: string[];
  from: string;
  to: string[];
  subject: string;
  messageId: string | null;
  text: string;
  html: string | null;
  headers: Record<string, string>;
  raw: string;
};

fs.mkdirSync(path.dirname(STORE), { recursive: true });
const messages: Stored[] = fs.existsSync(STORE)
  ? fs.readFileSync(STORE, 'utf8').split('\n').filter(Boolean).flatMap((l) => {
      try {
        return [JSON.parse(l) as Stored];
      } catch {
        return [];
      }
    })
  : [];

const addresses = (a: AddressObject | AddressObject[] | undefined) =>
  (Array.isArray(a) ? a : a ? [a] : []).flatMap((o) => o.value.map((v) => v.address ?? '')).filter(Boolean);

function mailbox(addr: string) {
  const [Mailbox, Domain] = addr.split('@');
  return { Relays: null, Mailbox, Domain: Domain ?? '', Params: '' };
}

/** The common catcher shape plus our plain fields. */
function view(m: Stored) {
  const multi: Record<string, string[]> = Object.fromEntries(Object.entries(m.headers).map(([k, v]) => [k, [v]]));
  return {
    ID: m.id,
    From: mailbox(m.envelopeFrom),
    To: m.envelopeTo.map(mailbox),
    Content: { Headers: multi, Body: m.text, Size: m.raw.length, MIME: null },
    Created: m.receivedAt,
    MIME: null,
    Raw: { From: m.envelopeFrom, To: m.envelopeTo, Data: m.raw, Helo: 'localhost' },
    id: m.id,
    receivedAt: m.receivedAt,
    from: m.from,
    to: m.to,
    subject: m.subject,
    messageId: m.messageId,
    text: m.text,
    html: m.html,
    headers: m.headers,
  };
}

const smtp = new SMTPServer({
  authOptional: true,
  disabledCommands: ['STARTTLS'],
  banner: 'Quietfix local mail catcher',
  size: 25 * 1024 * 1024,
  onData(stream, session, callback) {
    const chunks: Buffer[] = [];
    stream.on('data', (c: Buffer) => chunks.push(c));
    stream.on('end', async () => {
      if (process.env.CATCHER_REJECT === '1') {
        const err = new Error('catcher set to refuse mail') as Error & { responseCode: number };
        err.responseCode = 451;
        return callback(err);
      }
      try {
        const raw = Buffer.concat(chunks).toString('utf8');
        const parsed = await simpleParser(raw);
        const headers: Record<string, string> = {};
        for (const line of parsed.headerLines) headers[line.key] = line.line.slice(line.line.indexOf(':') + 1).trim();
        const stored: Stored = {
          id: randomUUID(),
          receivedAt: new Date().toISOString(),
          envelopeFrom: session.envelope.mailFrom ? session.envelope.mailFrom.address : '',
          envelopeTo: session.envelope.rcptTo.map((r) => r.address),
          from: parsed.from?.text ?? '',
          to: addresses(parsed.to),
          subject: parsed.subject ?? '',
          messageId: parsed.messageId ?? null,
          text: parsed.text ?? '',
          html: typeof parsed.html === 'string' ? parsed.html : null,
          headers,
          raw,
        };
        fs.appendFileSync(STORE, JSON.stringify(stored) + '\n');
        messages.push(stored);
        callback();
      } catch (err) {
        callback(err as Error);
      }
    });
  },
});

function send(res: http.ServerResponse, status: number, body: unknown) {
  res.writeHead(status, { 'content-type': 'application/json' });
  res.end(JSON.stringify(body));
}

function page(list: Stored[], url: URL) {
  const start = Math.max(0, Number(url.searchParams.get('start') ?? 0) || 0);
  const limit = Math.min(1000, Math.max(1, Number(url.searchParams.get('limit') ?? 50) || 50));
  const newestFirst = [...list].reverse();
  const items = newestFirst.slice(start, start + limit).map(view);
  return { total: list.length, count: items.length, start, items };
}

function matches(m: Stored, kind: string, q: string) {
  const needle = q.toLowerCase();
  if (kind === 'to') return m.envelopeTo.some((t) => t.toLowerCase().includes(needle)) || m.to.some((t) => t.toLowerCase().includes(needle));
  if (kind === 'from') return m.envelopeFrom.toLowerCase().includes(needle) || m.from.toLowerCase().includes(needle);
  return m.raw.toLowerCase().includes(needle) || m.text.toLowerCase().includes(needle);
}

const api = http.createServer((req, res) => {
  const url = new URL(req.url ?? '/', `http://${HOST}`);
  const one = url.pathname.match(/^\/api\/v[12]\/messages\/([\w-]+)$/);
  if (req.method === 'GET' && url.pathname === '/api/v2/messages') return send(res, 200, page(messages, url));
  if (req.method === 'GET' && url.pathname === '/api/v2/search') {
    const kind = url.searchParams.get('kind') ?? 'containing';
    const q = url.searchParams.get('query') ?? '';
    return send(res, 200, page(messages.filter((m) => matches(m, kind, q)), url));
  }
  if (req.method === 'GET' && one) {
    const m = messages.find((x) => x.id === one[1]);
    return m ? send(res, 200, view(m)) : send(res, 404, { error: 'no such message' });
  }
  if (req.method === 'DELETE' && url.pathname === '/api/v1/messages') {
    messages.length = 0;
    fs.writeFileSync(STORE, '');
    return send(res, 200, { ok: true });
  }
  if (req.method === 'DELETE' && one) {
    const i = messages.findIndex((x) => x.id === one[1]);
    if (i < 0) return send(res, 404, { error: 'no such message' });
    messages.splice(i, 1);
    fs.writeFileSync(STORE, messages.map((m) => JSON.stringify(m) + '\n').join(''));
    return send(res, 200, { ok: true });
  }
  if (req.method === 'GET' && url.pathname === '/') return send(res, 200, { service: 'quietfix mail catcher', messages: messages.length });
  send(res, 404, { error: 'unknown endpoint' });
});

function fail(what: string, port: number) {
  return (err: NodeJS.ErrnoException) => {
    if (err.code === 'EADDRINUSE') console.error(`mail catcher: ${what} port ${port} on ${HOST} is taken; stop what uses it or set ${what === 'SMTP' ? 'CATCHER_SMTP_PORT' : 'CATCHER_HTTP_PORT'}.`);
    else console.error(`mail catcher: ${what} failed: ${err.message}`);
    process.exit(1);
  };
}
smtp.on('error', (err) => console.error('mail catcher: SMTP session error:', err.message));
smtp.server.once('error', fail('SMTP', SMTP_PORT));
api.once('error', fail('HTTP', HTTP_PORT));
smtp.listen(SMTP_PORT, HOST, () => {
  api.listen(HTTP_PORT, HOST, () => {
    console.log(`mail catcher: SMTP on ${HOST}:${SMTP_PORT}, API on http://${HOST}:${HTTP_PORT} (${messages.length} kept in ${STORE})`);
  });
});

const stop = () => {
  smtp.close(() => undefined);
  api.close(() => process.exit(0));
  setTimeout(() => process.exit(0), 1000).unref();
};
process.on('SIGINT', stop);
process.on('SIGTERM', stop);
