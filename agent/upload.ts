// One delivery attempt through the real upload endpoint (POST /api/v1/imports, multipart), with
// the file's SHA-256 in the Idempotency-Key: a retry after a crash is answered with the first
// import, never a second one. The answer is sorted into what the agent does next.
import { createHash } from 'node:crypto';
import type { AgentConfig } from './config.ts';
import { errorMessage } from './log.ts';
import { parseRetryAfter } from './backoff.ts';
import { AGENT_VERSION } from './version.ts';

export interface Problem {
  type?: string;
  title?: string;
  status?: number;
  detail?: string;
  errors?: { location?: string; message?: string; code?: string }[];
  [extension: string]: unknown;
}

export type UploadOutcome =
  /** Stored (201) or already there (200: the same bytes were imported before, or a replay). */
  | { kind: 'sent'; status: number; importId: string; replayed: boolean }
  /** The file itself was refused (a broken value, too large…): never retried. */
  | { kind: 'rejected'; status: number; problem: Problem }
  /** The server is unreachable, busy or failing: keep the file and try again later. */
  | { kind: 'retry'; reason: string; retryAfterMs?: number }
  /** The agent's own settings are refused (key revoked, wrong instrument…): keep every file, retry, tell someone. */
  | { kind: 'blocked'; status: number; reason: string; retryAfterMs?: number };

export const userAgent = `meltwire-agent/${AGENT_VERSION}`;

/**
 * The Idempotency-Key of an upload: the file's SHA-256, followed by a short hash of the settings
 * it is sent with. A retry after a crash repeats both and is answered with the first import; once
 * a refused setting (an unknown method) is corrected, the new request gets a new key, where the
 * bare content hash would meet the refusal the server kept for 24 hours under that key.
 */
export function idempotencyKey(config: Pick<AgentConfig, 'instrument_id' | 'method_id' | 'profile_id'>, sha256: string): string {
  const settings = createHash('sha256')
    .update(`${config.instrument_id}\n${config.method_id}\n${config.profile_id ?? ''}`)
    .digest('hex');
  return `${sha256}-${settings.slice(0, 16)}`;
}

export function authHeaders(config: AgentConfig): Record<string, string> {
  return { authorization: `Bearer ${config.apiKey}`, 'user-agent': userAgent };
}

async function readProblem(res: Response): Promise<Problem> {
  const text = await res.text();
  try {
    const body = JSON.parse(text) as unknown;
    if (body && typeof body === 'object') return body as Problem;
  } catch {
    // not JSON: keep the text
  }
  return { status: res.status, title: res.statusText, detail: text.slice(0, 2000) };
}

/** Problems that describe the agent's settings rather than the file: moving files away would lose them. */
function isSettingsProblem(status: number, problem: Problem): boolean {
  if ([400, 401, 403, 404].includes(status)) return true;
  return status === 422 && (problem.errors ?? []).some((e) => e.code === 'unknown_reference');
}

/** One line for logs and the heartbeat: status, title, detail and the first field errors. */
export function describeProblem(status: number, problem: Problem): string {
  const title = problem.title ?? `HTTP ${status}`;
  const fields = (problem.errors ?? [])
    .slice(0, 3)
    .map((e) => [e.location, e.message].filter(Boolean).join(': '))
    .join('; ');
  return [`${status} ${title}`, problem.detail, fields && `(${fields})`].filter(Boolean).join(': ');
}

export async function uploadFile(config: AgentConfig, file: { name: string; bytes: Buffer; sha256: string }): Promise<UploadOutcome> {
  const form = new FormData();
  form.set('instrument_id', config.instrument_id);
  form.set('method_id', config.method_id);
  if (config.profile_id) form.set('profile_id', config.profile_id);
  form.set('file', new Blob([new Uint8Array(file.bytes)], { type: 'text/csv' }), file.name);
  let res: Response;
  try {
    res = await fetch(`${config.server_url}/api/v1/imports`, {
      method: 'POST',
      headers: { ...authHeaders(config), 'idempotency-key': idempotencyKey(config, file.sha256) },
      body: form,
      signal: AbortSignal.timeout(config.upload_timeout_seconds * 1000),
    });
  } catch (error) {
    return { kind: 'retry', reason: `server unreachable: ${errorMessage(error)}` };
  }
  const retryAfterMs = parseRetryAfter(res.headers.get('retry-after'));
  if (res.ok) {
    const body = (await res.json()) as { id: string };
    return { kind: 'sent', status: res.status, importId: body.id, replayed: res.headers.get('idempotent-replayed') === 'true' };
  }
  const problem = await readProblem(res);
  if (res.status >= 500 || [408, 409, 425, 429].includes(res.status)) {
    return { kind: 'retry', reason: describeProblem(res.status, problem), retryAfterMs };
  }
  if (isSettingsProblem(res.status, problem)) {
    return { kind: 'blocked', status: res.status, reason: describeProblem(res.status, problem), retryAfterMs };
  }
  return { kind: 'rejected', status: res.status, problem };
}
