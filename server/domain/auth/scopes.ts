// Scopes (`resource:action`) and the scopes each role holds. A session gets its role's scopes;
// an API key gets the scopes it was issued with that its owner's role still holds, checked on every call.
export const SCOPES = [
  'samples:read',
  'samples:write',
  'samples:release',
  'imports:write',
  'instruments:write',
  'methods:write',
  'standardizations:read',
  'standardizations:write',
  'standardizations:activate',
  'grades:read',
  'grades:write',
  'control:read',
  'control:write',
  'webhooks:read',
  'webhooks:write',
  'events:read',
  'request-log:read',
  'api-keys:read',
  'api-keys:write',
  'users:read',
  'users:write',
  'audit:read',
] as const;

export type Scope = (typeof SCOPES)[number];

export const ROLES = ['admin', 'manager', 'analyst', 'integrator', 'viewer'] as const;
export type Role = (typeof ROLES)[number];

const VIEWER: Scope[] = ['samples:read', 'standardizations:read', 'grades:read', 'control:read', 'events:read'];

const ANALYST: Scope[] = [...VIEWER, 'samples:write', 'imports:write', 'standardizations:write', 'control:write'];

const MANAGER: Scope[] = [
  ...ANALYST,
  'samples:release',
  // Activating a correction set changes every result measured after it: managers and admins only.
  'standardizations:activate',
  'instruments:write',
  'methods:write',
  'grades:write',
  'webhooks:read',
  'request-log:read',
  'api-keys:read',
  'users:read',
  'audit:read',
];

const INTEGRATOR: Scope[] = [
  ...VIEWER,
  'samples:write',
  'imports:write',
  'webhooks:read',
  'webhooks:write',
  'request-log:read',
  'api-keys:read',
  'api-keys:write',
];

export const ROLE_SCOPES: Record<Role, ReadonlySet<Scope>> = {
  admin: new Set(SCOPES),
  manager: new Set(MANAGER),
  analyst: new Set(ANALYST),
  integrator: new Set(INTEGRATOR),
  viewer: new Set(VIEWER),
};

export const ROLE_DESCRIPTIONS: Record<Role, string> = {
  admin: 'Everything, including users, keys and the audit trail.',
  manager: 'Lab manager: releases results, activates drift corrections, sets up instruments, methods and grades, reviews the audit trail.',
  analyst: 'Imports results, excludes burns, runs standardizations.',
  integrator: 'Plant-system integration: pushes and pulls chemistry, manages webhooks and its keys.',
  viewer: 'Reads results, grades and control charts.',
};

export function isScope(value: string): value is Scope {
  return (SCOPES as readonly string[]).includes(value);
}
