import { Routes } from '@angular/router';

import { roleGuard } from '../core/role-guard';
import { unsavedWorkGuard } from '../core/unsaved-work';
import { CommissionBoard } from './commission-board';
import { CommissionForm } from './commission-form';
import { CommissionList } from './commission-list';
import { CommissionPage } from './commission-page';
import { GarmentPage } from './garment-page';

export const commissionsRoutes: Routes = [
  { path: '', title: 'Commissions', component: CommissionList },
  { path: 'board', title: 'Commissions board', component: CommissionBoard },
  { path: 'new', title: 'New commission', canActivate: [roleGuard('owner')], canDeactivate: [unsavedWorkGuard], component: CommissionForm },
  { path: ':id', title: 'Commission', canDeactivate: [unsavedWorkGuard], component: CommissionPage },
  { path: ':id/edit', title: 'Edit commission', canActivate: [roleGuard('owner')], canDeactivate: [unsavedWorkGuard], component: CommissionForm },
  { path: ':id/garments/:garmentId', title: 'Garment', canDeactivate: [unsavedWorkGuard], component: GarmentPage },
];
