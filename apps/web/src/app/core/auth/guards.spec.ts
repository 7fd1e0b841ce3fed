import { TestBed } from '@angular/core/testing';
import { Router, UrlTree, provideRouter, type Route, type UrlSegment } from '@angular/router';
import type { Role } from '@rhotrace/api-types';
import { navFor } from '../layout/nav-items';
import { capabilityGuard } from './guards';
import { Session } from './session';

function signIn(role: Role): void {
  TestBed.inject(Session).start({
    token: 'tok-1',
    expiresAt: new Date(Date.now() + 3_600_000).toISOString(),
    user: { id: 1, email: `${role}@lab.example`, name: role, role },
  });
}

function runGuard(guard: ReturnType<typeof capabilityGuard>): unknown {
  return TestBed.runInInjectionContext(() => guard({} as Route, [] as UrlSegment[]));
}

describe('capabilityGuard', () => {
  beforeEach(() => {
    sessionStorage.clear();
    TestBed.configureTestingModule({ providers: [provideRouter([])] });
  });

  it('lets a role with the capability through', () => {
    signIn('manager');
    expect(runGuard(capabilityGuard('audit:read'))).toBe(true);
  });

  it('shows a role without it the page that says so (not silently the bench)', () => {
    signIn('engineer');
    const result = runGuard(capabilityGuard('audit:read'));
    expect(result).toBeInstanceOf(UrlTree);
    expect(TestBed.inject(Router).serializeUrl(result as UrlTree)).toBe('/not-available');
  });

  it('sends a signed-out visitor to sign-in', () => {
    const result = runGuard(capabilityGuard('records:see-all'));
    expect(TestBed.inject(Router).serializeUrl(result as UrlTree)).toMatch(/^\/sign-in/);
  });
});

describe('navFor', () => {
  const paths = (role: Role | null) => navFor(role).map((item) => item.path);

  it('shows each role only the entries its capabilities open', () => {
    expect(paths(null)).toEqual([]);
    expect(paths('technician')).toEqual(['/']);
    expect(paths('physicist')).toEqual(['/', '/lots', '/overlay', '/stations']);
    expect(paths('engineer')).toEqual(['/', '/lots', '/overlay', '/stations']);
    expect(paths('manager')).toEqual([
      '/',
      '/lots',
      '/overlay',
      '/worklist',
      '/stations',
      '/trail',
    ]);
    expect(paths('admin')).toEqual([
      '/',
      '/lots',
      '/overlay',
      '/worklist',
      '/stations',
      '/people',
      '/trail',
    ]);
  });
});
