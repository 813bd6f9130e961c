// `npm start` builds the console when dist/ is missing or older than its sources.
import { existsSync, readdirSync, statSync } from 'node:fs';
import { join, resolve } from 'node:path';

const ROOT = resolve(import.meta.dirname, '..');
const SOURCES = ['src', 'index.html', 'vite.config.ts', 'package.json', 'public'];

function newestMtime(path: string): number {
  if (!existsSync(path)) return 0;
  const stat = statSync(path);
  if (!stat.isDirectory()) return stat.mtimeMs;
  return readdirSync(path).reduce((newest, entry) => Math.max(newest, newestMtime(join(path, entry))), stat.mtimeMs);
}

export function consoleNeedsBuild(distDir: string): boolean {
  const index = join(distDir, 'index.html');
  if (!existsSync(index)) return true;
  const built = statSync(index).mtimeMs;
  return SOURCES.some((source) => newestMtime(join(ROOT, source)) > built);
}

export async function buildConsole(): Promise<void> {
  const { build } = await import('vite');
  await build({ root: ROOT, logLevel: 'warn' });
}
