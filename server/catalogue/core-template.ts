import type { CoreCsvColumn } from '@shared/schemas/core-csv';

const ILLUSTRATIVE = 'Invented example, illustrative only';

/**
 * The downloadable core template: one ring from its dimensions and one E-type set from effective parameters.
 * Both are invented, illustrative only, no maker's part. The ring's 20/10/7 mm is a round size whose IEC 60205
 * values are computed from the standard's ring formulas (le 43.55 mm, Ae 33.63 mm²); the E set's numbers are plausible orders of magnitude chosen
 * to pass the consistency checks (Ve = Ae·le, bobbin inside the window; common practice, no source).
 */
export const CORE_TEMPLATE_ROWS: Record<CoreCsvColumn, string>[] = [
  {
    name: 'Example ring 20/10/7 (illustrative)',
    kind: 'ring',
    family: 'RING',
    od_mm: '20',
    id_mm: '10',
    height_mm: '7',
    ae_mm2: '',
    amin_mm2: '',
    le_mm: '',
    ve_mm3: '',
    window_mm2: '',
    window_height_mm: '',
    bobbin_width_mm: '',
    bobbin_height_mm: '',
    mlt_mm: '',
    surface_mm2: '',
    source: ILLUSTRATIVE,
  },
  {
    name: 'Example E-core EX-1 (illustrative)',
    kind: 'shape',
    family: 'E',
    od_mm: '',
    id_mm: '',
    height_mm: '',
    ae_mm2: '80',
    amin_mm2: '75',
    le_mm: '70',
    ve_mm3: '5600',
    window_mm2: '120',
    window_height_mm: '20',
    bobbin_width_mm: '18',
    bobbin_height_mm: '5',
    mlt_mm: '55',
    surface_mm2: '2800',
    source: ILLUSTRATIVE,
  },
];
