// API key secrets: "mw_live_" + 32 random base62 characters + a 6-character CRC32 checksum,
// so secret scanners can recognise a key and reject look-alikes without asking the server.
import { randomBytes } from 'node:crypto';
import { crc32 } from 'node:zlib';

export const KEY_PREFIX = 'mw_live_';
const ALPHABET = '0123456789ABCDEFGHIJKLMNOPQRSTUVWXYZabcdefghijklmnopqrstuvwxyz';
const BODY_LENGTH = 32;
const CHECKSUM_LENGTH = 6;
const KEY_PATTERN = new RegExp(`^${KEY_PREFIX}[0-9A-Za-z]{${BODY_LENGTH + CHECKSUM_LENGTH}}$`);

function base62(value: number, width: number): string {
  let out = '';
  let rest = value;
  for (let i = 0; i < width; i++) {
    out = ALPHABET[rest % 62] + out;
    rest = Math.floor(rest / 62);
  }
  return out;
}

function randomBase62(length: number): string {
  // Rejection sampling keeps every character uniformly likely.
  let out = '';
  while (out.length < length) {
    for (const byte of randomBytes(length * 2)) {
      if (byte < 248 && out.length < length) out += ALPHABET[byte % 62];
    }
  }
  return out;
}

function checksum(body: string): string {
  return base62(crc32(body), CHECKSUM_LENGTH);
}

export function generateKeySecret(): string {
  const body = randomBase62(BODY_LENGTH);
  return `${KEY_PREFIX}${body}${checksum(body)}`;
}

/** True when the text has the shape of a Meltwire key and its checksum matches. */
export function isWellFormedKey(secret: string): boolean {
  if (!KEY_PATTERN.test(secret)) return false;
  const body = secret.slice(KEY_PREFIX.length, KEY_PREFIX.length + BODY_LENGTH);
  return secret.endsWith(checksum(body));
}

/** What lists show: enough to tell keys apart, useless to an attacker. */
export function displayPrefix(secret: string): string {
  return secret.slice(0, KEY_PREFIX.length + 6);
}
