// The engine's CoreShape of a user core request (a ring by IEC 60205 from its dimensions, or a gapped set
// from its effective parameters), checked with the shared core schema. Used by POST /cores and the CSV import.
import type * as z from 'zod';
import { coreShapeSchema, IEC60205_SOURCE_NOTE } from '@shared/catalogue/core-schema';
import { ringCoreShape } from '@shared/catalogue/ring-core';
import type { CoreShape } from '@shared/engine/types';
import type { UserCoreRequest } from './cores';

export function userCoreShape(request: UserCoreRequest): CoreShape {
  if (request.kind === 'ring') {
    return ringCoreShape({
      id: request.name,
      family: request.family,
      dimensions: { outerDiameter: request.outerDiameter, innerDiameter: request.innerDiameter, height: request.height },
      source: [IEC60205_SOURCE_NOTE, request.source].filter(Boolean).join('; '),
    });
  }
  return {
    id: request.name,
    family: request.family,
    gapKind: 'air-gap',
    ae: request.ae,
    ...(request.amin !== undefined ? { amin: request.amin } : {}),
    le: request.le,
    ve: request.ve,
    windowArea: request.windowArea,
    windowHeight: request.windowHeight,
    bobbinWidth: request.bobbinWidth,
    bobbinHeight: request.bobbinHeight,
    mlt: request.mlt,
    surfaceArea: request.surfaceArea,
    source: request.source,
  };
}

/** The shape, or the consistency problems of the shared core schema (Ve against Ae·le, Amin, bobbin against window…). */
export function checkedUserCoreShape(request: UserCoreRequest): { shape: CoreShape; error?: z.ZodError } {
  const shape = userCoreShape(request);
  const checked = coreShapeSchema.safeParse(shape);
  return checked.success ? { shape } : { shape, error: checked.error };
}
