import { Routes } from '@angular/router';

import { unsavedWorkGuard } from '../core/unsaved-work';
import { PortalCommission } from './portal-commission';
import { PortalList } from './portal-list';

export const portalRoutes: Routes = [
  { path: '', title: 'My commissions', component: PortalList },
  { path: ':id', title: 'My commission', canDeactivate: [unsavedWorkGuard], component: PortalCommission },
];
