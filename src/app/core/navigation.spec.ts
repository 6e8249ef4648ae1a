import { describe, expect, it } from 'vitest';

import { NAVIGATION, navigationFor } from './navigation';

const labelsFor = (role: Parameters<typeof navigationFor>[0]) => navigationFor(role).map((item) => item.label);

describe('navigationFor', () => {
  it('gives an engineer Home but not Users or Audit log', () => {
    expect(labelsFor('engineer')).toEqual(['Home', 'Designs', 'Materials', 'Cores', 'Compare', 'Winding shop']);
  });

  it('gives an admin Home, Users and Audit log', () => {
    expect(labelsFor('admin')).toEqual([
      'Home',
      'Designs',
      'Materials',
      'Cores',
      'Compare',
      'Winding shop',
      'Users',
      'Audit log',
      'Outbox',
      'Settings',
    ]);
  });

  it('gives reviewers the review page and winders only the winding shop', () => {
    expect(labelsFor('reviewer')).toEqual(['Home', 'Designs', 'Materials', 'Cores', 'Compare', 'Review', 'Winding shop']);
    expect(labelsFor('winder')).toEqual(['Home', 'Winding shop']);
  });

  it('gives a signed-out visitor nothing', () => {
    expect(navigationFor(null)).toEqual([]);
  });

  it('keeps an item only for the roles its permission lets in', () => {
    const items = [...NAVIGATION, { label: 'Shop queue', icon: 'build', path: '/shop', permission: 'build' as const }];

    expect(navigationFor('winder', items).map((item) => item.label)).toEqual(['Home', 'Winding shop', 'Shop queue']);
    expect(navigationFor('engineer', items).map((item) => item.label)).toEqual(labelsFor('engineer'));
  });
});
