// A feed silent for longer than AGENT_STALE_MINUTES mails the users who asked for `feed_stale`
// alerts, once per silence; the next heartbeat re-arms it. The e-mail is read back from the
// in-process SMTP server.
import request from 'supertest';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { flushAlerts } from '../../../server/domain/alerts/alerts.service.ts';
import { alertStaleFeeds } from '../../../server/domain/feeds/feed-watch.ts';
import { createTestApp, issueKey, seedDemoLab, signedInAgent, type TestApp, waitForMail } from '../../helpers/test-app.ts';

let t: TestApp;
let lab: Awaited<ReturnType<typeof seedDemoLab>>;
let agentKey: string;
let analystEmail: string;
beforeAll(async () => {
  t = await createTestApp({ agentStaleMinutes: 10, alertGroupMinutes: 5 });
  lab = await seedDemoLab(t.db);
  agentKey = (await issueKey(t, ['imports:write'])).secret;
  const analyst = await signedInAgent(t, 'analyst');
  analystEmail = analyst.user.email;
  const prefs = await analyst.agent.put('/api/v1/me/alert-preferences').send({ data: [{ kind: 'feed_stale', instrument_id: null }] });
  expect(prefs.status).toBe(200);
});
afterAll(() => t.close());

const heartbeat = () =>
  request(t.app)
    .post(`/api/v1/instruments/${lab.foundry.id}/agent-heartbeat`)
    .set('authorization', `Bearer ${agentKey}`)
    .send({
      agent_version: '0.1.0',
      host: 'SPARK-PC-1',
      queue_length: 2,
      last_file: { name: 'K24-0412.csv', at: new Date().toISOString() },
    });
const pendingAlerts = () => t.db('pending_alerts').where({ kind: 'feed_stale' });
const minutesFromNow = (m: number) => new Date(Date.now() + m * 60_000);

describe('feed_stale alerts', () => {
  it('alert once when the agent falls silent, again after the next silence, and mail the instrument and its last state', async () => {
    expect((await heartbeat()).status).toBe(200);
    expect(await alertStaleFeeds(t.ctx, minutesFromNow(5))).toBe(0); // 5 minutes of silence: still alive

    expect(await alertStaleFeeds(t.ctx, minutesFromNow(11))).toBe(1);
    expect(await alertStaleFeeds(t.ctx, minutesFromNow(30))).toBe(0); // the same silence alerts once
    expect(await pendingAlerts()).toHaveLength(1);

    expect(await flushAlerts(t.ctx, minutesFromNow(40))).toBe(1);
    const mail = await waitForMail(t.smtp, (m) => m.to.includes(analystEmail));
    expect(mail.subject).toMatch(/OES-1: no word from its instrument PC agent since/);
    expect(mail.text).toContain('SPARK-PC-1');
    expect(mail.text).toContain('Files waiting then: 2. Last file: K24-0412.csv');

    // A heartbeat re-arms it: the next silence alerts again.
    expect((await heartbeat()).status).toBe(200);
    expect(await alertStaleFeeds(t.ctx, minutesFromNow(11))).toBe(1);
    expect(await pendingAlerts()).toHaveLength(2);
  });
});
