import { describe, expect, it } from 'vitest';
import { endpointUrl, routeKey } from '@shared/api/endpoint';
import { ENDPOINTS } from '@shared/api/index';
import { idParamsSchema } from '@shared/api/params';
import { may, PERMISSIONS, rolesFor } from '@shared/api/permissions';
import { ROLES } from '@shared/schemas/auth';

describe('the permission table', () => {
  it('lets anyone through "anyone", every role through "signedIn", and only the named roles otherwise', () => {
    expect(may(null, 'anyone')).toBe(true);
    expect(may(null, 'signedIn')).toBe(false);
    expect(ROLES.every((role) => may(role, 'signedIn'))).toBe(true);
    expect(ROLES.filter((role) => may(role, 'curate'))).toEqual(['reviewer', 'admin']);
    expect(may('winder', 'library')).toBe(false);
    expect(rolesFor('signedIn')).toEqual(ROLES);
    expect(rolesFor('build')).toEqual(PERMISSIONS.build);
  });
});

describe('endpoint declarations', () => {
  it('name each route once', () => {
    const keys = ENDPOINTS.map(routeKey);
    expect(new Set(keys).size).toBe(keys.length);
  });

  it('fill path parameters, encoded, and refuse a missing one', () => {
    const endpoint = { method: 'GET', path: '/designs/:id/revisions/:rev', access: 'signedIn' } as const;
    expect(endpointUrl(endpoint as never, { id: 7, rev: 'a/b' })).toBe('/api/designs/7/revisions/a%2Fb');
    expect(() => endpointUrl(endpoint as never, { id: 7 })).toThrow(/"rev" is missing/);
  });

  it('read ids in paths as digits only, within a database integer', () => {
    expect(idParamsSchema.parse({ id: '42' })).toEqual({ id: 42 });
    for (const id of ['0', '1e3', ' 7', '0x10', '-1', '2147483648']) expect(idParamsSchema.safeParse({ id }).success).toBe(false);
  });
});
