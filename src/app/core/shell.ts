import { BreakpointObserver } from '@angular/cdk/layout';
import { ChangeDetectionStrategy, Component, afterNextRender, computed, inject, viewChild } from '@angular/core';
import { toSignal } from '@angular/core/rxjs-interop';
import { MatButtonModule } from '@angular/material/button';
import { MatIconModule } from '@angular/material/icon';
import { MatListModule } from '@angular/material/list';
import { MatSidenav, MatSidenavModule } from '@angular/material/sidenav';
import { MatToolbarModule } from '@angular/material/toolbar';
import { Router, RouterLink, RouterLinkActive, RouterOutlet } from '@angular/router';
import { map } from 'rxjs';

import { Auth } from './auth';
import { provideMaterialDefaults } from './material-defaults';
import { Notices } from './notices';
import { LEAVING_UNSAVED, UnsavedWork } from './unsaved-work';
import { Role, roleLabels } from './user';

interface NavItem {
  path: string;
  label: string;
  icon: string;
  roles: readonly Role[];
}

/** Every place in the app, with the roles that may open it. */
const navItems: readonly NavItem[] = [
  { path: '/overview', label: 'What is due', icon: 'event', roles: ['owner', 'workroom'] },
  { path: '/commissions', label: 'Commissions', icon: 'assignment', roles: ['owner', 'workroom'] },
  { path: '/clients', label: 'Clients', icon: 'group', roles: ['owner', 'workroom'] },
  { path: '/stock', label: 'Studio fabric', icon: 'inventory_2', roles: ['owner', 'workroom'] },
  { path: '/users', label: 'Users', icon: 'manage_accounts', roles: ['owner'] },
  { path: '/mail', label: 'Mail', icon: 'mail', roles: ['owner'] },
  { path: '/settings', label: 'Settings', icon: 'settings', roles: ['owner'] },
  { path: '/portal', label: 'My commissions', icon: 'assignment', roles: ['client'] },
  { path: '/my-details', label: 'My details', icon: 'badge', roles: ['client'] },
  { path: '/password', label: 'Change password', icon: 'password', roles: ['owner', 'workroom', 'client'] },
];

/**
 * The frame around every page: toolbar, navigation for the signed-in role, and
 * the page. A lazy route (see app.routes.ts), so its Material parts are not in
 * the first load.
 */
@Component({
  selector: 'ks-shell',
  providers: [provideMaterialDefaults()],
  imports: [
    RouterOutlet,
    RouterLink,
    RouterLinkActive,
    MatToolbarModule,
    MatSidenavModule,
    MatListModule,
    MatButtonModule,
    MatIconModule,
  ],
  templateUrl: './shell.html',
  styleUrl: './shell.scss',
  changeDetection: ChangeDetectionStrategy.OnPush,
})
export class Shell {
  private readonly auth = inject(Auth);
  private readonly router = inject(Router);
  private readonly notices = inject(Notices);
  private readonly unsavedWork = inject(UnsavedWork);
  private readonly sidenav = viewChild(MatSidenav);

  protected readonly user = this.auth.user;
  protected readonly roleLabel = computed(() => {
    const role = this.auth.role();
    return role ? roleLabels[role] : '';
  });
  protected readonly navItems = computed(() => {
    const role = this.auth.role();
    return role ? navItems.filter((item) => item.roles.includes(role)) : [];
  });
  protected readonly wide = toSignal(
    inject(BreakpointObserver)
      .observe('(min-width: 960px)')
      .pipe(map((state) => state.matches)),
    { initialValue: true },
  );

  constructor() {
    afterNextRender(() => this.notices.preload());
  }

  protected toggleNavigation(): void {
    void this.sidenav()?.toggle();
  }

  protected closeNavigationIfOver(): void {
    if (!this.wide()) {
      void this.sidenav()?.close();
    }
  }

  protected skipToContent(event: Event, main: HTMLElement): void {
    event.preventDefault();
    main.focus();
  }

  /** Asks first if the page holds unsaved work: once signed out, it could not be saved. */
  protected signOut(): void {
    const leave = this.unsavedWork.any() ? this.unsavedWork.askToLeave() : Promise.resolve(true);
    void leave.then((yes) => {
      if (!yes) return;
      const toSignIn = () => void this.router.navigateByUrl('/sign-in', { state: LEAVING_UNSAVED });
      this.auth.signOut().subscribe({ complete: toSignIn, error: toSignIn });
    });
  }
}
