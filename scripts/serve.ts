/**
 * Serves the built app (what `next start` does) and tells it the socket address of each
 * request in PEER_HEADER, replacing any value the client sent. Route handlers cannot see the
 * socket otherwise, and Next's own x-forwarded-for is the client's word whenever the client
 * sends one (see lib/auth/client-address.ts). npm start and npm test run the app this way:
 *   node --import tsx scripts/serve.ts -p 3000 -H 127.0.0.1
 */
import { createServer } from 'node:http';
import next from 'next';
import { PEER_HEADER } from '../lib/auth/client-address';

function arg(flag: string, fallback: string): string {
  const i = process.argv.indexOf(flag);
  return i > 0 && process.argv[i + 1] ? process.argv[i + 1] : fallback;
}

const port = Number(arg('-p', process.env.PORT ?? '3000'));
const hostname = arg('-H', process.env.HOSTNAME ?? '127.0.0.1');

async function main() {
  const app = next({ dev: false, dir: process.cwd(), hostname, port });
  const handle = app.getRequestHandler();
  await app.prepare();
  const server = createServer((req, res) => {
    req.headers[PEER_HEADER] = req.socket.remoteAddress ?? '';
    handle(req, res).catch((err) => {
      console.error('quietfix serve: request failed:', err);
      if (!res.headersSent) res.writeHead(500, { 'content-type': 'application/json' });
      res.end(JSON.stringify({ error: 'Something went wrong on our side.' }));
    });
  });
  server.listen(port, hostname, () => console.log(`quietfix ready on http://${hostname}:${port}`));
  for (const sig of ['SIGINT', 'SIGTERM'] as const) {
    process.on(sig, () => {
      server.close(() => process.exit(0));
      setTimeout(() => process.exit(0), 5000).unref();
    });
  }
}

main().catch((err) => {
  console.error('quietfix serve failed to start:', err);
  process.exit(1);
});
