import { createHmac } from 'node:crypto';
import { describe, expect, it } from 'vitest';
import { newWebhookSecret, sign, signedHeaders } from '../../../server/domain/webhooks/signature.ts';

describe('Standard Webhooks signatures', () => {
  it('reproduces the published test vector exactly', () => {
    // Source: the Standard Webhooks specification's published example (docs/references.md#webhook-signatures).
    const secret = 'whsec_MfKQ9r8GKYqrTwjUPD8ILPZIo2LaLaSw';
    expect(sign(secret, 'msg_p5jXN8AQM9LWM0D4loKWxJek', 1614265330, '{"test": 2432232314}')).toBe(
      'v1,g0hM9SsE+OTPJTGt/tmIKtSyZlE3uFJELVlNIOLJ1OE=',
    );
  });

  it('makes secrets of whsec_ + base64 of 24 random bytes, never the same twice', () => {
    const a = newWebhookSecret();
    expect(a).toMatch(/^whsec_[A-Za-z0-9+/]{32}$/);
    expect(Buffer.from(a.slice(6), 'base64')).toHaveLength(24);
    expect(newWebhookSecret()).not.toBe(a);
  });

  it('sends one signature per secret, space-separated, during a rotation', () => {
    const [current, previous] = [newWebhookSecret(), newWebhookSecret()];
    const headers = signedHeaders([current, previous], 'evt_1', 1700000000, '{"a":1}');
    const expected = (secret: string) =>
      `v1,${createHmac('sha256', Buffer.from(secret.slice(6), 'base64'))
        .update('evt_1.1700000000.{"a":1}')
        .digest('base64')}`;
    expect(headers).toEqual({
      'webhook-id': 'evt_1',
      'webhook-timestamp': '1700000000',
      'webhook-signature': `${expected(current)} ${expected(previous)}`,
    });
  });
});
