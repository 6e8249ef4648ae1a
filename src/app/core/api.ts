import { HttpClient, type HttpContext, type HttpResourceRef, httpResource } from '@angular/common/http';
import { Injectable, inject } from '@angular/core';
import { type AnswerOf, type CallInput, type Endpoint, endpointUrl } from '@shared/api/endpoint';
import { map, type Observable } from 'rxjs';

type QueryValue = string | number | boolean | readonly (string | number | boolean)[];

/** Query values as Angular sends them; undefined ones are left out. */
function queryParams(query: unknown): Record<string, QueryValue> | undefined {
  if (query === undefined || query === null) return undefined;
  return Object.fromEntries(
    Object.entries(query as Record<string, QueryValue | undefined>).filter(
      (entry): entry is [string, QueryValue] => entry[1] !== undefined,
    ),
  );
}

function request(endpoint: Endpoint, input: { params?: unknown; query?: unknown; body?: unknown }) {
  return {
    url: endpointUrl(endpoint, input.params as Record<string, unknown> | undefined),
    method: endpoint.method,
    params: queryParams(input.query),
    body: input.body,
  };
}

/** Calls to declared endpoints (shared/api): typed inputs, and the answer parsed with the endpoint's answer schema. */
@Injectable({ providedIn: 'root' })
export class Api {
  private readonly http = inject(HttpClient);

  call<E extends Endpoint>(endpoint: E, input: CallInput<E>, options: { context?: HttpContext } = {}): Observable<AnswerOf<E>> {
    const { url, method, params, body } = request(endpoint, input);
    // A 204 has no body (HttpClient gives null); its declared answer is z.void().
    return this.http
      .request(method, url, { params, body, context: options.context })
      .pipe(map((answer) => endpoint.answer.parse(endpoint.status === 204 ? undefined : answer) as AnswerOf<E>));
  }
}

/**
 * An `httpResource` of a declared endpoint whose `parse` is the answer schema; `input` returning undefined
 * sends nothing. Call it in an injection context (a field initialiser).
 */
export function endpointResource<E extends Endpoint>(
  endpoint: E,
  input: () => CallInput<E> | undefined,
): HttpResourceRef<AnswerOf<E> | undefined>;
export function endpointResource<E extends Endpoint, T>(
  endpoint: E,
  input: () => CallInput<E> | undefined,
  options: { select: (answer: AnswerOf<E>) => T; defaultValue: NoInfer<T> },
): HttpResourceRef<T>;
export function endpointResource<E extends Endpoint, T>(
  endpoint: E,
  input: () => CallInput<E> | undefined,
  options?: { select: (answer: AnswerOf<E>) => T; defaultValue: T },
) {
  const select = options?.select ?? ((answer: AnswerOf<E>) => answer as unknown as T);
  return httpResource(
    () => {
      const value = input();
      return value === undefined ? undefined : request(endpoint, value);
    },
    { parse: (answer) => select(endpoint.answer.parse(answer) as AnswerOf<E>), defaultValue: options?.defaultValue },
  );
}
