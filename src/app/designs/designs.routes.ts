import { Routes } from '@angular/router';
import { PRINTOUTS } from '@keepstitch/shared';

import { roleGuard } from '../core/role-guard';
import { unsavedWorkGuard } from '../core/unsaved-work';
import { DesignPage } from './design-page';
import { DesignReview } from './design-review';
import { PrintoutPage } from './printout-page';

export const designsRoutes: Routes = [
  { path: ':id', title: 'Design', canActivate: [roleGuard('owner', 'workroom')], canDeactivate: [unsavedWorkGuard], component: DesignPage },
  // Every printout's page, from the printouts' registry.
  ...PRINTOUTS.map((p) => ({ path: `:id/${p.id}`, title: p.title, canActivate: [roleGuard(...p.roles)], component: PrintoutPage, data: { printout: p.id } })),
  { path: ':id/review', title: 'Your design', canActivate: [roleGuard('client')], component: DesignReview },
];
