// Meltwire quick start: checks the key, then lists the samples of one heat with their reported
// results. Types come from the server's own OpenAPI document (npm run types).
import createClient from 'openapi-fetch';
import type { components, paths } from './meltwire.d.ts';

type Problem = components['schemas']['Problem'];

const key = process.env.MELTWIRE_KEY;
if (!key) {
  console.error('Set MELTWIRE_KEY to an API key (mw_live_…) with the scope samples:read.');
  process.exit(2);
}
const baseUrl = `${(process.env.MELTWIRE_URL ?? 'http://localhost:3000').replace(/\/$/, '')}/api/v1`;
const meltwire = createClient<paths>({ baseUrl, headers: { Authorization: `Bearer ${key}` } });

/** Every error is an RFC 9457 problem: print what went wrong and the request id, then stop. */
function fail(problem: Problem | undefined, response: Response): never {
  console.error(`${response.status} ${problem?.title ?? response.statusText}: ${problem?.detail ?? ''}`);
  for (const error of problem?.errors ?? []) console.error(`  ${error.location}: ${error.message}`);
  console.error(`request ${problem?.request_id ?? response.headers.get('x-request-id')}`);
  process.exit(1);
}

async function main(): Promise<void> {
  const me = await meltwire.GET('/auth/me');
  if (!me.data) fail(me.error, me.response);
  console.log(`key of ${me.data.user.email}, scopes: ${me.data.scopes.join(', ')}`);

  const heat = process.env.HEAT ?? 'K24-0412';
  const samples = await meltwire.GET('/samples', { params: { query: { heat, limit: 50 } } });
  if (!samples.data) fail(samples.error, samples.response);
  console.log(`heat ${heat}: ${samples.data.data.length} samples`);
  for (const sample of samples.data.data) {
    const unit = sample.results[0]?.unit ?? '%';
    const results = sample.results.map((r) => `${r.element} ${r.reported ?? '(not reported)'}`).join(', ');
    console.log(`${sample.sample_code} (${sample.status}), reported in ${unit}: ${results}`);
  }
}

main().catch((error: unknown) => {
  console.error(error instanceof Error ? error.message : error);
  process.exit(1);
});
