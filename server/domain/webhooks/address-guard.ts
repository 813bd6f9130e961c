// SSRF guard for webhook endpoints: no delivery may reach loopback, private, link-local, CGNAT,
// metadata or other special-purpose addresses (IPv4, IPv6 and IPv4 inside IPv6). Checked when an
// endpoint is saved and again at connect time on the address actually resolved (guardedLookup),
// so a name that later resolves elsewhere (DNS rebinding) is refused too. WEBHOOK_ALLOW_PRIVATE
// lifts it. Ranges: docs/references.md#special-purpose-addresses.
import { lookup as dnsLookup, type LookupAddress, type LookupOptions } from 'node:dns';
import { isIPv4, isIPv6 } from 'node:net';

const V4_BLOCKED: [string, number, string][] = [
  ['0.0.0.0', 8, 'this network'],
  ['10.0.0.0', 8, 'private'],
  ['100.64.0.0', 10, 'shared address space (CGNAT)'],
  ['127.0.0.0', 8, 'loopback'],
  ['169.254.0.0', 16, 'link-local (cloud metadata)'],
  ['172.16.0.0', 12, 'private'],
  ['192.0.0.0', 24, 'IETF protocol assignments'],
  ['192.0.2.0', 24, 'documentation'],
  ['192.88.99.0', 24, '6to4 relay'],
  ['192.168.0.0', 16, 'private'],
  ['198.18.0.0', 15, 'benchmarking'],
  ['198.51.100.0', 24, 'documentation'],
  ['203.0.113.0', 24, 'documentation'],
  ['224.0.0.0', 4, 'multicast'],
  ['240.0.0.0', 4, 'reserved'],
];

// IPv6 ranges that embed an IPv4 address (checked against the IPv4 list) come first.
const V6_EMBEDDING: [string, number, (groups: number[]) => number][] = [
  ['::ffff:0:0', 96, (g) => g[6] * 65536 + g[7]], // IPv4-mapped
  ['64:ff9b::', 96, (g) => g[6] * 65536 + g[7]], // NAT64
  ['2002::', 16, (g) => g[1] * 65536 + g[2]], // 6to4
];

const V6_BLOCKED: [string, number, string][] = [
  ['::', 128, 'unspecified'],
  ['::1', 128, 'loopback'],
  ['::', 96, 'IPv4-compatible (deprecated)'],
  ['64:ff9b:1::', 48, 'local NAT64'],
  ['100::', 64, 'discard-only'],
  ['2001::', 23, 'IETF protocol assignments (Teredo and others)'],
  ['2001:db8::', 32, 'documentation'],
  ['fc00::', 7, 'unique local (private; includes cloud metadata)'],
  ['fe80::', 10, 'link-local'],
  ['fec0::', 10, 'site-local'],
  ['ff00::', 8, 'multicast'],
];

function v4ToNumber(address: string): number {
  return address.split('.').reduce((n, part) => n * 256 + Number(part), 0);
}

function v4Reason(value: number): string | null {
  for (const [base, bits, reason] of V4_BLOCKED) {
    const size = 2 ** (32 - bits);
    if (Math.floor(value / size) === Math.floor(v4ToNumber(base) / size)) return reason;
  }
  return null;
}

/** The eight 16-bit groups of a valid IPv6 address (zone id dropped, dotted IPv4 tail read). */
export function ipv6Groups(address: string): number[] {
  let text = address.replace(/%.*$/, '').toLowerCase();
  const dotted = /(\d+\.\d+\.\d+\.\d+)$/.exec(text);
  if (dotted) {
    const v4 = v4ToNumber(dotted[1]);
    text = `${text.slice(0, -dotted[1].length)}${Math.floor(v4 / 65536).toString(16)}:${(v4 % 65536).toString(16)}`;
  }
  const [head, tail] = text.split('::');
  const parse = (part: string | undefined) => (part ? part.split(':').map((g) => parseInt(g, 16)) : []);
  const front = parse(head);
  const back = parse(tail);
  const fill = tail === undefined ? [] : new Array(8 - front.length - back.length).fill(0);
  return [...front, ...fill, ...back];
}

function toBigInt(groups: number[]): bigint {
  return groups.reduce((n, g) => (n << 16n) | BigInt(g), 0n);
}

function inV6Range(value: bigint, base: string, bits: number): boolean {
  const shift = BigInt(128 - bits);
  return value >> shift === toBigInt(ipv6Groups(base)) >> shift;
}

/** Why an address may not receive webhooks, or null when it may. Not an IP address at all: refused. */
export function blockedReason(address: string): string | null {
  if (isIPv4(address)) return v4Reason(v4ToNumber(address));
  if (!isIPv6(address)) return 'not an IP address';
  const groups = ipv6Groups(address);
  const value = toBigInt(groups);
  for (const [base, bits, reason] of V6_BLOCKED) if (bits === 128 && inV6Range(value, base, bits)) return reason;
  for (const [base, bits, embedded] of V6_EMBEDDING) {
    if (inV6Range(value, base, bits)) {
      const reason = v4Reason(embedded(groups));
      return reason && `${reason}, inside IPv6`;
    }
  }
  for (const [base, bits, reason] of V6_BLOCKED) if (inV6Range(value, base, bits)) return reason;
  return null;
}

export class BlockedAddressError extends Error {
  readonly code = 'EBLOCKEDADDRESS';
  constructor(host: string, address: string, reason: string) {
    super(`${host} resolves to ${address} (${reason}); webhooks may not reach it (WEBHOOK_ALLOW_PRIVATE lifts this)`);
  }
}

/** Every address a name resolves to, each refused if blocked. */
export async function resolveAllowed(host: string): Promise<LookupAddress[]> {
  const addresses = await new Promise<LookupAddress[]>((resolve, reject) =>
    dnsLookup(host, { all: true }, (error, found) => (error ? reject(error) : resolve(found))),
  );
  for (const { address } of addresses) {
    const reason = blockedReason(address);
    if (reason) throw new BlockedAddressError(host, address, reason);
  }
  return addresses;
}

type LookupCallback = (error: NodeJS.ErrnoException | null, address: string | LookupAddress[], family?: number) => void;

/**
 * A `lookup` for node:http(s) that refuses blocked addresses, so the connection goes only to an
 * address that was checked. (A URL holding an IP literal skips lookup: check it before.)
 */
export function guardedLookup(host: string, options: LookupOptions, callback: LookupCallback): void {
  resolveAllowed(host).then(
    (addresses) => {
      const family = options.family === 'IPv4' ? 4 : options.family === 'IPv6' ? 6 : options.family;
      const usable = family ? addresses.filter((a) => a.family === family) : addresses;
      if (options.all) callback(null, usable);
      else if (usable[0]) callback(null, usable[0].address, usable[0].family);
      else callback(Object.assign(new Error(`${host} has no address of family ${options.family}`), { code: 'ENOTFOUND' }), '');
    },
    (error: NodeJS.ErrnoException) => callback(error, ''),
  );
}

/** The URL's host without IPv6 brackets. */
export function hostOf(url: URL): string {
  return url.hostname.replace(/^\[(.*)\]$/, '$1');
}
