import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { seedDemoIfEmpty } from '../../../server/seed/demo.ts';
import { createTestApp, signedInAgent, type TestApp } from '../../helpers/test-app.ts';

let t: TestApp;
beforeAll(async () => {
  t = await createTestApp();
});
afterAll(() => t.close());

describe('demo scenario', () => {
  it('seeds both plants once, with results computed, and never into a non-empty database', async () => {
    expect(await seedDemoIfEmpty(t.db)).toBe(true);
    expect(await seedDemoIfEmpty(t.db)).toBe(false);
    const { agent } = await signedInAgent(t, 'viewer');
    const instruments = await agent.get('/api/v1/instruments');
    expect(instruments.body.data.map((i: { code: string }) => i.code)).toEqual(['OES-1', 'OES-2']);
    const samples = await agent.get('/api/v1/samples').query({ limit: 200 });
    expect(samples.body.data).toHaveLength(26);
    expect(samples.body.data.every((s: { heat: string }) => /^(K24|B24)-\d{4}$/.test(s.heat))).toBe(true);
    const flagged = await agent.get('/api/v1/samples').query({ flag: 'repeatability_exceeded' });
    expect(flagged.body.data.map((s: { sample_code: string }) => s.sample_code)).toEqual(['K24-0414-F1']);
  });
});
