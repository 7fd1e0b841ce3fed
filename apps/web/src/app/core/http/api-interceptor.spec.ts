import { HttpClient, provideHttpClient, withInterceptors } from '@angular/common/http';
import { HttpTestingController, provideHttpClientTesting } from '@angular/common/http/testing';
import { TestBed } from '@angular/core/testing';
import { MatSnackBar } from '@angular/material/snack-bar';
import { Router, provideRouter } from '@angular/router';
import { Session } from '../auth/session';
import { ApiError } from './api-error';
import { apiInterceptor } from './api-interceptor';

describe('apiInterceptor', () => {
  let http: HttpClient;
  let backend: HttpTestingController;
  let session: Session;
  const snack = { open: vi.fn() };

  beforeEach(() => {
    sessionStorage.clear();
    snack.open.mockReset();
    TestBed.configureTestingModule({
      providers: [
        provideRouter([]),
        provideHttpClient(withInterceptors([apiInterceptor])),
        provideHttpClientTesting(),
        { provide: MatSnackBar, useValue: snack },
      ],
    });
    http = TestBed.inject(HttpClient);
    backend = TestBed.inject(HttpTestingController);
    session = TestBed.inject(Session);
    session.start({
      token: 'tok-1',
      expiresAt: new Date(Date.now() + 3_600_000).toISOString(),
      user: { id: 3, email: 'engineer@rhotrace.example', name: 'E', role: 'engineer' },
    });
  });

  afterEach(() => backend.verify());

  it('adds the bearer token to API requests only', () => {
    http.get('/api/lots').subscribe();
    http.get('/assets/x.json').subscribe();
    expect(backend.expectOne('/api/lots').request.headers.get('Authorization')).toBe(
      'Bearer tok-1',
    );
    expect(backend.expectOne('/assets/x.json').request.headers.has('Authorization')).toBe(false);
  });

  it('maps the shared error shape and shows its message', () => {
    let caught: unknown;
    http.post('/api/lots', {}).subscribe({ error: (e: unknown) => (caught = e) });
    backend.expectOne('/api/lots').flush(
      {
        error: {
          code: 'validation_failed',
          message: 'Check the fields',
          details: [{ field: 'body.code', problem: 'is required' }],
        },
      },
      { status: 400, statusText: 'Bad Request' },
    );
    expect(caught).toBeInstanceOf(ApiError);
    expect((caught as ApiError).details).toEqual([{ field: 'body.code', problem: 'is required' }]);
    expect(snack.open).toHaveBeenCalledWith('Check the fields', 'Dismiss', expect.anything());
  });

  it('a 401 ends the session and goes to sign-in with the way back', async () => {
    const router = TestBed.inject(Router);
    const navigate = vi.spyOn(router, 'navigate').mockResolvedValue(true);
    http.get('/api/lots').subscribe({ error: () => undefined });
    backend
      .expectOne('/api/lots')
      .flush(
        { error: { code: 'unauthenticated', message: 'Sign in again' } },
        { status: 401, statusText: 'Unauthorized' },
      );
    expect(session.signedIn()).toBe(false);
    expect(navigate).toHaveBeenCalledWith(['/sign-in'], { queryParams: { next: '/', expired: 1 } });
    expect(snack.open).not.toHaveBeenCalled();
  });
});
