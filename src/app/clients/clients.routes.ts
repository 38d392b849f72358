import { Routes } from '@angular/router';

import { roleGuard } from '../core/role-guard';
import { unsavedWorkGuard } from '../core/unsaved-work';
import { ClientForm } from './client-form';
import { ClientList } from './client-list';

export const clientsRoutes: Routes = [
  { path: '', title: 'Clients', component: ClientList },
  { path: 'new', title: 'Add client', canActivate: [roleGuard('owner')], canDeactivate: [unsavedWorkGuard], component: ClientForm },
  { path: ':id', title: 'Edit client', canActivate: [roleGuard('owner')], canDeactivate: [unsavedWorkGuard], component: ClientForm },
];
