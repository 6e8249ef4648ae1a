import { Injectable, inject } from '@angular/core';
import { cancelCheck, listChecks, runCheck } from '@shared/api/checks';
import type { CheckKind, RevisionCheck, RevisionChecks } from '@shared/schemas/checks';
import type { Observable } from 'rxjs';

import { Api } from '../core/api';
import { errorsShownByCaller } from '../core/error-display';

/** A revision's independent checks: queue one, read their state, cancel one. Errors are shown by the panel. */
@Injectable({ providedIn: 'root' })
export class ChecksApi {
  private readonly api = inject(Api);

  list(id: number, rev: number): Observable<RevisionChecks> {
    return this.api.call(listChecks, { params: { id: String(id), rev: String(rev) } }, errorsShownByCaller());
  }

  run(id: number, rev: number, kind: CheckKind): Observable<RevisionCheck> {
    return this.api.call(runCheck, { params: { id: String(id), rev: String(rev) }, body: { kind } }, errorsShownByCaller());
  }

  cancel(id: number, rev: number, checkId: number): Observable<RevisionCheck> {
    return this.api.call(cancelCheck, { params: { id: String(id), rev: String(rev), checkId: String(checkId) } }, errorsShownByCaller());
  }
}
