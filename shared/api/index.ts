// Every declared endpoint. The OpenAPI document and the access-matrix test read this list; a feature's
// router mounts its own declarations (server/http/endpoint.ts). Add a feature's module here when converting it.
import * as audit from './audit';
import * as catalogue from './catalogue';
import * as designs from './designs';
import type { Endpoint } from './endpoint';
import * as exportsApi from './exports';
import * as health from './health';
import * as inbox from './inbox';
import * as review from './review';

export const ENDPOINTS: readonly Endpoint[] = [health, audit, catalogue, inbox, designs, exportsApi, review].flatMap((feature) => Object.values(feature));
