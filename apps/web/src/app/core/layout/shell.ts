import { BreakpointObserver } from '@angular/cdk/layout';
import { ChangeDetectionStrategy, Component, DestroyRef, computed, inject } from '@angular/core';
import { takeUntilDestroyed, toSignal } from '@angular/core/rxjs-interop';
import { MatButtonModule } from '@angular/material/button';
import { MatListModule } from '@angular/material/list';
import { MatSidenavModule } from '@angular/material/sidenav';
import { MatToolbarModule } from '@angular/material/toolbar';
import { MatTooltipModule } from '@angular/material/tooltip';
import { Router, RouterLink, RouterLinkActive, RouterOutlet } from '@angular/router';
import { filter, interval, map, switchMap } from 'rxjs';
import { Icon } from '../../shared/icon';
import { PlotlyLoader } from '../../shared/plot/plotly-loader';
import { SkipPlaces, focusPlace } from '../../shared/skip-target';
import { AuthApi } from '../auth/auth-api';
import { Session } from '../auth/session';
import { navFor } from './nav-items';
import { ThemeMode } from './theme-mode';

const ROLE_WORDS = {
  admin: 'Administrator',
  manager: 'Lab manager',
  engineer: 'Process engineer',
  physicist: 'Device physicist',
  technician: 'Technician',
} as const;

/** The signed-in frame: top bar, role-aware navigation, and the routed page. */
@Component({
  selector: 'rt-shell',
  imports: [
    MatSidenavModule,
    MatToolbarModule,
    MatListModule,
    MatButtonModule,
    MatTooltipModule,
    RouterOutlet,
    RouterLink,
    RouterLinkActive,
    Icon,
  ],
  templateUrl: './shell.html',
  styleUrl: './shell.scss',
  changeDetection: ChangeDetectionStrategy.OnPush,
})
export class Shell {
  private readonly session = inject(Session);
  private readonly router = inject(Router);
  protected readonly theme = inject(ThemeMode);
  protected readonly narrow = toSignal(
    inject(BreakpointObserver)
      .observe('(max-width: 899px)')
      .pipe(map((state) => state.matches)),
    { initialValue: false },
  );
  protected readonly user = this.session.user;
  /** The sections of the page on screen, for the skip links after "Skip to main content". */
  protected readonly skipPlaces = inject(SkipPlaces).places;
  protected readonly nav = computed(() => navFor(this.session.role()));
  protected readonly roleWord = computed(() => {
    const role = this.session.role();
    return role ? ROLE_WORDS[role] : '';
  });

  constructor() {
    // Roles whose pages plot (studies, lots, comparisons) get plotly in the first idle moment
    // after sign-in, so their first plot does not wait for the chunk.
    if (this.session.can('fits:run') || this.session.can('records:see-all')) {
      inject(PlotlyLoader).preloadWhenIdle();
    }
    const auth = inject(AuthApi);
    // Renew the token a few minutes before it runs out, while the app is open.
    interval(60_000)
      .pipe(
        filter(() => this.session.signedIn() && this.session.msUntilExpiry() < 5 * 60_000),
        switchMap(() => auth.refresh()),
        takeUntilDestroyed(inject(DestroyRef)),
      )
      .subscribe({ next: (response) => this.session.start(response), error: () => undefined });
  }

  /** Opens the search page for what was typed in the bar. */
  protected find(q: string): void {
    void this.router.navigate(['/search'], { queryParams: { q: q.trim() } });
  }

  /** A skip link moves the keyboard, not the address (the router owns the URL). */
  protected skipTo(event: Event, element: HTMLElement): void {
    event.preventDefault();
    focusPlace(element);
  }

  protected signOut(): void {
    this.session.end();
    void this.router.navigate(['/sign-in']);
  }
}
