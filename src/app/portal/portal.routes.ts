import { Routes } from '@angular/router';

import { PortalCommission } from './portal-commission';
import { PortalList } from './portal-list';

export const portalRoutes: Routes = [
  { path: '', title: 'My commissions', component: PortalList },
  { path: ':id', title: 'My commission', component: PortalCommission },
];
