import { ChangeDetectionStrategy, Component, input } from '@angular/core';

import { apiErrorOf, errorMessageOf } from '../core/api-error';

/** A refused request as shown beside what was sent: the server's message and its problems by field (or CSV column). */
export interface RequestFailure {
  message: string;
  fields: [string, string][];
}

/** The failure of a request from its error (the server's one error shape), at most `limit` fields. */
export function requestFailureOf(error: unknown, limit = 50): RequestFailure {
  return { message: errorMessageOf(error), fields: Object.entries(apiErrorOf(error)?.fields ?? {}).slice(0, limit) };
}

@Component({
  selector: 'gw-request-failure',
  template: `
    <div class="gw-form-error" role="alert">
      <p>{{ failure().message }}</p>
      @if (failure().fields.length) {
        <ul>
          @for (field of failure().fields; track field[0]) {
            <li>
              <strong>{{ field[0] }}</strong>: {{ field[1] }}
            </li>
          }
        </ul>
      }
    </div>
  `,
  styles: `
    ul {
      margin: 4px 0 0;
      padding-left: 20px;
    }
  `,
  changeDetection: ChangeDetectionStrategy.OnPush,
})
export class RequestFailureMessage {
  readonly failure = input.required<RequestFailure>();
}
