import { describe, expect, it } from 'vitest';
import { blockedReason, ipv6Groups, resolveAllowed } from '../../../server/domain/webhooks/address-guard.ts';

describe('webhook address guard', () => {
  it.each([
    ['127.0.0.1', 'loopback'],
    ['127.255.0.9', 'loopback'],
    ['10.1.2.3', 'private'],
    ['172.16.0.1', 'private'],
    ['172.31.255.255', 'private'],
    ['192.168.1.10', 'private'],
    ['169.254.169.254', 'link-local'],
    ['100.64.0.1', 'CGNAT'],
    ['100.100.100.200', 'CGNAT'],
    ['0.0.0.0', 'this network'],
    ['224.0.0.1', 'multicast'],
    ['255.255.255.255', 'reserved'],
    ['::1', 'loopback'],
    ['::', 'unspecified'],
    ['fe80::1%eth0', 'link-local'],
    ['fd00:ec2::254', 'unique local'],
    ['fc00::1', 'unique local'],
    ['ff02::1', 'multicast'],
    ['::ffff:127.0.0.1', 'loopback, inside IPv6'],
    ['::ffff:7f00:1', 'loopback, inside IPv6'],
    ['::ffff:169.254.169.254', 'link-local'],
    ['::ffff:a00:1', 'private, inside IPv6'],
    ['64:ff9b::10.0.0.1', 'private, inside IPv6'],
    ['2002:c0a8:0101::1', 'private, inside IPv6'],
    ['::127.0.0.1', 'IPv4-compatible'],
    ['2001:db8::1', 'documentation'],
  ])('refuses %s (%s)', (address, reason) => {
    expect(blockedReason(address)).toContain(reason);
  });

  it.each(['93.184.215.14', '8.8.8.8', '172.32.0.1', '100.128.0.1', '2606:4700::1111', '::ffff:8.8.8.8', '2002:808:808::1'])(
    'allows the public address %s',
    (address) => {
      expect(blockedReason(address)).toBeNull();
    },
  );

  it('reads IPv6 text in every spelling', () => {
    expect(ipv6Groups('::')).toEqual([0, 0, 0, 0, 0, 0, 0, 0]);
    expect(ipv6Groups('fe80::1%lo')).toEqual([0xfe80, 0, 0, 0, 0, 0, 0, 1]);
    expect(ipv6Groups('::ffff:1.2.3.4')).toEqual([0, 0, 0, 0, 0, 0xffff, 0x102, 0x304]);
    expect(ipv6Groups('1:2:3:4:5:6:7:8')).toEqual([1, 2, 3, 4, 5, 6, 7, 8]);
  });

  it('refuses a name that resolves to loopback (localhost)', async () => {
    await expect(resolveAllowed('localhost')).rejects.toThrow(/localhost resolves to (127\.0\.0\.1|::1) \(loopback\)/);
  });
});
