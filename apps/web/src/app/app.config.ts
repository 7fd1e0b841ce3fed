import {
  type ApplicationConfig,
  inject,
  provideAppInitializer,
  provideBrowserGlobalErrorListeners,
  provideZonelessChangeDetection,
} from '@angular/core';
import { provideHttpClient, withInterceptors } from '@angular/common/http';
import {
  provideRouter,
  withComponentInputBinding,
  withInMemoryScrolling,
  withPreloading,
} from '@angular/router';
import { MAT_FORM_FIELD_DEFAULT_OPTIONS } from '@angular/material/form-field';
import { routes } from './app.routes';
import { apiInterceptor } from './core/http/api-interceptor';
import { OpeningRequest } from './core/http/opening-request';
import { Session } from './core/auth/session';
import { openingAnalysisUrl } from './features/analysis/analysis-urls';
import { IdlePreloading } from './core/routing/idle-preloading';
import { provideIsoDateAdapter } from './shared/iso-date';
import { PlotlyLoader } from './shared/plot/plotly-loader';

export const appConfig: ApplicationConfig = {
  providers: [
    provideBrowserGlobalErrorListeners(),
    provideZonelessChangeDetection(),
    provideRouter(
      routes,
      withComponentInputBinding(),
      withInMemoryScrolling({ scrollPositionRestoration: 'top' }),
      withPreloading(IdlePreloading),
    ),
    provideHttpClient(withInterceptors([apiInterceptor])),
    { provide: MAT_FORM_FIELD_DEFAULT_OPTIONS, useValue: { appearance: 'outline' } },
    provideIsoDateAdapter(),
    // A sweep study opened directly (a link in a new tab, a reload) asks for its sweep, and
    // loads the plot library, while the app's code loads, not after it.
    provideAppInitializer(() => {
      const url = openingAnalysisUrl(globalThis.location?.pathname ?? '');
      if (!url || !inject(Session).can('fits:run')) return;
      inject(OpeningRequest).start(url);
      inject(PlotlyLoader).preload();
    }),
  ],
};
