import { provideHttpClient, withFetch, withInterceptors, withXsrfConfiguration } from '@angular/common/http';
import {
  ErrorHandler,
  inject,
  provideAppInitializer,
  provideBrowserGlobalErrorListeners,
  provideZonelessChangeDetection,
  type ApplicationConfig,
} from '@angular/core';
import { MatIconRegistry } from '@angular/material/icon';
import { provideRouter, withComponentInputBinding } from '@angular/router';
import { provideEchartsCore } from 'ngx-echarts';

import { routes } from './app.routes';
import { AppErrorHandler } from './core/app-error-handler';
import { httpErrorInterceptor } from './core/http-error-interceptor';
import { Session } from './core/session';
import { ThemeSwitcher } from './core/theme-switcher';

export const appConfig: ApplicationConfig = {
  providers: [
    provideBrowserGlobalErrorListeners(),
    provideZonelessChangeDetection(),
    provideRouter(routes, withComponentInputBinding()),
    provideHttpClient(
      withFetch(),
      withXsrfConfiguration({ cookieName: 'XSRF-TOKEN', headerName: 'X-XSRF-TOKEN' }),
      withInterceptors([httpErrorInterceptor]),
    ),
    { provide: ErrorHandler, useClass: AppErrorHandler },
    provideEchartsCore({ echarts: () => import('./charts/echarts-setup').then((m) => m.echarts) }),
    provideAppInitializer(() => {
      inject(MatIconRegistry).setDefaultFontSetClass('material-symbols-outlined');
      // Created now so the stored theme is on <html> before the first screen paints.
      inject(ThemeSwitcher);
      // Waited for, so guards know who is signed in and the XSRF cookie exists before any POST.
      return inject(Session).restore();
    }),
  ],
};
