// Whether an endpoint URL may be saved: http(s) only, https outside development and tests, no
// credentials in it, and (unless WEBHOOK_ALLOW_PRIVATE) every address it resolves to public.
import { isIP } from 'node:net';
import type { Config } from '../../config.ts';
import { UnprocessableProblem } from '../../lib/problems.ts';
import { blockedReason, hostOf, resolveAllowed } from './address-guard.ts';

function refuse(message: string, code: string): never {
  throw new UnprocessableProblem(`The endpoint URL is not allowed: ${message}`, [{ location: 'body.url', message, code }]);
}

export async function assertEndpointUrlAllowed(config: Pick<Config, 'env' | 'webhookAllowPrivate'>, text: string): Promise<void> {
  const url = new URL(text);
  if (url.protocol !== 'https:' && url.protocol !== 'http:') refuse('only http and https URLs can receive webhooks', 'url_scheme');
  const relaxed = config.env !== 'production' || config.webhookAllowPrivate;
  if (url.protocol === 'http:' && !relaxed)
    refuse('https is required (plain http only in development, or with WEBHOOK_ALLOW_PRIVATE)', 'https_required');
  if (url.username || url.password) refuse('put no credentials in the URL; verify the webhook-signature header instead', 'url_credentials');
  if (config.webhookAllowPrivate) return;
  const host = hostOf(url);
  if (isIP(host)) {
    const reason = blockedReason(host);
    if (reason) refuse(`${host} is a ${reason} address`, 'private_address');
    return;
  }
  try {
    await resolveAllowed(host);
  } catch (error) {
    const code = (error as NodeJS.ErrnoException).code;
    if (code === 'EBLOCKEDADDRESS') refuse((error as Error).message, 'private_address');
    refuse(`${host} does not resolve (${code ?? 'lookup failed'})`, 'unresolvable_host');
  }
}
