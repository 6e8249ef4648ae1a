// One entry per API route not yet declared in shared/api (see DEVELOPERS.md, "Declaring an API route"): what it does, who may call it, and the zod schema of its JSON body or query
// (the same schema the route validates with). `tests/api/openapi.test.ts` fails when a route is missing here.
import type * as z from 'zod';
import { changePasswordRequestSchema, createUserRequestSchema, preferencesRequestSchema, signInRequestSchema, updateUserRequestSchema } from '@shared/schemas/auth';
import {
  copyDesignRequestSchema,
  createDesignRequestSchema,
  designFileSchema,
  designListQuerySchema,
  newRevisionRequestSchema,
  revisionDiffQuerySchema,
  updateRevisionRequestSchema,
} from '@shared/schemas/designs';
import { materialEditSchema, materialExportQuerySchema } from '@shared/schemas/materials';
import { releaseRequestSchema, returnRequestSchema, shopSettingsSchema, transitionRequestSchema, unitMeasurementSchema } from '@shared/schemas/review';

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

const SIGNED_IN = 'signed in';
const DESIGNERS = 'engineer, reviewer';
const UPLOADERS = 'engineer, reviewer, admin';
const CURATORS = 'reviewer, admin';

export const ROUTE_DOCS: Record<string, RouteDoc> = {
  'GET /api/auth/session': { summary: 'The signed-in user (or null); sets the XSRF-TOKEN cookie', who: 'anyone', answer: '{ user }' },
  'POST /api/auth/sign-in': { summary: 'Sign in with username and password; a new session id; rate-limited', who: 'anyone', body: signInRequestSchema, answer: '{ user }' },
  'POST /api/auth/sign-out': { summary: 'End the session', who: 'anyone', answer: '204' },
  'PATCH /api/account/preferences': { summary: 'Light or dark theme', who: SIGNED_IN, body: preferencesRequestSchema, answer: '{ user }' },
  'POST /api/account/password': { summary: 'Change one’s own password (the current one is required)', who: SIGNED_IN, body: changePasswordRequestSchema, answer: '204' },

  'GET /api/admin/users': { summary: 'Every account', who: 'admin', answer: '{ users }' },
  'POST /api/admin/users': { summary: 'Create an account', who: 'admin', body: createUserRequestSchema, answer: '{ user } (201)' },
  'PATCH /api/admin/users/:id': { summary: 'Change the display name or the role, or disable or enable the account (disabling or a new role ends the user’s sessions); at least one of displayName, role, disabled', who: 'admin', body: updateUserRequestSchema, answer: '{ user }' },
  'GET /api/admin/outbox': { summary: 'Mail sent to the winding shop and its delivery state', who: 'admin', answer: '{ messages, deliveries }' },
  'GET /api/admin/outbox/:id/attachments/:index': { summary: 'One attachment of a sent mail (the winding sheet PDF)', who: 'admin', answer: 'the file', produces: 'application/octet-stream' },
  'GET /api/admin/settings': { summary: 'The winding shop’s e-mail address', who: 'admin', answer: '{ shopEmail }' },
  'PUT /api/admin/settings': { summary: 'Set the winding shop’s e-mail address', who: 'admin', body: shopSettingsSchema, answer: '{ shopEmail }' },


  'GET /api/designs': { summary: 'Designs, searched, sorted and paged', who: SIGNED_IN, query: designListQuerySchema, answer: '{ items, total, page, pageSize }' },
  'GET /api/designs/:id': { summary: 'A design with its revisions and the latest revision in full', who: SIGNED_IN, answer: 'DesignDetail' },
  'GET /api/designs/:id/diff': { summary: 'Differences between two revisions (spec, construction, results)', who: SIGNED_IN, query: revisionDiffQuerySchema, answer: '{ from, to, spec, construction, result }' },
  'GET /api/designs/:id/revisions/:rev': { summary: 'One revision in full', who: SIGNED_IN, answer: 'RevisionDetail' },
  'GET /api/designs/:id/revisions/:rev/exports/:kind': {
    summary: 'design.json (re-importable), candidates.csv, bom.csv or spice.lib of a saved revision',
    who: SIGNED_IN,
    answer: 'the file',
    produces: 'application/octet-stream',
  },
  'POST /api/designs': { summary: 'A new design (revision 1, draft) owned by the caller; the construction is evaluated', who: DESIGNERS, body: createDesignRequestSchema, answer: 'DesignDetail (201)' },
  'POST /api/designs/import': { summary: 'A new design from an exported design file (results recomputed, never trusted)', who: DESIGNERS, body: designFileSchema, answer: 'DesignDetail (201)' },
  'POST /api/designs/:id/copy': { summary: 'A copy owned by the caller', who: DESIGNERS, body: copyDesignRequestSchema, answer: 'DesignDetail (201)' },
  'POST /api/designs/:id/revisions': { summary: 'A new draft revision from the latest or a given one (owner only)', who: DESIGNERS, body: newRevisionRequestSchema, answer: 'RevisionDetail (201)' },
  'PATCH /api/designs/:id/revisions/:rev': { summary: 'Change a draft revision (owner only); the construction is evaluated again', who: DESIGNERS, body: updateRevisionRequestSchema, answer: 'RevisionDetail' },

  'GET /api/revisions/:id/timeline': { summary: 'Review steps of the design’s revisions with who, when and comments', who: SIGNED_IN, answer: '{ designId, entries }' },
  'POST /api/revisions/:id/submit': { summary: 'Submit a draft for review (owner only)', who: DESIGNERS, body: transitionRequestSchema, answer: '{ revisionId, status }' },
  'POST /api/revisions/:id/approve': { summary: 'Approve a revision in review (never the author)', who: 'reviewer', body: transitionRequestSchema, answer: '{ revisionId, status }' },
  'POST /api/revisions/:id/return': { summary: 'Return a revision to its author with a comment', who: 'reviewer', body: returnRequestSchema, answer: '{ revisionId, status }' },
  'POST /api/revisions/:id/release': {
    summary: 'Release an approved revision: freezes it, writes the winding sheet and build order, mails the shop',
    who: 'reviewer',
    body: releaseRequestSchema,
    answer: '{ revisionId, status, orderId, orderNumber, superseded }',
  },

  'GET /api/shop/orders': { summary: 'Build orders (?status=open|complete|all)', who: 'winder, reviewer, engineer, admin', answer: '{ orders }' },
  'GET /api/shop/orders/:id': { summary: 'One build order with its frozen winding sheet and the units recorded', who: 'winder, reviewer, engineer, admin', answer: 'BuildOrder' },
  'GET /api/shop/orders/:id/sheet.pdf': { summary: 'The winding sheet as PDF', who: 'winder, reviewer, engineer, admin', answer: 'PDF', produces: 'application/pdf' },
  'POST /api/shop/orders/:id/units': { summary: 'Record one built unit: measured L, DCR at a temperature, hipot; pass/fail per check', who: 'winder', body: unitMeasurementSchema, answer: 'the unit (201)' },
  'GET /api/shop/prediction-report': { summary: 'Measured against predicted L and DCR by material and core', who: 'engineer, reviewer, admin', answer: '{ units, byMaterial, byCore }' },
};
