// Every declared endpoint. The OpenAPI document and the access-matrix test read this list; a feature's
// router mounts its own declarations (server/http/endpoint.ts). Add a feature's module here when converting it.
import * as audit from './audit';
import * as calc from './calc';
import * as catalogue from './catalogue';
import * as compare from './compare';
import type { Endpoint } from './endpoint';
import * as health from './health';
import * as inbox from './inbox';
import * as materials from './materials';

export const ENDPOINTS: readonly Endpoint[] = [health, audit, calc, catalogue, compare, inbox, materials].flatMap((feature) => Object.values(feature));
