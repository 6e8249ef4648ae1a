import * as z from 'zod';
import {
  buildOrderSchema,
  ordersAnswerSchema,
  ordersQuerySchema,
  predictionReportSchema,
  recordedUnitSchema,
  unitMeasurementSchema,
  voidUnitSchema,
} from '@shared/schemas/shop';
import { defineEndpoint } from './endpoint';
import { idParamsSchema } from './params';

// `:id` is the build order's database id. Orders are written by the release of a revision (shared/api/review.ts).

export const listOrders = defineEndpoint({
  method: 'GET',
  path: '/shop/orders',
  access: 'shop',
  query: ordersQuerySchema,
  answer: ordersAnswerSchema,
  summary: 'Build orders, newest first (?status=open|complete|all; open unless given; ?designId= one design’s orders)',
});

export const getOrder = defineEndpoint({
  method: 'GET',
  path: '/shop/orders/:id',
  access: 'shop',
  params: idParamsSchema,
  answer: buildOrderSchema,
  summary: 'One build order with its frozen winding sheet, the units recorded, and whether you may record one',
});

export const orderSheetPdf = defineEndpoint({
  method: 'GET',
  path: '/shop/orders/:id/sheet.pdf',
  access: 'shop',
  params: idParamsSchema,
  answer: z.void(),
  produces: 'application/pdf',
  summary: 'The winding sheet as PDF (an attachment)',
});

export const recordUnit = defineEndpoint({
  method: 'POST',
  path: '/shop/orders/:id/units',
  access: 'build',
  params: idParamsSchema,
  body: unitMeasurementSchema,
  answer: recordedUnitSchema,
  status: 201,
  summary: 'Record one built unit: measured L, DCR at a temperature, hipot; pass/fail per check',
  description:
    'A complete order answers 409. The order completes when as many units passed as it asks for (voided records left out). ' +
    'unitNumber records a voided unit number again; left out, the next number.',
});

export const voidUnit = defineEndpoint({
  method: 'POST',
  path: '/shop/units/:id/void',
  access: 'voidUnit',
  params: idParamsSchema,
  body: voidUnitSchema,
  answer: recordedUnitSchema,
  summary: 'Void a wrong unit record with a reason (kept and audited, never deleted); its unit number can then be recorded again',
  description:
    'By the unit’s recorder, a reviewer or an admin (403 otherwise). A voided record answers 409. A complete order whose ' +
    'passed units fall below its quantity opens again.',
});

export const predictionReport = defineEndpoint({
  method: 'GET',
  path: '/shop/prediction-report',
  access: 'predictionReport',
  answer: predictionReportSchema,
  summary: 'Measured against predicted L and DCR of every built unit (voided records left out), and the error by material and by core',
});
