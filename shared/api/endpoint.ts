// One declaration per API route: method, path, who may call it, the zod schemas of its request parts and of
// its answer, and a summary. Pure: the server mounts it (server/http/endpoint.ts), the OpenAPI document is
// generated from it (server/openapi/openapi.ts), the client calls it (src/app/core/api.ts), and the
// access-matrix test reads it.
import type * as z from 'zod';
import type { Permission } from './permissions';

export type HttpMethod = 'GET' | 'POST' | 'PUT' | 'PATCH' | 'DELETE';

export interface EndpointSpec {
  method: HttpMethod;
  /** Below /api, Express style: `/catalogue/cores/:id`. */
  path: string;
  access: Permission;
  params?: z.ZodType;
  query?: z.ZodType;
  body?: z.ZodType;
  /** The JSON answer on success; `z.void()` for 204 and non-JSON answers (see `produces`). */
  answer: z.ZodType;
  /** Success status; 200 unless given. */
  status?: 200 | 201 | 202 | 204;
  summary: string;
  /** Longer notes for the OpenAPI description (other statuses, ownership rules). */
  description?: string;
  /** A CSV file upload (multipart field `file`, plus `decisions` on commit). */
  upload?: 'preview' | 'commit';
  /** Non-JSON answers. */
  produces?: 'text/csv' | 'application/pdf' | 'application/octet-stream';
}

export type Endpoint = Readonly<EndpointSpec>;

/** Declares an endpoint; the literal types are kept so callers and handlers get typed inputs and answers. */
export function defineEndpoint<const E extends EndpointSpec>(endpoint: E): E {
  return endpoint;
}

type Infer<S> = S extends z.ZodType ? z.output<S> : undefined;
type Input<S> = S extends z.ZodType ? z.input<S> : undefined;

/** What a handler receives: the parsed request parts. */
export interface ParsedInput<E extends Endpoint> {
  params: Infer<E['params']>;
  query: Infer<E['query']>;
  body: Infer<E['body']>;
}

/** What the server sends and the client parses. */
export type AnswerOf<E extends Endpoint> = z.output<E['answer']>;
/** What a handler must produce (before any transform of the answer schema). */
export type AnswerInputOf<E extends Endpoint> = z.input<E['answer']>;

/** What a client sends: each declared part, in its wire form. */
export type CallInput<E extends Endpoint> = (E['params'] extends z.ZodType ? { params: Input<E['params']> } : { params?: undefined }) &
  (E['query'] extends z.ZodType ? { query: Input<E['query']> } : { query?: undefined }) &
  (E['body'] extends z.ZodType ? { body: Input<E['body']> } : { body?: undefined });

/** `/api` + the path with each `:name` replaced by its (URI-encoded) value. */
export function endpointUrl(endpoint: Endpoint, params?: Record<string, unknown>): string {
  const path = endpoint.path.replace(/:(\w+)/g, (_m, name: string) => {
    const value = params?.[name];
    if (value === undefined || value === null)
      throw new Error(`${endpoint.method} ${endpoint.path}: the path parameter "${name}" is missing`);
    return encodeURIComponent(String(value));
  });
  return `/api${path}`;
}

/** "METHOD /api/path" as route lists and the access matrix name routes. */
export const routeKey = (endpoint: Endpoint): string => `${endpoint.method} /api${endpoint.path}`;
