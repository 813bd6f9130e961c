import type { Scope } from '../api/me.ts';
import { paths } from './paths.ts';

export interface NavItem {
  to: string;
  label: string;
  /** Shown only to callers holding this scope; absent = everyone signed in. */
  scope?: Scope;
  /** Active only on exactly this path (not below it). */
  end?: boolean;
}

export const NAV_ITEMS: NavItem[] = [
  { to: paths.home, label: 'Overview', end: true },
  { to: paths.samples, label: 'Samples', scope: 'samples:read' },
  { to: paths.imports, label: 'Imports', scope: 'samples:read', end: true }, // not lit on /imports/new, which has its own entry
  { to: paths.upload, label: 'Upload results', scope: 'imports:write' },
  { to: paths.drift, label: 'Drift', scope: 'standardizations:read' },
  { to: paths.controlSamples, label: 'Control charts', scope: 'control:read' },
  { to: paths.grades, label: 'Grades', scope: 'grades:read' },
  { to: paths.quickStart, label: 'Quick start' },
  { to: paths.webhooks, label: 'Webhooks', scope: 'webhooks:read' },
  { to: paths.events, label: 'Events feed', scope: 'events:read' },
  { to: paths.apiKeys, label: 'API keys', scope: 'api-keys:read' },
  { to: paths.reference, label: 'API reference' },
  { to: paths.requestLog, label: 'Request log', scope: 'request-log:read' },
  { to: paths.users, label: 'Users', scope: 'users:read' },
  { to: paths.audit, label: 'Audit trail', scope: 'audit:read' },
  { to: paths.outbox, label: 'Outbox', scope: 'users:write' },
];
