import { Routes } from '@angular/router';

import { UserForm } from './user-form';
import { UserList } from './user-list';

export const usersRoutes: Routes = [
  { path: '', title: 'Users', component: UserList },
  { path: 'new', title: 'Add user', component: UserForm },
];
