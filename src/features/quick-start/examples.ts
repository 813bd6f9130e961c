// Copy-paste examples for the Quick start page, written for the server the console is served
// from. Plain functions of the origin, so a test can run them against a live server. The
// TypeScript project is the repository's examples/quick-start, shown as it is checked in.
import packageJson from '../../../examples/quick-start/package.json?raw';
import quickStartScript from '../../../examples/quick-start/quick-start.ts?raw';
import sampleOutput from '../../../examples/quick-start/sample-output.txt?raw';
import tsconfigJson from '../../../examples/quick-start/tsconfig.json?raw';

export interface QuickStartExample {
  id: string;
  title: string;
  intro: string;
  code: string;
  /** Files to save before running `code`. */
  files?: { name: string; code: string }[];
  /** What a run prints on the demo data; "…" stands for what is left out or differs from run to run (ids, times). */
  output?: string;
  outputNote?: string;
}

export function quickStartExamples(origin: string): QuickStartExample[] {
  const api = `${origin}/api/v1`;
  return [
    {
      id: 'key',
      title: '1. Keep your key in the environment',
      intro:
        'Issue a key on the API keys page with only the scopes your integration needs (samples:read for these examples). It is shown once; keep it out of scripts and source control.',
      code: `export MELTWIRE_KEY='mw_live_…'   # paste the key you copied`,
    },
    {
      id: 'first-call',
      title: '2. Your first call',
      intro: 'Ask who the key belongs to and which scopes it carries. Every call sends the key as a Bearer token.',
      code: `curl -sS ${api}/auth/me \\\n  -H "Authorization: Bearer $MELTWIRE_KEY"`,
      output: `{"user":{"id":"usr_…","email":"mes-bridge@kestrelbend.test","name":"MES bridge (integrator)","role":"integrator",…},"scopes":["samples:read"],"auth":"api_key","session_expires_at":null}`,
    },
    {
      id: 'list',
      title: '3. List samples',
      intro:
        'Lists return a page of data and a cursor for the next page; next_cursor is null on the last page. limit is 1–200 (default 50).',
      code: `curl -sS "${api}/samples?limit=2" \\\n  -H "Authorization: Bearer $MELTWIRE_KEY"`,
      output: `{"data":[{"id":"smp_…","sample_code":"KB-CTRL-AL1","heat":null,"grade":null,"kind":"control","status":"draft",…,"results":[{"element":"Si","mean":0.4552…,"unit":"%",…,"reported":"0.46",…}],"correction":{…},…},…],"next_cursor":"…"}`,
    },
    {
      id: 'pages',
      title: '4. Page through everything',
      intro: 'Pass next_cursor back as cursor until it is null. Cursors are opaque: never build or edit one. (Needs jq.)',
      code: [
        `cursor=""`,
        `while :; do`,
        `  page=$(curl -sS -G ${api}/samples -H "Authorization: Bearer $MELTWIRE_KEY" \\`,
        `    --data-urlencode limit=200 \${cursor:+--data-urlencode "cursor=$cursor"})`,
        `  jq -c '.data[]' <<<"$page"`,
        `  cursor=$(jq -r '.next_cursor // empty' <<<"$page")`,
        `  [ -n "$cursor" ] || break`,
        `done`,
      ].join('\n'),
    },
    {
      id: 'errors',
      title: '5. Read errors',
      intro:
        'Every error is an RFC 9457 problem (application/problem+json). Validation errors list each field in errors[]; quote request_id when you ask for help — it finds the call in the Request log. A key without the scope gets 403 naming the scope it needs. The type (here /problems/forbidden) opens a page on this server that explains the problem and what to do.',
      code: `curl -sS -i ${api}/users \\\n  -H "Authorization: Bearer $MELTWIRE_KEY"`,
      output: [
        'HTTP/1.1 403 Forbidden',
        '…',
        'Content-Type: application/problem+json; charset=utf-8',
        '…',
        '',
        '{"type":"/problems/forbidden","title":"Not allowed","status":403,"detail":"This action needs the scope \\"users:read\\".","instance":"/api/v1/users","required_scope":"users:read","request_id":"…"}',
      ].join('\n'),
    },
    {
      id: 'typescript',
      title: '6. A typed client in TypeScript',
      intro:
        "A project of its own (Node.js 20.19+): save the three files below in a new folder meltwire-quick-start, install, generate the types from this server's OpenAPI document, then run the script with tsx — paths, parameters and fields are checked by the compiler. The same files are in the repository's examples/quick-start.",
      code: [
        `cd meltwire-quick-start   # the folder holding package.json, tsconfig.json and quick-start.ts`,
        `npm install`,
        `export MELTWIRE_URL=${origin}`,
        `npm run types        # writes meltwire.d.ts from ${api}/openapi.json`,
        `npm run typecheck    # optional`,
        `npx tsx quick-start.ts`,
      ].join('\n'),
      files: [
        { name: 'package.json', code: packageJson },
        { name: 'tsconfig.json', code: tsconfigJson },
        { name: 'quick-start.ts', code: quickStartScript },
      ],
      output: sampleOutput.trimEnd(),
      outputNote:
        'With a samples:read key of the demo integrator on the demo data. A test runs these steps against a live server and compares its output with this text.',
    },
  ];
}
