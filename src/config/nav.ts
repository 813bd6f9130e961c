import type { Scope } from '../api/me.ts';
import { paths } from './paths.ts';

/** Sections of the navigation: the lab's daily work first, then integration and administration. */
export const NAV_GROUPS = ['Lab', 'Integration', 'Administration'] as const;
export type NavGroup = (typeof NAV_GROUPS)[number];

export interface NavItem {
  to: string;
  label: string;
  group: NavGroup;
  /** Shown only to callers holding this scope — the same scope the page itself requires; absent = everyone signed in. */
  scope?: Scope;
  /** Active only on exactly this path (not below it). */
  end?: boolean;
}

export const NAV_ITEMS: NavItem[] = [
  { to: paths.home, label: 'Overview', group: 'Lab', end: true },
  { to: paths.samples, label: 'Samples', group: 'Lab', scope: 'samples:read' },
  { to: paths.imports, label: 'Imports', group: 'Lab', scope: 'samples:read', end: true }, // not lit on /imports/new, which has its own entry
  { to: paths.upload, label: 'Upload results', group: 'Lab', scope: 'imports:write' },
  { to: paths.drift, label: 'Drift', group: 'Lab', scope: 'standardizations:read' },
  { to: paths.controlSamples, label: 'Control charts', group: 'Lab', scope: 'control:read' },
  { to: paths.grades, label: 'Grades', group: 'Lab', scope: 'grades:read' },
  { to: paths.quickStart, label: 'Quick start', group: 'Integration' },
  { to: paths.webhooks, label: 'Webhooks', group: 'Integration', scope: 'webhooks:read' },
  { to: paths.events, label: 'Events feed', group: 'Integration', scope: 'events:read' },
  { to: paths.apiKeys, label: 'API keys', group: 'Integration', scope: 'api-keys:read' },
  { to: paths.reference, label: 'API reference', group: 'Integration' },
  { to: paths.requestLog, label: 'Request log', group: 'Integration', scope: 'request-log:read' },
  { to: paths.users, label: 'Users', group: 'Administration', scope: 'users:read' },
  { to: paths.audit, label: 'Audit trail', group: 'Administration', scope: 'audit:read' },
  { to: paths.outbox, label: 'Outbox', group: 'Administration', scope: 'users:write' },
];

/** The entries a caller may open, in their sections; sections left empty are dropped. */
export function navSections(holds: (scope: Scope) => boolean): { group: NavGroup; items: NavItem[] }[] {
  return NAV_GROUPS.map((group) => ({
    group,
    items: NAV_ITEMS.filter((item) => item.group === group && (!item.scope || holds(item.scope))),
  })).filter((section) => section.items.length > 0);
}
