import { Routes } from '@angular/router';

import { homeGuard, roleGuard, signedOutGuard } from './core/role-guard';

/** Every page, each lazy, with the roles that may open it. */
export const pages: Routes = [
  { path: '', pathMatch: 'full', canActivate: [homeGuard], children: [] },
  {
    path: 'sign-in',
    title: 'Sign in',
    canActivate: [signedOutGuard],
    loadComponent: () => import('./sign-in/sign-in').then((m) => m.SignIn),
  },
  {
    path: 'overview',
    title: 'What is due',
    canActivate: [roleGuard('owner', 'workroom')],
    loadComponent: () => import('./overview/overview-page').then((m) => m.OverviewPage),
  },
  {
    path: 'forgot-password',
    title: 'Forgot your password?',
    canActivate: [signedOutGuard],
    loadComponent: () => import('./sign-in/forgot-password').then((m) => m.ForgotPassword),
  },
  {
    // Opened from a one-time link in an e-mail, signed in or not.
    path: 'set-password',
    title: 'Choose your password',
    loadComponent: () => import('./sign-in/set-password').then((m) => m.SetPassword),
  },
  {
    path: 'clients',
    canActivate: [roleGuard('owner', 'workroom')],
    loadChildren: () => import('./clients/clients.routes').then((m) => m.clientsRoutes),
  },
  {
    path: 'commissions',
    canActivate: [roleGuard('owner', 'workroom')],
    loadChildren: () => import('./commissions/commissions.routes').then((m) => m.commissionsRoutes),
  },
  {
    path: 'designs',
    loadChildren: () => import('./designs/designs.routes').then((m) => m.designsRoutes),
  },
  {
    path: 'stock',
    canActivate: [roleGuard('owner', 'workroom')],
    loadChildren: () => import('./stock/stock.routes').then((m) => m.stockRoutes),
  },
  {
    path: 'portal',
    canActivate: [roleGuard('client')],
    loadChildren: () => import('./portal/portal.routes').then((m) => m.portalRoutes),
  },
  {
    path: 'users',
    canActivate: [roleGuard('owner')],
    loadChildren: () => import('./users/users.routes').then((m) => m.usersRoutes),
  },
  {
    path: 'my-details',
    title: 'My details',
    canActivate: [roleGuard('client')],
    loadComponent: () => import('./my-details/my-details').then((m) => m.MyDetails),
  },
  {
    path: 'settings',
    title: 'Settings',
    canActivate: [roleGuard('owner')],
    loadChildren: () => import('./settings/settings.routes').then((m) => m.settingsRoutes),
  },
  {
    path: 'mail',
    title: 'Mail',
    canActivate: [roleGuard('owner')],
    loadComponent: () => import('./mail/mail-page').then((m) => m.MailPage),
  },
  {
    path: 'password',
    title: 'Change password',
    canActivate: [roleGuard('owner', 'workroom', 'client')],
    loadChildren: () => import('./account/account.routes').then((m) => m.accountRoutes),
  },
  {
    path: '**',
    title: 'Page not found',
    loadComponent: () => import('./core/not-found').then((m) => m.NotFound),
  },
];

/** The pages inside the shell (toolbar and navigation), which is loaded with the first page. */
export const routes: Routes = [
  {
    path: '',
    loadComponent: () => import('./core/shell').then((m) => m.Shell),
    children: pages,
  },
];
