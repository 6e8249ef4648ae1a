import { coreListResponseSchema } from '@shared/schemas/cores';
import { defineEndpoint } from './endpoint';

export const listCores = defineEndpoint({
  method: 'GET',
  path: '/catalogue/cores',
  access: 'signedIn',
  answer: coreListResponseSchema,
  summary: 'Shipped cores and current user cores (SI units, Ap, origin, version)',
});
