import { DOCUMENT, Injectable, computed, effect, inject, signal } from '@angular/core';
import { setPreferences } from '@shared/api/account';
import { themeSchema, type Theme } from '@shared/schemas/auth';

import { Api } from './api';
import { Session } from './session';

const STORAGE_KEY = 'gapwright.theme';

/**
 * Light or dark: a stored choice wins over the operating system's, and a signed-in user's
 * saved preference wins over the browser's stored choice.
 */
@Injectable({ providedIn: 'root' })
export class ThemeSwitcher {
  private readonly document = inject(DOCUMENT);
  private readonly api = inject(Api);
  private readonly session = inject(Session);

  private readonly chosen = signal<Theme | null>(this.readStoredChoice());
  private readonly systemPrefersDark = signal(this.darkQuery()?.matches ?? false);

  readonly theme = computed<Theme>(() => this.chosen() ?? (this.systemPrefersDark() ? 'dark' : 'light'));

  constructor() {
    this.darkQuery()?.addEventListener('change', (event) => this.systemPrefersDark.set(event.matches));

    effect(() => {
      const saved = this.session.user()?.theme;
      if (saved) this.chosen.set(saved);
    });

    effect(() => this.apply(this.chosen()));
  }

  toggle(): void {
    const next: Theme = this.theme() === 'dark' ? 'light' : 'dark';
    this.chosen.set(next);
    if (!this.session.signedIn()) return;
    this.api.call(setPreferences, { body: { theme: next } }).subscribe(({ user }) => this.session.replaceUser(user));
  }

  private apply(choice: Theme | null): void {
    const root = this.document.documentElement;
    root.classList.toggle('gw-theme-light', choice === 'light');
    root.classList.toggle('gw-theme-dark', choice === 'dark');
    if (choice) this.storage()?.setItem(STORAGE_KEY, choice);
  }

  private readStoredChoice(): Theme | null {
    const parsed = themeSchema.safeParse(this.storage()?.getItem(STORAGE_KEY));
    return parsed.success ? parsed.data : null;
  }

  private darkQuery(): MediaQueryList | null {
    return this.document.defaultView?.matchMedia?.('(prefers-color-scheme: dark)') ?? null;
  }

  private storage(): Storage | null {
    try {
      return this.document.defaultView?.localStorage ?? null;
    } catch {
      // Storage can be switched off by the browser; the theme then lasts for this visit only.
      return null;
    }
  }
}
