// A small webhook receiver for Meltwire's deliveries: verifies each signature with the
// `standardwebhooks` npm package (the Standard Webhooks reference library, an implementation
// independent of Meltwire's), answers 204 at once, and handles each event once even when Meltwire
// sends it again (same `webhook-id` on every retry and after a restart).
//
//   WEBHOOK_SECRET=whsec_… PORT=4500 SEEN_FILE=seen-webhooks.txt npx tsx examples/webhook-receiver.ts
//
// Create the endpoint with  POST /api/v1/webhook-endpoints { "url": "http://<this host>:4500/hooks" }
// and keep the `whsec_…` secret it answers with (shown once). In your own project: npm install standardwebhooks.
// Each new event is printed as one line: `<webhook-id>  <type>  <sample code or id>`.
// SEEN_FILE (optional) keeps the ids already handled across restarts of this receiver.
import { appendFileSync, existsSync, readFileSync } from 'node:fs';
import { createServer, type IncomingHttpHeaders } from 'node:http';
import { Webhook, WebhookVerificationError } from 'standardwebhooks';

interface MeltwireEvent {
  type: string;
  timestamp: string;
  data: { id?: string; sample_code?: string } & Record<string, unknown>;
}

const secret = process.env.WEBHOOK_SECRET;
if (!secret?.startsWith('whsec_')) {
  console.error('Set WEBHOOK_SECRET to the whsec_… secret Meltwire showed when the endpoint was created.');
  process.exit(2);
}
const port = Number(process.env.PORT ?? 4500);
const seenFile = process.env.SEEN_FILE;
const webhook = new Webhook(secret);
const seen = new Set(seenFile && existsSync(seenFile) ? readFileSync(seenFile, 'utf8').split('\n').filter(Boolean) : []);

function header(headers: IncomingHttpHeaders, name: string): string {
  const value = headers[name];
  return Array.isArray(value) ? value.join(' ') : (value ?? '');
}

/** What your integration does with a new event; here it prints it. */
function handle(id: string, event: MeltwireEvent): void {
  console.log(`${id}  ${event.type}  ${event.data.sample_code ?? event.data.id ?? ''}`);
}

const server = createServer((req, res) => {
  const chunks: Buffer[] = [];
  req.on('data', (chunk: Buffer) => chunks.push(chunk));
  req.on('end', () => {
    const body = Buffer.concat(chunks).toString('utf8');
    const id = header(req.headers, 'webhook-id');
    let event: MeltwireEvent;
    try {
      // Checks the signature (any of the space-separated ones, as during a secret rotation) and
      // that the timestamp is within five minutes, which refuses replays of old requests.
      event = webhook.verify(body, {
        'webhook-id': id,
        'webhook-timestamp': header(req.headers, 'webhook-timestamp'),
        'webhook-signature': header(req.headers, 'webhook-signature'),
      }) as MeltwireEvent;
    } catch (error) {
      const reason = error instanceof WebhookVerificationError ? error.message : 'unreadable request';
      console.error(`refused ${id || '(no webhook-id)'}: ${reason}`);
      res.writeHead(400, { 'content-type': 'text/plain' }).end(`${reason}\n`);
      return;
    }
    if (!seen.has(id)) {
      seen.add(id);
      if (seenFile) appendFileSync(seenFile, `${id}\n`);
      handle(id, event);
    }
    // A 2xx tells Meltwire the event arrived; a repeat is answered the same way so it stops retrying.
    res.writeHead(204).end();
  });
});

server.listen(port, () => console.error(`listening on http://localhost:${port}/hooks`));
for (const signal of ['SIGINT', 'SIGTERM'] as const) process.on(signal, () => server.close(() => process.exit(0)));
