import { describe, expect, it } from 'vitest';
import { groupScopes } from '../../../../src/features/api-keys/scope-groups.ts';

describe('groupScopes', () => {
  it('groups scopes by resource, resources in a fixed order and scopes as given, with a label for each', () => {
    expect(groupScopes(['request-log:read', 'samples:read', 'samples:write', 'samples:release'])).toEqual([
      { resource: 'samples', label: 'Samples and results', scopes: ['samples:read', 'samples:write', 'samples:release'] },
      { resource: 'request-log', label: 'Request log', scopes: ['request-log:read'] },
    ]);
  });
});
