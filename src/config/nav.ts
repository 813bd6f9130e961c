import type { Scope } from '../features/auth/api/me.ts';

export interface NavItem {
  to: string;
  label: string;
  /** Shown only to callers holding this scope; absent = everyone signed in. */
  scope?: Scope;
  /** Active only on exactly this path (not below it). */
  end?: boolean;
}

export const NAV_ITEMS: NavItem[] = [
  { to: '/', label: 'Overview', end: true },
  { to: '/samples', label: 'Samples', scope: 'samples:read' },
  { to: '/imports', label: 'Imports', scope: 'samples:read', end: true }, // not lit on /imports/new, which has its own entry
  { to: '/imports/new', label: 'Upload results', scope: 'imports:write' },
  { to: '/drift', label: 'Drift', scope: 'standardizations:read' },
  { to: '/quick-start', label: 'Quick start' },
  { to: '/api-keys', label: 'API keys', scope: 'api-keys:read' },
  { to: '/reference', label: 'API reference' },
  { to: '/request-log', label: 'Request log', scope: 'request-log:read' },
  { to: '/users', label: 'Users', scope: 'users:read' },
  { to: '/audit', label: 'Audit trail', scope: 'audit:read' },
  { to: '/outbox', label: 'Outbox', scope: 'users:write' },
];
