import { Routes } from '@angular/router';

import { roleGuard } from '../core/role-guard';
import { CutListPrint } from './cut-list-print';
import { DesignPage } from './design-page';
import { DesignReview } from './design-review';

export const designsRoutes: Routes = [
  { path: ':id', title: 'Design', canActivate: [roleGuard('owner', 'workroom')], component: DesignPage },
  { path: ':id/cut-list', title: 'Cut list', canActivate: [roleGuard('owner', 'workroom')], component: CutListPrint },
  { path: ':id/review', title: 'Your design', canActivate: [roleGuard('client')], component: DesignReview },
];
