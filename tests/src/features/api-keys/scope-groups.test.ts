import { describe, expect, it } from 'vitest';
import { groupScopes } from '../../../../src/features/api-keys/scope-groups.ts';

describe('groupScopes', () => {
  it('groups scopes by resource in the order given, with a label for each resource', () => {
    expect(groupScopes(['samples:read', 'samples:write', 'request-log:read', 'samples:release'])).toEqual([
      { resource: 'samples', label: 'Samples and results', scopes: ['samples:read', 'samples:write', 'samples:release'] },
      { resource: 'request-log', label: 'Request log', scopes: ['request-log:read'] },
    ]);
  });
});
