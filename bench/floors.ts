// The floors of `npm run bench:api`, as a process of their own like the server they are compared
// with: node:http, no framework, no checks.
// - GET /list and /one: the same stored bytes the API serves for GET /api/v1/samples?limit=100
//   and /api/v1/samples/{id} (the prepared documents), read by one better-sqlite3 query each;
// - POST /push: JSON.parse and one better-sqlite3 transaction writing the sample and its burns.
// Usage: node --import tsx bench/floors.ts <database file> <sample id>; prints "listening <port>".
import { createServer } from 'node:http';
import type { AddressInfo } from 'node:net';
import Database from 'better-sqlite3';
import { encodeCursor } from '../server/lib/pagination.ts';

const [databaseFile, sampleId] = process.argv.slice(2);
const read = new Database(databaseFile, { readonly: true });
const list = read.prepare('select id, created_at, summary_doc from samples order by created_at desc, id desc limit 101');
const one = read.prepare('select detail_doc from samples where id = ?');

const write = new Database(databaseFile.replace(/\.db$/, '-floor.db'));
write.pragma('journal_mode = WAL');
write.pragma('synchronous = NORMAL');
write.exec(
  'create table if not exists s (id integer primary key, code text, body text); create table if not exists b (s integer, n integer, v text)',
);
const insertSample = write.prepare('insert into s (code, body) values (?, ?)');
const insertBurn = write.prepare('insert into b (s, n, v) values (?, ?, ?)');
const store = write.transaction((parsed: { sample_code: string; burns: { values: unknown }[] }, text: string) => {
  const id = insertSample.run(parsed.sample_code, text).lastInsertRowid;
  parsed.burns.forEach((burn, n) => insertBurn.run(id, n + 1, JSON.stringify(burn.values)));
  return id;
});

function listPage(): string {
  const rows = list.all() as { id: string; created_at: string; summary_doc: string }[];
  const page = rows.slice(0, 100);
  const last = page[page.length - 1];
  const cursor = rows.length > 100 ? encodeCursor({ t: last.created_at, id: last.id, by: 'created_desc' }) : null;
  return `{"data":[${page.map((row) => row.summary_doc).join(',')}],"next_cursor":${JSON.stringify(cursor)}}`;
}

const server = createServer((req, res) => {
  if (req.method === 'POST') {
    let text = '';
    req.on('data', (chunk: Buffer) => (text += chunk));
    req.on('end', () => {
      const id = store(JSON.parse(text), text);
      res.writeHead(201, { 'content-type': 'application/json' }).end(JSON.stringify({ id: String(id) }));
    });
    return;
  }
  const body = req.url!.startsWith('/one') ? (one.get(sampleId) as { detail_doc: string }).detail_doc : listPage();
  res.writeHead(200, { 'content-type': 'application/json' }).end(body);
});
server.listen(0, '127.0.0.1', () => console.log(`listening ${(server.address() as AddressInfo).port}`));
