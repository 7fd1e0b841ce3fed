import { inject } from '@angular/core';
import { type CanActivateFn, type CanMatchFn, Router } from '@angular/router';
import type { Capability } from '@rhotrace/api-types';
import { Session } from './session';

/** Lets signed-in users through; others go to sign-in and come back to where they were going. */
export const signedInGuard: CanActivateFn = (_route, state) => {
  const session = inject(Session);
  if (session.signedIn()) return true;
  return inject(Router).createUrlTree(['/sign-in'], { queryParams: { next: state.url } });
};

/**
 * Matches a lazy route only for roles with `capability` (the role-to-capability table in
 * `@rhotrace/api-types`, which the API enforces too); others see the page that says it is not
 * available to them, with a way back.
 */
export function capabilityGuard(capability: Capability): CanMatchFn {
  return () => {
    const session = inject(Session);
    const router = inject(Router);
    if (session.can(capability)) return true;
    if (!session.signedIn()) {
      // Matching runs before the shell's guard: remember the whole address for after sign-in.
      const next = router.getCurrentNavigation()?.extractedUrl.toString() ?? '/';
      return router.createUrlTree(['/sign-in'], { queryParams: { next } });
    }
    return router.createUrlTree(['/not-available']);
  };
}
