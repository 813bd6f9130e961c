import type { Scope } from '../features/auth/api/me.ts';

export interface NavItem {
  to: string;
  label: string;
  /** Shown only to callers holding this scope; absent = everyone signed in. */
  scope?: Scope;
}

export const NAV_ITEMS: NavItem[] = [
  { to: '/', label: 'Overview' },
  { to: '/quick-start', label: 'Quick start' },
  { to: '/drift', label: 'Drift', scope: 'standardizations:read' },
  { to: '/api-keys', label: 'API keys', scope: 'api-keys:read' },
  { to: '/reference', label: 'API reference' },
  { to: '/request-log', label: 'Request log', scope: 'request-log:read' },
  { to: '/users', label: 'Users', scope: 'users:read' },
  { to: '/audit', label: 'Audit trail', scope: 'audit:read' },
  { to: '/outbox', label: 'Outbox', scope: 'users:write' },
];
