// Finding result files: a listing of each watched folder (polling, because network shares do not
// deliver file-system events reliably). Only regular files directly in the folder whose name
// matches a pattern; hidden, temporary and lock files are never taken.
import { readdir, stat } from 'node:fs/promises';
import { join } from 'node:path';
import picomatch from 'picomatch';

export interface FoundFile {
  path: string;
  name: string;
  size: number;
  mtimeMs: number;
}

/** Names spectrometer software and editors use while a file is being written or held open. */
const TEMPORARY = picomatch(['.*', '~*', '*~', '*.tmp', '*.temp', '*.part', '*.partial', '*.swp', '*.lck', '*.lock'], {
  nocase: true,
  dot: true,
});

export function fileMatcher(patterns: string[]): (name: string) => boolean {
  const wanted = picomatch(patterns, { nocase: true });
  return (name) => !TEMPORARY(name) && wanted(name);
}

export interface Scan {
  files: FoundFile[];
  /** Folders that could not be listed (share offline, no permission), with the reason. */
  failures: { folder: string; message: string }[];
}

export async function scanFolders(folders: string[], matches: (name: string) => boolean): Promise<Scan> {
  const scan: Scan = { files: [], failures: [] };
  for (const folder of folders) {
    let entries;
    try {
      entries = await readdir(folder, { withFileTypes: true });
    } catch (error) {
      scan.failures.push({ folder, message: (error as Error).message });
      continue;
    }
    for (const entry of entries) {
      if (!entry.isFile() || !matches(entry.name)) continue;
      const path = join(folder, entry.name);
      try {
        const info = await stat(path);
        scan.files.push({ path, name: entry.name, size: info.size, mtimeMs: info.mtimeMs });
      } catch {
        // Gone between the listing and the stat (moved away by the instrument software): skip it.
      }
    }
  }
  scan.files.sort((a, b) => a.mtimeMs - b.mtimeMs || a.path.localeCompare(b.path));
  return scan;
}
