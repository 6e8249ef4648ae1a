import type { DisplayUnit } from '@shared/units/index';

import type { CatalogueCore } from './cores-api';

/** A column of core dimensions: the field (SI), its heading with the unit shown, and the digits shown. */
export interface DimensionColumn {
  field: 'ae' | 'le' | 've' | 'windowArea' | 'areaProduct';
  heading: string;
  unit: DisplayUnit;
  digits: string;
}

/** The dimensions the catalogue and a core's versions both show, in mm, mm², mm³. */
export const DIMENSION_COLUMNS: readonly DimensionColumn[] = [
  { field: 'ae', heading: 'Ae (mm²)', unit: 'mm²', digits: '1.1-1' },
  { field: 'le', heading: 'le (mm)', unit: 'mm', digits: '1.1-1' },
  { field: 've', heading: 'Ve (mm³)', unit: 'mm³', digits: '1.0-0' },
  { field: 'windowArea', heading: 'Window (mm²)', unit: 'mm²', digits: '1.0-0' },
];

/** The catalogue's own: the area product Ap = Ae·Wa in cm⁴. */
export const AREA_PRODUCT_COLUMN: DimensionColumn = { field: 'areaProduct', heading: 'Ap (cm⁴)', unit: 'cm⁴', digits: '1.3-3' };

/** The value of a dimension column for a core (SI units). */
export const dimensionOf = (core: CatalogueCore, column: DimensionColumn): number => core[column.field];
