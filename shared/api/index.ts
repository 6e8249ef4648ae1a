// Every declared endpoint. The OpenAPI document and the access-matrix test read this list; a feature's
// router mounts its own declarations (server/http/endpoint.ts). Add a feature's module here when converting it.
import * as account from './account';
import * as audit from './audit';
import * as auth from './auth';
import * as calc from './calc';
import * as catalogue from './catalogue';
import * as checks from './checks';
import * as compare from './compare';
import * as designs from './designs';
import type { Endpoint } from './endpoint';
import * as exportsApi from './exports';
import * as health from './health';
import * as inbox from './inbox';
import * as lossPoints from './loss-points';
import * as materials from './materials';
import * as outbox from './outbox';
import * as review from './review';
import * as settings from './settings';
import * as shop from './shop';
import * as users from './users';

export const ENDPOINTS: readonly Endpoint[] = [
  health,
  audit,
  catalogue,
  inbox,
  auth,
  account,
  users,
  outbox,
  settings,
  designs,
  checks,
  exportsApi,
  review,
  shop,
  calc,
  compare,
  materials,
  lossPoints,
].flatMap((feature) => Object.values(feature));
