import { HttpClient } from '@angular/common/http';
import { Injectable, inject } from '@angular/core';
import type {
  LoginRequest,
  LoginResponse,
  PasswordResetConfirm,
  PasswordResetRequest,
  SessionUser,
} from '@rhotrace/api-types';
import type { Observable } from 'rxjs';
import { quietRequest } from '../http/api-error';

/** Sign-in, session renewal and password reset. */
@Injectable({ providedIn: 'root' })
export class AuthApi {
  private readonly http = inject(HttpClient);

  login(body: LoginRequest): Observable<LoginResponse> {
    return this.http.post<LoginResponse>('/api/auth/login', body, { context: quietRequest() });
  }

  refresh(): Observable<LoginResponse> {
    return this.http.post<LoginResponse>('/api/auth/refresh', {}, { context: quietRequest() });
  }

  me(): Observable<SessionUser> {
    return this.http.get<SessionUser>('/api/auth/me');
  }

  requestReset(body: PasswordResetRequest): Observable<unknown> {
    return this.http.post('/api/auth/password-reset', body, { context: quietRequest() });
  }

  confirmReset(body: PasswordResetConfirm): Observable<unknown> {
    return this.http.post('/api/auth/password-reset/confirm', body, { context: quietRequest() });
  }
}
