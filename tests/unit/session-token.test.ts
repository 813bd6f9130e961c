import { describe, expect, it } from 'vitest';
import { needsRenewal, signSessionToken, verifySessionToken } from '../../server/domain/auth/session-token.ts';

const SECRET = 'k'.repeat(40);

describe('session tokens', () => {
  it('round-trips the session and user ids', () => {
    const claims = verifySessionToken(SECRET, signSessionToken(SECRET, 'ses_1', 'usr_1', 30));
    expect(claims).toMatchObject({ sid: 'ses_1', sub: 'usr_1' });
    expect(claims!.exp - claims!.iat).toBe(1800);
  });

  it('rejects tampered, foreign and expired tokens', () => {
    const token = signSessionToken(SECRET, 'ses_1', 'usr_1', 30);
    const [header, , signature] = token.split('.');
    const forgedPayload = Buffer.from(JSON.stringify({ sid: 'ses_2', sub: 'usr_2', iss: 'meltwire' })).toString('base64url');
    expect(verifySessionToken(SECRET, `${header}.${forgedPayload}.${signature}`)).toBeUndefined();
    expect(verifySessionToken('other'.repeat(10), token)).toBeUndefined();
    expect(verifySessionToken(SECRET, signSessionToken(SECRET, 'ses_1', 'usr_1', -1))).toBeUndefined();
  });

  it('asks for renewal once less than half of the lifetime is left', () => {
    const now = 1_000_000;
    expect(needsRenewal({ sid: 's', sub: 'u', iat: now, exp: now + 1800 }, 30, now)).toBe(false);
    expect(needsRenewal({ sid: 's', sub: 'u', iat: now - 1000, exp: now + 800 }, 30, now)).toBe(true);
  });
});
