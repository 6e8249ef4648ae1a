import { HttpEventType, type HttpClient, type HttpEvent } from '@angular/common/http';
import { type AnswerOf, type Endpoint, endpointUrl } from '@shared/api/endpoint';
import { filter, map, type Observable } from 'rxjs';

import { errorsShownByCaller } from './error-display';

/** Upload progress (0–100 while the file travels, null while the server checks it) or the answer. */
export type UploadStep<T> = { kind: 'progress'; percent: number | null } | { kind: 'done'; body: T };

/** The events of an upload (`reportProgress: true, observe: 'events'`) as progress steps and the answer. */
export function uploadSteps<T>(events: Observable<HttpEvent<T>>): Observable<UploadStep<T>> {
  return events.pipe(
    filter((e) => e.type === HttpEventType.UploadProgress || e.type === HttpEventType.Response),
    map((e): UploadStep<T> => {
      if (e.type === HttpEventType.Response) return { kind: 'done', body: e.body as T };
      if (e.type !== HttpEventType.UploadProgress) return { kind: 'progress', percent: null };
      const percent = e.total ? Math.round((100 * e.loaded) / e.total) : null;
      return { kind: 'progress', percent: percent !== null && percent >= 100 ? null : percent };
    }),
  );
}

function csvForm(file: File, decisions?: Record<string, string>): FormData {
  const form = new FormData();
  if (decisions) form.append('decisions', JSON.stringify(decisions));
  form.append('file', file, file.name);
  return form;
}

/**
 * POST one CSV file to a declared upload endpoint in the field "file" (and, for a commit, the per-name decisions
 * as JSON in "decisions"), reporting upload progress; the answer is parsed with the endpoint's answer schema.
 * The caller shows the errors (row and column problems belong beside the file).
 */
export function uploadToEndpoint<E extends Endpoint>(
  http: HttpClient,
  endpoint: E,
  file: File,
  decisions?: Record<string, string>,
): Observable<UploadStep<AnswerOf<E>>> {
  const events = http.request(endpoint.method, endpointUrl(endpoint), {
    body: csvForm(file, decisions),
    ...errorsShownByCaller(),
    reportProgress: true,
    observe: 'events',
  });
  return uploadSteps(events).pipe(
    map((step) => (step.kind === 'done' ? { kind: 'done', body: endpoint.answer.parse(step.body) as AnswerOf<E> } : step)),
  );
}

/** The two calls of a CSV import as the shared import flow takes them: a preview, then the commit with decisions. */
export interface CsvImportCalls<P, R> {
  preview: (file: File) => Observable<UploadStep<P>>;
  commit: (file: File, decisions: Record<string, string>) => Observable<UploadStep<R>>;
}

/** A library's preview and commit upload endpoints as the import flow's two calls. */
export function csvImportCalls<P extends Endpoint, C extends Endpoint>(
  http: HttpClient,
  preview: P,
  commit: C,
): CsvImportCalls<AnswerOf<P>, AnswerOf<C>> {
  return {
    preview: (file) => uploadToEndpoint(http, preview, file),
    commit: (file, decisions) => uploadToEndpoint(http, commit, file, decisions),
  };
}
