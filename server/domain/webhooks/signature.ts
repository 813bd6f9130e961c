// Standard Webhooks signatures: `v1,` + base64(HMAC-SHA256(secret bytes, "id.timestamp.body")),
// the secret given as `whsec_` + base64. During a rotation both signatures are sent, space-separated.
// Checked against the specification's published vector: tests/unit/webhooks/signature.test.ts.
import { createHmac, randomBytes } from 'node:crypto';

export const SECRET_PREFIX = 'whsec_';

/** A new endpoint secret: `whsec_` + base64 of 24 random bytes. */
export function newWebhookSecret(): string {
  return `${SECRET_PREFIX}${randomBytes(24).toString('base64')}`;
}

export function sign(secret: string, id: string, timestamp: number, body: string): string {
  const key = Buffer.from(secret.startsWith(SECRET_PREFIX) ? secret.slice(SECRET_PREFIX.length) : secret, 'base64');
  return `v1,${createHmac('sha256', key).update(`${id}.${timestamp}.${body}`).digest('base64')}`;
}

/** The `webhook-id`, `webhook-timestamp` and `webhook-signature` headers of one attempt. */
export function signedHeaders(secrets: string[], id: string, timestamp: number, body: string): Record<string, string> {
  return {
    'webhook-id': id,
    'webhook-timestamp': String(timestamp),
    'webhook-signature': secrets.map((secret) => sign(secret, id, timestamp, body)).join(' '),
  };
}
