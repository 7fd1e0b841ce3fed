import { HttpErrorResponse, type HttpInterceptorFn } from '@angular/common/http';
import { inject } from '@angular/core';
import { MatSnackBar } from '@angular/material/snack-bar';
import { Router } from '@angular/router';
import { catchError, throwError } from 'rxjs';
import { Session } from '../auth/session';
import { QUIET, toApiError } from './api-error';

/**
 * Adds the bearer token to API requests and maps failures to ApiError. A 401 on an
 * authenticated request ends the session and returns to sign-in (then back to the page);
 * other failures appear in a snackbar unless the request was marked quiet.
 */
export const apiInterceptor: HttpInterceptorFn = (req, next) => {
  const session = inject(Session);
  const router = inject(Router);
  const snackBar = inject(MatSnackBar);
  const token = session.token();
  const isApi = req.url.startsWith('/api/');
  const authed = isApi && token !== null;
  const request = authed ? req.clone({ setHeaders: { Authorization: `Bearer ${token}` } }) : req;

  return next(request).pipe(
    catchError((err: unknown) => {
      if (!(err instanceof HttpErrorResponse)) return throwError(() => err);
      if (err.status === 0 && err.error instanceof ProgressEvent && err.error.type === 'abort') {
        return throwError(() => err);
      }
      const apiError = toApiError(err);
      if (apiError.status === 401 && authed) {
        session.end();
        const next = router.url.startsWith('/sign-in') ? '/' : router.url;
        void router.navigate(['/sign-in'], { queryParams: { next, expired: 1 } });
        return throwError(() => apiError);
      }
      if (!req.context.get(QUIET)) {
        snackBar.open(apiError.message, 'Dismiss', { duration: 8000, politeness: 'assertive' });
      }
      return throwError(() => apiError);
    }),
  );
};
