// One recorder per app: writes log entries without holding up responses (the entries of one turn
// of the event loop together, one transaction instead of one per call), lets readers wait for
// writes still in progress ("read your own calls"), and hands replays the id their entry will get.
import { randomBytes } from 'node:crypto';
import type { AppContext } from '../../context.ts';
import { newId } from '../../lib/ids.ts';
import { insertRequestLogRows, type RequestLogRow } from './request-log.repository.ts';

export interface ReplayTicket {
  token: string;
  entryId: string;
  replayOf: string;
}

class RequestLogRecorder {
  private readonly pending = new Map<string, Promise<void>>();
  private readonly replays = new Map<string, ReplayTicket>();
  /** Entries recorded since the last write began; written together, in one transaction, after the current turn. */
  private batch: RequestLogRow[] = [];
  private batchWritten: Promise<void> | null = null;

  constructor(private readonly ctx: AppContext) {}

  record(row: RequestLogRow): void {
    this.batch.push(row);
    this.batchWritten ??= new Promise<void>((resolve) => setImmediate(resolve)).then(() => this.writeBatch());
    this.pending.set(row.id, this.batchWritten);
  }

  private async writeBatch(): Promise<void> {
    const rows = this.batch;
    this.batch = [];
    this.batchWritten = null;
    try {
      await insertRequestLogRows(this.ctx.db, rows);
    } catch (error) {
      this.ctx.logger.error({ err: error, requestIds: rows.map((row) => row.request_id) }, 'request log write failed');
    } finally {
      for (const row of rows) this.pending.delete(row.id);
    }
  }

  /** Resolves once every entry recorded so far is written. */
  async drain(): Promise<void> {
    await Promise.all([...this.pending.values()]);
  }

  async settled(id: string): Promise<void> {
    await this.pending.get(id);
  }

  /** A one-time token the replayed request carries, so its entry records `replay_of`; unguessable, so callers cannot forge the link. */
  issueReplay(replayOf: string): ReplayTicket {
    const ticket = { token: randomBytes(18).toString('base64url'), entryId: newId('req'), replayOf };
    this.replays.set(ticket.token, ticket);
    return ticket;
  }

  claimReplay(token: string | undefined): ReplayTicket | undefined {
    if (!token) return undefined;
    const ticket = this.replays.get(token);
    this.replays.delete(token);
    return ticket;
  }
}

const recorders = new WeakMap<AppContext, RequestLogRecorder>();

export function recorderFor(ctx: AppContext): RequestLogRecorder {
  let recorder = recorders.get(ctx);
  if (!recorder) {
    recorder = new RequestLogRecorder(ctx);
    recorders.set(ctx, recorder);
  }
  return recorder;
}
