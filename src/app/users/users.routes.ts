import { Routes } from '@angular/router';

import { unsavedWorkGuard } from '../core/unsaved-work';
import { UserForm } from './user-form';
import { UserList } from './user-list';

export const usersRoutes: Routes = [
  { path: '', title: 'Users', component: UserList },
  { path: 'new', title: 'Add user', canDeactivate: [unsavedWorkGuard], component: UserForm },
];
