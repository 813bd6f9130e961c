// A file is taken only once its size and modification time have stayed the same for
// stable_seconds: a result the instrument software is still writing is never sent half-done.
import type { FoundFile } from './folder-scan.ts';

interface Seen {
  size: number;
  mtimeMs: number;
  since: number;
}

export class StableFiles {
  private readonly seen = new Map<string, Seen>();

  constructor(private readonly stableMs: number) {}

  /** Records this scan; answers the files unchanged for long enough, and forgets vanished ones. */
  observe(files: FoundFile[], now = Date.now()): FoundFile[] {
    const present = new Set(files.map((f) => f.path));
    for (const path of this.seen.keys()) if (!present.has(path)) this.seen.delete(path);
    const stable: FoundFile[] = [];
    for (const file of files) {
      const before = this.seen.get(file.path);
      if (!before || before.size !== file.size || before.mtimeMs !== file.mtimeMs) {
        this.seen.set(file.path, { size: file.size, mtimeMs: file.mtimeMs, since: now });
      } else if (now - before.since >= this.stableMs) {
        stable.push(file);
      }
    }
    return stable;
  }

  /** How long until the least recently changed unstable file could be stable (for --once). */
  msUntilSettled(now = Date.now()): number {
    let wait = 0;
    for (const seen of this.seen.values()) wait = Math.max(wait, seen.since + this.stableMs - now);
    return wait;
  }
}
