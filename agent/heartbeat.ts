// The heartbeat: the agent tells the server its version, how many files wait, its last delivery
// and its last error, so the console can show whether the instrument's feed is alive.
import { hostname } from 'node:os';
import type { AgentConfig } from './config.ts';
import { authHeaders } from './upload.ts';
import { AGENT_VERSION } from './version.ts';

export interface FeedStatus {
  queueLength: number;
  lastSuccessAt: string | null;
  lastFile: { name: string; at: string } | null;
  lastError: { message: string; at: string } | null;
}

/** Throws when the server cannot be reached or refuses the heartbeat; the caller logs it. */
export async function sendHeartbeat(config: AgentConfig, status: FeedStatus): Promise<void> {
  const res = await fetch(`${config.server_url}/api/v1/instruments/${encodeURIComponent(config.instrument_id)}/agent-heartbeat`, {
    method: 'POST',
    headers: { ...authHeaders(config), 'content-type': 'application/json' },
    body: JSON.stringify({
      agent_version: AGENT_VERSION,
      host: hostname().slice(0, 200) || undefined,
      queue_length: status.queueLength,
      last_success_at: status.lastSuccessAt,
      last_file: status.lastFile ? { name: status.lastFile.name.slice(0, 260), at: status.lastFile.at } : null,
      last_error: status.lastError ? { message: status.lastError.message.slice(0, 2000), at: status.lastError.at } : null,
    }),
    signal: AbortSignal.timeout(30_000),
  });
  if (!res.ok) throw new Error(`heartbeat refused: HTTP ${res.status} ${(await res.text()).slice(0, 500)}`);
}
