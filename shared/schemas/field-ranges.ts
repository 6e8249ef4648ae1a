// The allowed range of each number field, read from the schemas that validate requests, so a form can say at the
// field (in the field's own units) what the server would refuse, without restating the limits.
import * as z from 'zod';
import { converterSpecSchema, designLimitsSchema } from './calc';

export interface FieldRange {
  min?: number;
  max?: number;
}

function rangeOf(schema: z.ZodType): FieldRange | undefined {
  const inner = schema instanceof z.ZodOptional || schema instanceof z.ZodDefault ? (schema.unwrap() as z.ZodType) : schema;
  if (!(inner instanceof z.ZodNumber)) return undefined;
  const range: FieldRange = {};
  if (inner.minValue !== null && Number.isFinite(inner.minValue)) range.min = inner.minValue;
  if (inner.maxValue !== null && Number.isFinite(inner.maxValue)) range.max = inner.maxValue;
  return range;
}

function rangesOf(shape: Record<string, z.ZodType>): Record<string, FieldRange> {
  const ranges: Record<string, FieldRange> = {};
  for (const [key, schema] of Object.entries(shape)) {
    const range = rangeOf(schema);
    if (range) ranges[key] = range;
  }
  return ranges;
}

/** Converter spec and design limits fields by name: { min, max } in SI. */
export const SPEC_FIELD_RANGES: Readonly<Partial<Record<string, FieldRange>>> = {
  ...rangesOf(converterSpecSchema.shape as Record<string, z.ZodType>),
  ...rangesOf(designLimitsSchema.shape as Record<string, z.ZodType>),
};
