/**
 * A local webhook receiver for trying Stormdraft's webhooks by hand: listens on 127.0.0.1,
 * verifies each delivery's Standard Webhooks signature with the endpoint's secret and prints one
 * line per event. Usage: WEBHOOK_SECRET=whsec_… npm run -s webhook-receiver [-- PORT]
 */
import { createServer } from 'node:http';
import { Webhook } from 'standardwebhooks';

const secret = process.env.WEBHOOK_SECRET ?? '';
const port = Number(process.argv[2] ?? 4000);
if (!secret.startsWith('whsec_')) {
  console.error('Set WEBHOOK_SECRET to the secret shown when you registered the endpoint (it starts with whsec_).');
  process.exit(1);
}
const webhook = new Webhook(secret);
const seen = new Set<string>();

const server = createServer((req, res) => {
  const chunks: Buffer[] = [];
  let size = 0;
  req.on('data', (chunk: Buffer) => {
    size += chunk.length;
    if (size <= 10_000_000) chunks.push(chunk);
  });
  req.on('end', () => {
    const body = Buffer.concat(chunks).toString('utf8');
    const header = (name: string) => String(req.headers[name] ?? '');
    try {
      // eslint-disable-next-line @typescript-eslint/no-unsafe-type-assertion -- a development tool printing what it received; the signature was verified just now.
      const event = webhook.verify(body, { 'webhook-id': header('webhook-id'), 'webhook-timestamp': header('webhook-timestamp'), 'webhook-signature': header('webhook-signature') }) as { type?: string; data?: { issuance?: string; capUrl?: string; geojson?: { features?: unknown[] } } };
      const duplicate = seen.has(header('webhook-id'));
      seen.add(header('webhook-id'));
      console.log(`verified ${event.type} ${event.data?.issuance} · ${event.data?.geojson?.features?.length ?? 0} areas · CAP ${event.data?.capUrl}${duplicate ? ' (duplicate webhook-id, ignored)' : ''}`);
      res.statusCode = 204;
    } catch (error) {
      console.log(`refused a delivery: ${error instanceof Error ? error.message : 'bad signature'}`);
      res.statusCode = 400;
    }
    res.end();
  });
});
server.listen(port, '127.0.0.1', () => console.log(`Listening on http://127.0.0.1:${port}/hooks (Ctrl-C to stop)`));
