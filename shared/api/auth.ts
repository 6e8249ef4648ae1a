import * as z from 'zod';
import { sessionResponseSchema, signInRequestSchema } from '@shared/schemas/auth';
import { defineEndpoint } from './endpoint';

export const session = defineEndpoint({
  method: 'GET',
  path: '/auth/session',
  access: 'anyone',
  answer: sessionResponseSchema,
  summary: 'The signed-in user (or null); sets the XSRF-TOKEN cookie',
});

export const signIn = defineEndpoint({
  method: 'POST',
  path: '/auth/sign-in',
  access: 'anyone',
  body: signInRequestSchema,
  answer: sessionResponseSchema,
  summary: 'Sign in with username and password; a new session id; rate-limited',
  description: '401 for a wrong username or password or a disabled account; 429 after too many attempts.',
});

export const signOut = defineEndpoint({
  method: 'POST',
  path: '/auth/sign-out',
  access: 'anyone',
  answer: z.void(),
  status: 204,
  summary: 'End the session',
});
