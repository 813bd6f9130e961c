// The scopes a key can be given, grouped by the resource they guard (`resource:action`), resources
// in the order below, scopes in the order given. Every scope guards a built operation (tests/api/api-key-roll.test.ts).
import type { Scope } from '../../api/me.ts';

const RESOURCES: Record<string, string> = {
  samples: 'Samples and results',
  imports: 'Result file imports',
  instruments: 'Instruments',
  methods: 'Methods',
  standardizations: 'Standardizations',
  grades: 'Grades',
  control: 'Control charts',
  webhooks: 'Webhooks',
  events: 'Change feed',
  'request-log': 'Request log',
  'api-keys': 'API keys',
  users: 'Users',
  audit: 'Audit trail',
};

export interface ScopeGroup {
  resource: string;
  label: string;
  scopes: Scope[];
}

export function groupScopes(scopes: readonly Scope[]): ScopeGroup[] {
  const groups = new Map<string, ScopeGroup>();
  for (const scope of scopes) {
    const resource = scope.split(':')[0];
    const group = groups.get(resource) ?? { resource, label: RESOURCES[resource] ?? resource, scopes: [] };
    group.scopes.push(scope);
    groups.set(resource, group);
  }
  const order = Object.keys(RESOURCES);
  const rank = (resource: string) => (order.includes(resource) ? order.indexOf(resource) : order.length);
  return [...groups.values()].sort((a, b) => rank(a.resource) - rank(b.resource));
}
