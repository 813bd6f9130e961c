// The shape of parsed JSON, looked at without recursion: JSON.parse accepts nesting thousands of
// levels deep, and recursive code over such a value (hashing, redaction, JSON.stringify) overflows
// the stack. Each function here walks with an explicit stack, so any depth is safe.
import { isReservedKey } from './reserved-keys.ts';

type Container = Record<string, unknown> | unknown[];

function isContainer(value: unknown): value is Container {
  return typeof value === 'object' && value !== null && !Buffer.isBuffer(value);
}

interface Frame {
  value: unknown;
  depth: number;
  key: string | number;
  parent: Frame | undefined;
}

function pathOf(frame: Frame): (string | number)[] {
  const path: (string | number)[] = [];
  for (let f: Frame | undefined = frame; f?.parent; f = f.parent) path.unshift(f.key);
  return path;
}

export type JsonShapeIssue = { kind: 'too_deep' } | { kind: 'reserved_key'; path: (string | number)[] };

/**
 * The first reason to refuse a parsed body: objects and arrays nested more than `maxDepth`
 * levels (a top-level object is level 1), or a key such as "__proto__" (with its path).
 */
export function checkJsonShape(root: unknown, maxDepth: number): JsonShapeIssue | undefined {
  const stack: Frame[] = [{ value: root, depth: 1, key: '', parent: undefined }];
  while (stack.length > 0) {
    const frame = stack.pop()!;
    const { value, depth } = frame;
    if (!isContainer(value)) continue;
    if (depth > maxDepth) return { kind: 'too_deep' };
    if (Array.isArray(value)) {
      value.forEach((item, index) => stack.push({ value: item, depth: depth + 1, key: index, parent: frame }));
      continue;
    }
    for (const [key, item] of Object.entries(value)) {
      const child = { value: item, depth: depth + 1, key, parent: frame };
      if (isReservedKey(key)) return { kind: 'reserved_key', path: pathOf(child) };
      stack.push(child);
    }
  }
  return undefined;
}

/** Puts `value` on `target` as an own property, even under the name "__proto__". */
function setOwn(target: Container, key: string | number, value: unknown): void {
  if (Array.isArray(target)) target.push(value);
  else Object.defineProperty(target, key, { value, enumerable: true, writable: true, configurable: true });
}

/**
 * A copy of `root` down to `maxDepth` levels; anything deeper is replaced by `placeholder`.
 * `cut` says whether anything was replaced.
 */
export function boundDepth(root: unknown, maxDepth: number, placeholder: unknown): { value: unknown; cut: boolean } {
  let cut = false;
  const pending: [Container, Container, number][] = [];
  const copy = (value: unknown, depth: number): unknown => {
    if (!isContainer(value)) return value;
    if (depth > maxDepth) {
      cut = true;
      return placeholder;
    }
    const target: Container = Array.isArray(value) ? [] : {};
    pending.push([value, target, depth]);
    return target;
  };
  const value = copy(root, 1);
  while (pending.length > 0) {
    const [source, target, depth] = pending.pop()!;
    const entries: [string | number, unknown][] = Array.isArray(source) ? source.map((v, i) => [i, v]) : Object.entries(source);
    for (const [key, item] of entries) setOwn(target, key, copy(item, depth + 1));
  }
  return { value, cut };
}
