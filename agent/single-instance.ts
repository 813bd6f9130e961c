// One agent per ledger: two agents sharing a ledger (a scheduled --once run overlapping the
// service, say) would both send a new file before either records it. A lock file beside the
// ledger holds the running agent's process id; a lock left by a dead process is taken over.
import { mkdirSync, readFileSync, rmSync, writeFileSync } from 'node:fs';
import { dirname } from 'node:path';

function isRunning(pid: number): boolean {
  try {
    process.kill(pid, 0);
    return true;
  } catch (error) {
    // EPERM: it exists but belongs to another user — still running.
    return (error as NodeJS.ErrnoException).code === 'EPERM';
  }
}

/** Takes the lock or answers the process id that holds it. */
export function lockLedger(ledgerFile: string): { release(): void } | { heldBy: number } {
  const lockFile = `${ledgerFile}.lock`;
  mkdirSync(dirname(lockFile), { recursive: true });
  for (let attempt = 0; attempt < 2; attempt++) {
    try {
      writeFileSync(lockFile, String(process.pid), { flag: 'wx' });
      const release = () => rmSync(lockFile, { force: true });
      process.once('exit', release);
      return { release };
    } catch (error) {
      if ((error as NodeJS.ErrnoException).code !== 'EEXIST') throw error;
    }
    const holder = Number(readFileSync(lockFile, 'utf8').trim());
    if (Number.isInteger(holder) && holder > 0 && holder !== process.pid && isRunning(holder)) return { heldBy: holder };
    rmSync(lockFile, { force: true }); // left by an agent that died (kill -9, power cut)
  }
  throw new Error(`cannot take the lock ${lockFile}`);
}
