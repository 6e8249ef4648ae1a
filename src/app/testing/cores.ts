import { IEC60205_SOURCE_NOTE } from '@shared/catalogue/core-schema';
import type { ListedCore } from '@shared/schemas/cores';

/**
 * An invented user ring as the catalogue lists it to an engineer (SI units; 20/10/7 mm as in the IEC 60205
 * example), version 2, which the engineer may edit but not retire. No maker's part.
 */
export function listedUserRing(overrides: Partial<ListedCore> = {}): ListedCore {
  return {
    id: 'Lab ring 20/10/7',
    family: 'RING',
    gapKind: 'distributed',
    ae: 33.63e-6,
    le: 43.55e-3,
    ve: 1465e-9,
    windowArea: 78.5e-6,
    windowHeight: 7e-3,
    bobbinWidth: 31.4e-3,
    bobbinHeight: 5e-3,
    mlt: 30e-3,
    surfaceArea: 1e-3,
    areaProduct: 2.64e-9,
    ring: { od: 0.02, id: 0.01, height: 0.007 },
    source: `${IEC60205_SOURCE_NOTE}; our drawing`,
    origin: 'user',
    userCoreId: 7,
    version: 2,
    retired: false,
    createdBy: 'Erin Calder',
    createdAt: '2026-03-01T10:00:00.000Z',
    canEdit: true,
    canRetire: false,
    canRestore: false,
    ...overrides,
  };
}
