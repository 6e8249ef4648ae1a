import { Injectable, computed, inject, signal } from '@angular/core';
import { session, signIn, signOut } from '@shared/api/auth';
import type { SignInRequest, User } from '@shared/schemas/auth';
import { firstValueFrom, from, map, switchMap, tap, type Observable } from 'rxjs';

import { Api } from './api';
import { errorsShownByCaller } from './error-display';

/** Who is signed in, as the server last told us. */
@Injectable({ providedIn: 'root' })
export class Session {
  private readonly api = inject(Api);
  private readonly currentUser = signal<User | null>(null);

  readonly user = this.currentUser.asReadonly();
  readonly role = computed(() => this.currentUser()?.role ?? null);
  readonly signedIn = computed(() => this.currentUser() !== null);

  /** Asks the server for the current session; this also gives the browser its XSRF cookie. */
  async restore(): Promise<void> {
    try {
      const { user } = await firstValueFrom(this.api.call(session, {}));
      this.currentUser.set(user);
    } catch {
      // The interceptor has already told the person; the app still starts, signed out.
      this.currentUser.set(null);
    }
  }

  signIn(request: SignInRequest): Observable<User> {
    return this.api.call(signIn, { body: request }, errorsShownByCaller()).pipe(
      map(({ user }) => {
        if (!user) throw new Error('Sign-in did not complete. Please try again.');
        return user;
      }),
      tap((user) => this.currentUser.set(user)),
    );
  }

  /** Ends the session, then fetches a fresh one so the next sign-in has a valid XSRF token. */
  signOut(): Observable<void> {
    return this.api.call(signOut, {}).pipe(
      tap(() => this.currentUser.set(null)),
      switchMap(() => from(this.restore())),
    );
  }

  /** Takes a fresher copy of the signed-in user, e.g. after saving preferences. */
  replaceUser(user: User): void {
    this.currentUser.set(user);
  }

  /** Forgets the user locally when the server says the session has ended. */
  clear(): void {
    this.currentUser.set(null);
  }
}
