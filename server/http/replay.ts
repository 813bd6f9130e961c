// Sends a logged call again, in process, through the whole app — authentication, scopes, rate
// limits and logging included — with the credentials of whoever asked for the replay.
import type { RequestListener } from 'node:http';
import type { Request } from 'express';
import inject from 'light-my-request';
import type { AppContext } from '../context.ts';
import { REPLAY_TOKEN_HEADER } from './request-log.ts';
import { UnprocessableProblem } from '../lib/problems.ts';
import { recorderFor } from '../domain/request-log/recorder.ts';
import type { RequestLogRow } from '../domain/request-log/request-log.repository.ts';
import { notReplayableReason } from '../domain/request-log/request-log.service.ts';

/** Logged request headers sent again; credentials come from the replay request instead. */
const REPLAYED_HEADERS = ['content-type', 'accept', 'idempotency-key'];

/** Copies the methods an object's own class defines onto the object itself. */
function pinClassMethods(target: object): void {
  const proto = Object.getPrototypeOf(target) as object;
  for (const name of Object.getOwnPropertyNames(proto)) {
    const descriptor = Object.getOwnPropertyDescriptor(proto, name);
    if (name !== 'constructor' && typeof descriptor?.value === 'function') Object.defineProperty(target, name, descriptor);
  }
}

/**
 * Handed an Express app, light-my-request re-parents Express's request and response prototypes —
 * shared by every app in the process — which breaks real sockets afterwards. Handed a plain
 * function it leaves them alone; Express then swaps the injected objects' prototypes, so the
 * injected request and response keep their own methods as own properties.
 */
function dispatchTo(app: unknown): inject.DispatchFunc {
  return (req, res) => {
    pinClassMethods(req);
    pinClassMethods(res);
    (app as RequestListener)(req, res);
  };
}

/** Replays the entry; returns the id of the new entry, which records `replay_of`. */
export async function replayEntry(ctx: AppContext, req: Request, row: RequestLogRow): Promise<string> {
  const reason = notReplayableReason(row, ctx.config.requestLogBodyLimit);
  if (reason) throw new UnprocessableProblem(reason);

  const recorder = recorderFor(ctx);
  const ticket = recorder.issueReplay(row.id);
  const logged = JSON.parse(row.request_headers_json) as Record<string, string>;
  const headers: Record<string, string> = { [REPLAY_TOKEN_HEADER]: ticket.token, 'user-agent': 'meltwire-replay' };
  for (const name of REPLAYED_HEADERS) if (logged[name]) headers[name] = logged[name];
  const authorization = req.get('authorization');
  const cookie = req.get('cookie');
  if (authorization) headers.authorization = authorization;
  else if (cookie) headers.cookie = cookie;

  try {
    await inject(dispatchTo(req.app), {
      method: row.method,
      url: row.query ? `${row.path}?${row.query}` : row.path,
      headers,
      ...(row.request_body !== null ? { payload: row.request_body } : {}),
      remoteAddress: req.ip,
    });
  } finally {
    recorder.claimReplay(ticket.token);
  }
  await recorder.settled(ticket.entryId);
  return ticket.entryId;
}
