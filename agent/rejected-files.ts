// A file the server refused (a broken value, too large…) is not retried: it moves to `rejected/`
// beside it, with the server's problem in `<name>.problem.json`, for a person to look at.
import { existsSync } from 'node:fs';
import { mkdir, rename, writeFile } from 'node:fs/promises';
import { basename, dirname, join } from 'node:path';
import type { Problem } from './upload.ts';

export const REJECTED_FOLDER = 'rejected';

/** Moves the file and writes its problem beside it; answers where the file went. */
export async function moveToRejected(path: string, status: number, problem: Problem, sha256: string): Promise<string> {
  const folder = join(dirname(path), REJECTED_FOLDER);
  await mkdir(folder, { recursive: true });
  let target = join(folder, basename(path));
  // An earlier file of the same name was refused too: keep both.
  if (existsSync(target)) target = join(folder, `${new Date().toISOString().replace(/[:.]/g, '-')}-${basename(path)}`);
  await rename(path, target);
  const note = { file: basename(path), sha256, status, refused_at: new Date().toISOString(), problem };
  await writeFile(`${target}.problem.json`, `${JSON.stringify(note, null, 2)}\n`);
  return target;
}
