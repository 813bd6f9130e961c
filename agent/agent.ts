// One pass of the agent: list the folders, keep files until they are stable, and deliver each new
// or changed one exactly once, recording the outcome in the ledger. Retryable failures stop the
// pass and hold uploads back (backoff); nothing is lost, because nothing leaves the folder
// before the ledger says it was delivered.
import { createHash } from 'node:crypto';
import { readFile, unlink } from 'node:fs/promises';
import type { AgentConfig } from './config.ts';
import { RetryGate } from './backoff.ts';
import { fileMatcher, type FoundFile, scanFolders } from './folder-scan.ts';
import type { FeedStatus } from './heartbeat.ts';
import type { Ledger, LedgerEntry } from './ledger.ts';
import { type AgentLog, errorMessage } from './log.ts';
import { moveToRejected } from './rejected-files.ts';
import { StableFiles } from './stable-files.ts';
import { describeProblem, uploadFile } from './upload.ts';

/** Test-only: exit at once (like kill -9) after an upload succeeded and before the ledger records it. */
export const CRASH_AFTER_UPLOAD_ENV = 'MELTWIRE_AGENT_CRASH_AFTER_UPLOAD';

export interface AgentOptions {
  dryRun?: boolean;
  /** Lines for a person (--dry-run): what would be sent. */
  print?: (line: string) => void;
  crashAfterUpload?: boolean;
}

const iso = (ms: number) => new Date(ms).toISOString();
const sha256 = (bytes: Buffer) => createHash('sha256').update(bytes).digest('hex');

export class Agent {
  private readonly stable: StableFiles;
  private readonly matches: (name: string) => boolean;
  /** Files whose bytes were checked to be the ones delivered (touched, not changed): no re-hash. */
  private readonly verified = new Map<string, string>();
  private readonly gate: RetryGate;
  private queueLength = 0;
  /** The last error; `lasting` ones (a refused file) outlive later deliveries, since a person must act. */
  private lastError: (NonNullable<FeedStatus['lastError']> & { lasting: boolean }) | null = null;

  constructor(
    private readonly config: AgentConfig,
    private readonly ledger: Ledger,
    private readonly log: AgentLog,
    private readonly options: AgentOptions = {},
  ) {
    this.stable = new StableFiles(config.stable_seconds * 1000);
    this.gate = new RetryGate({ baseMs: config.retry_base_seconds * 1000, capMs: config.retry_max_seconds * 1000 });
    this.matches = fileMatcher(config.patterns);
  }

  status(): FeedStatus {
    const last = this.ledger.lastDelivery();
    return {
      queueLength: this.queueLength,
      lastSuccessAt: last?.time ?? null,
      lastFile: last ? { name: last.path.split(/[\\/]/).pop()!, at: last.time } : null,
      lastError: this.lastError && { message: this.lastError.message, at: this.lastError.at },
    };
  }

  /** Milliseconds until files still being written could be stable (for --once). */
  msUntilSettled(): number {
    return this.stable.msUntilSettled();
  }

  /** Recorded with this size and mtime: delivered, or refused and left in place (rejected/ not writable). */
  private isDone(file: FoundFile): boolean {
    const entry = this.ledger.forPath(file.path);
    if (!entry) return false;
    return (
      (entry.size === file.size && entry.mtime === iso(file.mtimeMs)) || this.verified.get(file.path) === `${file.size}:${file.mtimeMs}`
    );
  }

  private fail(message: string, lasting: boolean): void {
    this.lastError = { message, at: new Date().toISOString(), lasting };
  }

  /** Scans and delivers; answers how many files still wait. */
  async pass(): Promise<number> {
    const scan = await scanFolders(this.config.folders, this.matches);
    for (const failure of scan.failures) {
      this.log.error('folder cannot be read', failure);
      this.fail(`folder ${failure.folder} cannot be read: ${failure.message}`, false);
    }
    const waiting = scan.files.filter((file) => !this.isDone(file));
    this.queueLength = waiting.length;
    for (const file of this.stable.observe(waiting)) {
      if (!this.gate.isOpen()) break;
      const handled = await this.deliver(file);
      if (handled === 'held') break;
      if (handled === 'done') this.queueLength -= 1;
    }
    return this.queueLength;
  }

