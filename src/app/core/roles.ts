import type { Role } from '@shared/schemas/auth';

export const ROLE_LABELS: Readonly<Record<Role, string>> = {
  engineer: 'Engineer',
  reviewer: 'Reviewer',
  winder: 'Winder',
  admin: 'Administrator',
};

/** What each role does in Gapwright, as the home page tells the signed-in person. */
export const ROLE_DUTIES: Readonly<Record<Role, string>> = {
  engineer:
    'You design inductors: enter a converter spec, search core, material and wire candidates, ' +
    'compare materials, upload the material tables you trust and submit your designs for review.',
  reviewer:
    'You do everything an engineer does, and you check designs others submit: approve them or ' +
    'return them with comments, and release approved designs to the winding shop.',
  winder:
    'You build the released parts: open the build-order queue, print or download winding sheets, ' +
    'and record measured inductance, DCR and hipot results for every unit.',
  admin:
    'You keep the site running: manage user accounts and roles, retire materials and cores that ' +
    'should no longer be used, and read the audit log.',
};
