// The HTTP sender on its own against local receivers: the time limit, the 2 KB excerpt, Retry-After.
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { createSender, type Sender } from '../../../server/domain/webhooks/sender.ts';
import { type Receiver, startReceiver } from '../../helpers/webhook-receiver.ts';

let sender: Sender;
let hanging: Receiver;
let chatty: Receiver;

beforeAll(async () => {
  sender = createSender({ allowPrivate: true, userAgent: 'test', timeoutMs: 300 });
  hanging = await startReceiver(4351, () => ({ status: 200, hang: true }));
  chatty = await startReceiver(4352, () => ({ status: 503, headers: { 'retry-after': '120' }, body: 'é'.repeat(5000) }));
});
afterAll(async () => {
  sender.close();
  await hanging.close();
  await chatty.close();
});

const send = (url: string, signal = new AbortController().signal) => sender.send(url, { 'webhook-id': 'evt_1' }, '{"a":1}', signal);

describe('webhook sender', () => {
  it('gives up when no complete answer comes within the limit', async () => {
    const result = await send(hanging.url);
    expect(result.status).toBeUndefined();
    expect(result.error).toContain('no complete answer within 0.3 s');
    expect(result.durationMs).toBeGreaterThanOrEqual(290);
    expect(hanging.received[0].headers).toMatchObject({ 'content-type': 'application/json', 'webhook-id': 'evt_1', 'user-agent': 'test' });
  });

  it('keeps the first 2 KB of the answer and reads Retry-After', async () => {
    const result = await send(chatty.url);
    expect(result).toMatchObject({ status: 503, retryAfterSeconds: 120 });
    expect(Buffer.byteLength(result.excerpt!)).toBeLessThanOrEqual(2048 + 3);
    expect(result.excerpt!.startsWith('éé')).toBe(true);
  });

  it('stops at once when the worker stops, marking the attempt as cut short', async () => {
    const controller = new AbortController();
    const pending = send(hanging.url, controller.signal);
    setTimeout(() => controller.abort(), 50);
    expect(await pending).toMatchObject({ aborted: true });
  });
});