  private async deliver(file: FoundFile): Promise<'done' | 'changed' | 'held'> {
    let bytes: Buffer;
    try {
      bytes = await readFile(file.path);
    } catch (error) {
      this.log.warn('file cannot be read yet', { path: file.path, error: errorMessage(error) });
      return 'changed';
    }
    if (bytes.length !== file.size) return 'changed'; // still being written: the next scans decide
    const hash = sha256(bytes);
    const base: Omit<LedgerEntry, 'outcome' | 'import_id' | 'time'> = {
      sha256: hash,
      path: file.path,
      size: file.size,
      mtime: iso(file.mtimeMs),
    };
    const previous = this.ledger.forPath(file.path);
    if (previous && previous.outcome !== 'rejected' && previous.sha256 === hash) {
      this.verified.set(file.path, `${file.size}:${file.mtimeMs}`);
      return 'done';
    }
    const earlier = this.ledger.deliveredSha(hash);
    if (earlier) {
      // The same bytes went before under another name (or this name, before a change): the
      // server would answer with that import, so record it without sending.
      this.record({ ...base, outcome: 'duplicate', import_id: earlier.import_id });
      this.log.info('same bytes as a file already delivered: not sent again', {
        path: file.path,
        import_id: earlier.import_id,
        earlier: earlier.path,
      });
      return 'done';
    }
    if (this.options.dryRun) {
      this.options.print?.(
        `would send ${file.path} (${file.size} bytes, sha256 ${hash})${previous && previous.outcome !== 'rejected' ? ' — changed since it was sent' : ''}`,
      );
      return 'done';
    }
    const outcome = await uploadFile(this.config, { name: file.name, bytes, sha256: hash });
    switch (outcome.kind) {
      case 'sent': {
        if (this.options.crashAfterUpload) process.kill(process.pid, 'SIGKILL');
        const changed = previous !== undefined && previous.outcome !== 'rejected';
        this.record({ ...base, outcome: changed ? 'changed-resent' : 'sent', import_id: outcome.importId });
        this.log.info(changed ? 'changed file sent again as a new import' : 'file delivered', {
          path: file.path,
          import_id: outcome.importId,
          status: outcome.status,
          replayed: outcome.replayed,
          sha256: hash,
        });
        this.gate.reset();
        if (!this.lastError?.lasting) this.lastError = null;
        if (this.config.delete_after_success) await this.remove(file.path);
        return 'done';
      }
      case 'rejected': {
        const message = describeProblem(outcome.status, outcome.problem);
        const movedTo = await moveToRejected(file.path, outcome.status, outcome.problem, hash).catch((error: unknown) => {
          // A read-only share: the file stays where it is, and the ledger keeps it from being sent again.
          this.log.error('refused file cannot be moved to rejected/', { path: file.path, error: errorMessage(error) });
          return undefined;
        });
        this.record({
          ...base,
          outcome: 'rejected',
          import_id: null,
          status: outcome.status,
          problem: message.slice(0, 2000),
          moved_to: movedTo,
        });
        this.log.error(movedTo ? 'file refused by the server: moved to rejected/' : 'file refused by the server: left in place', {
          path: file.path,
          moved_to: movedTo,
          status: outcome.status,
          problem: outcome.problem,
        });
        this.fail(`${file.name} refused: ${message}`, true);
        return 'done';
      }
      default: {
        const { delayMs, failures } = this.gate.hold(outcome.retryAfterMs);
        const blocked = outcome.kind === 'blocked';
        this.log[blocked ? 'error' : 'warn'](
          blocked ? 'the server refuses the agent’s settings: files kept, retrying' : 'delivery failed: files kept, retrying',
          { path: file.path, reason: outcome.reason, retry_in_ms: delayMs, failures },
        );
        this.fail(outcome.reason, false);
        return 'held';
      }
    }
  }

  private record(entry: Omit<LedgerEntry, 'time'>): void {
    this.ledger.append({ ...entry, time: new Date().toISOString() });
  }

  private async remove(path: string): Promise<void> {
    try {
      await unlink(path);
      this.log.info('file deleted after delivery (delete_after_success)', { path });
    } catch (error) {
      this.log.warn('file delivered but cannot be deleted', { path, error: errorMessage(error) });
    }
  }
}
