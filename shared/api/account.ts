import * as z from 'zod';
import { changePasswordRequestSchema, preferencesRequestSchema, userResponseSchema } from '@shared/schemas/auth';
import { defineEndpoint } from './endpoint';

export const setPreferences = defineEndpoint({
  method: 'PATCH',
  path: '/account/preferences',
  access: 'signedIn',
  body: preferencesRequestSchema,
  answer: userResponseSchema,
  summary: 'Light or dark theme',
});

export const changePassword = defineEndpoint({
  method: 'POST',
  path: '/account/password',
  access: 'signedIn',
  body: changePasswordRequestSchema,
  answer: z.void(),
  status: 204,
  summary: 'Change one’s own password (the current one is required); the account’s other sessions end',
});
