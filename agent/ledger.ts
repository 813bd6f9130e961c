// The ledger: one JSON line per file handled, appended (and synced) after each outcome, read back
// at start. It is how the agent knows, across restarts, which files it already delivered.
import { closeSync, existsSync, fsyncSync, mkdirSync, openSync, readFileSync, writeSync } from 'node:fs';
import { dirname } from 'node:path';

export const OUTCOMES = ['sent', 'changed-resent', 'duplicate', 'rejected'] as const;
export type Outcome = (typeof OUTCOMES)[number];

export interface LedgerEntry {
  sha256: string;
  path: string;
  size: number;
  mtime: string;
  outcome: Outcome;
  /** The import the server created or matched (none for a rejected file). */
  import_id: string | null;
  /** For `rejected`: HTTP status and the problem's title; where the file went. */
  status?: number;
  problem?: string;
  moved_to?: string;
  time: string;
}

export class Ledger {
  private readonly byPath = new Map<string, LedgerEntry>();
  private readonly delivered = new Map<string, LedgerEntry>();
  private last: LedgerEntry | undefined;

  private constructor(private readonly file: string) {}

  /** Reads the ledger; a torn last line (power lost mid-write) is skipped, the rest kept. */
  static open(file: string): Ledger {
    const ledger = new Ledger(file);
    mkdirSync(dirname(file), { recursive: true });
    if (!existsSync(file)) return ledger;
    for (const line of readFileSync(file, 'utf8').split('\n')) {
      if (!line.trim()) continue;
      try {
        ledger.remember(JSON.parse(line) as LedgerEntry);
      } catch {
        // an incomplete line: its file was not recorded, so it is delivered (harmlessly) again
      }
    }
    return ledger;
  }

  private remember(entry: LedgerEntry): void {
    this.byPath.set(entry.path, entry);
    if (entry.outcome !== 'rejected') this.delivered.set(entry.sha256, entry);
    if (entry.outcome === 'sent' || entry.outcome === 'changed-resent') this.last = entry;
  }

  append(entry: LedgerEntry): void {
    const fd = openSync(this.file, 'a');
    try {
      writeSync(fd, `${JSON.stringify(entry)}\n`);
      fsyncSync(fd);
    } finally {
      closeSync(fd);
    }
    this.remember(entry);
  }

  /** The last outcome recorded for a path. */
  forPath(path: string): LedgerEntry | undefined {
    return this.byPath.get(path);
  }

  /** A delivery of exactly these bytes (under any name). */
  deliveredSha(sha256: string): LedgerEntry | undefined {
    return this.delivered.get(sha256);
  }

  /** The last file actually uploaded (a duplicate was not). */
  lastDelivery(): LedgerEntry | undefined {
    return this.last;
  }
}
