// Validation of the shipped wire tables (values in mm, as the trade quotes them).

import * as z from 'zod';
import { text } from '@shared/schemas/text';

const positiveCell = text()
  .trim()
  .min(1, 'is required')
  .transform(Number)
  .pipe(z.number({ error: 'must be a number' }).finite('must be a finite number').positive('must be positive'));
const sourceCell = text().trim().min(1, 'must say where the numbers come from');

/** One IEC 60317 nominal size with the maximum overall diameters of grades 1 and 2. */
export const metricWireRowSchema = z
  .object({
    nominal_mm: positiveCell,
    grade1_max_mm: positiveCell,
    grade2_max_mm: positiveCell,
    source: sourceCell,
  })
  .superRefine((row, ctx) => {
    if (!(row.grade1_max_mm > row.nominal_mm)) {
      ctx.addIssue({ code: 'custom', path: ['grade1_max_mm'], message: 'must exceed the nominal diameter' });
    }
    if (!(row.grade2_max_mm > row.grade1_max_mm)) {
      ctx.addIssue({ code: 'custom', path: ['grade2_max_mm'], message: 'must exceed the grade 1 diameter' });
    }
  });
export type MetricWireRow = z.infer<typeof metricWireRowSchema>;

/** One litz construction: strand size, strand count and serving thickness per side. */
export const litzRowSchema = z.object({
  strand_nominal_mm: positiveCell,
  strand_count: text()
    .trim()
    .transform(Number)
    .pipe(z.number({ error: 'must be a number' }).int('must be a whole number').min(2, 'must be at least 2')),
  serving_mm: text()
    .trim()
    .transform(Number)
    .pipe(z.number({ error: 'must be a number' }).finite().min(0, 'must not be negative')),
  source: sourceCell,
});
export type LitzRow = z.infer<typeof litzRowSchema>;
