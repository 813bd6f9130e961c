// The pages problem `type` URIs open: GET /problems/<slug> explains one type (HTML for a browser,
// JSON when asked with Accept: application/json), GET /problems lists them all. Served by the
// server itself, so they work without the console build and for any client that follows the URI.
import { STATUS_CODES } from 'node:http';
import { Router, type Response } from 'express';
import { PROBLEM_TYPES, problemTypeDoc, statusSlug, type ProblemTypeDoc } from '../lib/problem-types.ts';
import { NotFoundProblem } from '../lib/problems.ts';

/** A 4xx passed on from Express or its middleware with no entry of its own: explained by its status. */
function statusDoc(slug: string): ProblemTypeDoc | undefined {
  for (let status = 400; status < 500; status += 1) {
    if (STATUS_CODES[status] && statusSlug(status) === slug) {
      return {
        slug,
        status,
        title: STATUS_CODES[status]!,
        meaning: `The HTTP status ${status} (${STATUS_CODES[status]}), passed on from the web server for a request it could not take; detail says why.`,
        remedy: [
          'Read detail, correct the request and send it again.',
          'The API reference lists the methods, media types and headers each operation takes.',
        ],
      };
    }
  }
  return undefined;
}

const escapeHtml = (text: string) =>
  text.replace(/[&<>"']/g, (c) => ({ '&': '&amp;', '<': '&lt;', '>': '&gt;', '"': '&quot;', "'": '&#39;' })[c]!);

const STYLE = `body{font:16px/1.5 system-ui,sans-serif;color:#221c18;background:#faf7f2;margin:0}
main{max-width:46rem;margin:0 auto;padding:2rem 1.25rem}a{color:#a8461c}code{font:0.9em ui-monospace,monospace;background:#f3ece4;padding:0 .25em;border-radius:3px}
.status{display:inline-block;font-weight:600;background:#221c18;color:#faf7f2;border-radius:4px;padding:0 .5em;margin-right:.5em}
table{border-collapse:collapse}td,th{text-align:left;padding:.25rem .75rem .25rem 0;vertical-align:top}nav{font-size:.9em;margin-bottom:1.5rem}`;

function page(title: string, body: string): string {
  return `<!doctype html><html lang="en"><head><meta charset="utf-8"><meta name="viewport" content="width=device-width, initial-scale=1">
<title>${escapeHtml(title)} · Meltwire problem types</title><style>${STYLE}</style></head>
<body><main><nav><a href="/problems">All problem types</a> · <a href="/reference">API reference</a></nav>${body}</main></body></html>`;
}

function docPage(doc: ProblemTypeDoc): string {
  const extensions = Object.entries(doc.extensions ?? {});
  return page(
    doc.title,
    `<h1><span class="status">${doc.status}</span>${escapeHtml(doc.title)}</h1>
<p>Problem type <code>/problems/${escapeHtml(doc.slug)}</code></p>
<h2>What it means</h2><p>${escapeHtml(doc.meaning)}</p>
<h2>What to do</h2><ul>${doc.remedy.map((step) => `<li>${escapeHtml(step)}</li>`).join('')}</ul>
${extensions.length ? `<h2>Extra members</h2><table>${extensions.map(([name, text]) => `<tr><th><code>${escapeHtml(name)}</code></th><td>${escapeHtml(text)}</td></tr>`).join('')}</table>` : ''}
<h2>Every problem</h2><p>Errors are <code>application/problem+json</code> (RFC 9457) with <code>type</code>, <code>title</code>, <code>status</code>, <code>detail</code>, <code>instance</code> and <code>request_id</code>. Quote the <code>request_id</code>: it finds the call in the console’s Request log.</p>`,
  );
}

function indexPage(): string {
  const rows = PROBLEM_TYPES.map(
    (doc) =>
      `<tr><td>${doc.status}</td><td><a href="/problems/${doc.slug}">${escapeHtml(doc.title)}</a></td><td><code>/problems/${doc.slug}</code></td></tr>`,
  ).join('');
  return page(
    'All problem types',
    `<h1>Problem types</h1><p>The <code>type</code> of every error Meltwire answers with, and what to do about it. Other 4xx statuses use the slug of their HTTP status (such as <code>/problems/method-not-allowed</code>).</p><table><tr><th>Status</th><th>Title</th><th>Type</th></tr>${rows}</table>`,
  );
}

function send(res: Response, doc: ProblemTypeDoc): void {
  res.setHeader('Cache-Control', 'public, max-age=3600');
  res.format({
    html: () => res.type('html').send(docPage(doc)),
    json: () => res.json({ type: `/problems/${doc.slug}`, ...doc }),
  });
}

export function problemPages(): Router {
  const router = Router();
  router.get('/', (_req, res) => {
    res.setHeader('Cache-Control', 'public, max-age=3600');
    res.format({
      html: () => res.type('html').send(indexPage()),
      json: () => res.json({ data: PROBLEM_TYPES.map((doc) => ({ type: `/problems/${doc.slug}`, ...doc })) }),
    });
  });
  router.get('/:slug', (req, res) => {
    const doc = problemTypeDoc(req.params.slug) ?? statusDoc(req.params.slug);
    if (!doc) throw new NotFoundProblem(`No problem type ${req.params.slug}; /problems lists them all.`);
    send(res, doc);
  });
  return router;
}
