import { Routes } from '@angular/router';

import { roleGuard } from '../core/role-guard';
import { ClientForm } from './client-form';
import { ClientList } from './client-list';

export const clientsRoutes: Routes = [
  { path: '', title: 'Clients', component: ClientList },
  { path: 'new', title: 'Add client', canActivate: [roleGuard('owner')], component: ClientForm },
  { path: ':id', title: 'Edit client', canActivate: [roleGuard('owner')], component: ClientForm },
];
