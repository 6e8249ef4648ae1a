// One entry per API route not yet declared in shared/api (see DEVELOPERS.md, "Declaring an API route"): what it does, who may call it, and the zod schema of its JSON body or query
// (the same schema the route validates with). `tests/api/openapi.test.ts` fails when a route is missing here.
import type * as z from 'zod';
import { unitMeasurementSchema } from '@shared/schemas/review';

export interface RouteDoc {
  summary: string;
  /** Who passes the access check: "anyone", "signed in", or the roles. */
  who: string;
  body?: z.ZodType;
  query?: z.ZodType;
  /** A CSV file upload (multipart field `file`, plus `decisions` on commit). */
  upload?: 'preview' | 'commit';
  /** What a successful answer carries. */
  answer: string;
  /** Non-JSON answers. */
  produces?: 'text/csv' | 'application/pdf' | 'application/octet-stream';
}

export const ROUTE_DOCS: Record<string, RouteDoc> = {
  'GET /api/shop/orders': {
    summary: 'Build orders (?status=open|complete|all)',
    who: 'winder, reviewer, engineer, admin',
    answer: '{ orders }',
  },
  'GET /api/shop/orders/:id': {
    summary: 'One build order with its frozen winding sheet and the units recorded',
    who: 'winder, reviewer, engineer, admin',
    answer: 'BuildOrder',
  },
  'GET /api/shop/orders/:id/sheet.pdf': {
    summary: 'The winding sheet as PDF',
    who: 'winder, reviewer, engineer, admin',
    answer: 'PDF',
    produces: 'application/pdf',
  },
  'POST /api/shop/orders/:id/units': {
    summary: 'Record one built unit: measured L, DCR at a temperature, hipot; pass/fail per check',
    who: 'winder',
    body: unitMeasurementSchema,
    answer: 'the unit (201)',
  },
  'GET /api/shop/prediction-report': {
    summary: 'Measured against predicted L and DCR by material and core',
    who: 'engineer, reviewer, admin',
    answer: '{ units, byMaterial, byCore }',
  },
};
