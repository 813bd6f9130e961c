// A typed integrator script: checks its key, then pages through the audit trail with the
// cursor, using openapi-fetch and the types generated from Meltwire's OpenAPI document.
//
//   MELTWIRE_URL=http://localhost:3000 MELTWIRE_KEY=mw_live_… npx tsx examples/client.ts
//
// The key needs the scope audit:read. PAGE_SIZE (default 50) sets the page size.
// In your own project, generate the types from your server: npx openapi-typescript http://localhost:3000/api/v1/openapi.json -o meltwire.d.ts
import createClient from 'openapi-fetch';
import type { components, paths } from '../src/api/schema.d.ts';

type Problem = components['schemas']['Problem'];

const baseUrl = `${(process.env.MELTWIRE_URL ?? 'http://localhost:3000').replace(/\/$/, '')}/api/v1`;
const key = process.env.MELTWIRE_KEY;
if (!key) {
  console.error('Set MELTWIRE_KEY to an API key (mw_live_…).');
  process.exit(2);
}

const meltwire = createClient<paths>({ baseUrl, headers: { Authorization: `Bearer ${key}` } });

/** Every error is an RFC 9457 problem: say what went wrong and which request it was. */
function fail(problem: Problem | undefined, response: Response): never {
  console.error(
    `${response.status} ${problem?.title ?? response.statusText}: ${problem?.detail ?? ''} (request ${problem?.request_id ?? response.headers.get('x-request-id')})`,
  );
  for (const error of problem?.errors ?? []) console.error(`  ${error.location}: ${error.message}`);
  process.exit(1);
}

const me = await meltwire.GET('/auth/me');
if (!me.data) fail(me.error, me.response);
console.log(`key of ${me.data.user.email}, scopes: ${me.data.scopes.join(', ')}`);

let cursor: string | undefined;
let pages = 0;
let events = 0;
do {
  const page = await meltwire.GET('/audit-events', { params: { query: { limit: Number(process.env.PAGE_SIZE ?? 50), cursor } } });
  if (!page.data) fail(page.error, page.response);
  pages += 1;
  for (const event of page.data.data) {
    events += 1;
    console.log(`event ${event.id} ${event.occurred_at} ${event.action} ${event.target.type}:${event.target.id ?? '-'}`);
  }
  cursor = page.data.next_cursor ?? undefined;
} while (cursor);
console.log(`pages=${pages} events=${events}`);
