import type { RankBy, SearchResult } from '@shared/engine/index';
import type { DesignSpec } from '@shared/schemas/designs';
import { type Observable, catchError, map, of, scan, startWith, switchMap } from 'rxjs';

import { errorMessageOf } from '../core/api-error';

/** One request of the ranked list: the spec and materials searched, the objective, and the page. */
export interface SearchQuery {
  spec: DesignSpec;
  materialIds: string[];
  rankBy: RankBy;
  offset: number;
  limit: number;
}

export interface SearchState {
  status: 'idle' | 'running' | 'done' | 'error';
  /** The last answer, kept on screen while the next page or objective loads. */
  result: SearchResult | null;
  /** The query that answer belongs to: paging repeats it with another offset. */
  resultQuery: SearchQuery | null;
  ms: number;
  message: string;
  /** Searches finished so far (the status line carries it for anyone timing the search). */
  finished: number;
}

export const IDLE_SEARCH: SearchState = { status: 'idle', result: null, resultQuery: null, ms: 0, message: '', finished: 0 };

type SearchEvent =
  { kind: 'start' } | { kind: 'done'; query: SearchQuery; result: SearchResult; ms: number } | { kind: 'error'; message: string };

/** Each query cancels the one still running; the state keeps the last answer until a new one arrives. */
export function searchStates(queries: Observable<SearchQuery>, run: (query: SearchQuery) => Observable<SearchResult>) {
  return queries.pipe(
    switchMap((query): Observable<SearchEvent> => {
      const startedAt = performance.now();
      return run(query).pipe(
        map((result): SearchEvent => ({ kind: 'done', query, result, ms: performance.now() - startedAt })),
        catchError((error: unknown) => of<SearchEvent>({ kind: 'error', message: errorMessageOf(error) })),
        startWith<SearchEvent>({ kind: 'start' }),
      );
    }),
    scan((state: SearchState, event: SearchEvent): SearchState => {
      switch (event.kind) {
        case 'start':
          return { ...state, status: 'running', message: '' };
        case 'done':
          return {
            status: 'done',
            result: event.result,
            resultQuery: event.query,
            ms: event.ms,
            message: '',
            finished: state.finished + 1,
          };
        case 'error':
          return { ...state, status: 'error', message: event.message };
      }
    }, IDLE_SEARCH),
  );
}
