import { Routes } from '@angular/router';

import { roleGuard } from '../core/role-guard';
import { unsavedWorkGuard } from '../core/unsaved-work';
import { CareCardPrint } from './care-card-print';
import { CutListPrint } from './cut-list-print';
import { DesignPage } from './design-page';
import { DesignReview } from './design-review';
import { SewingOrderPrint } from './sewing-order-print';
import { TemplatesPrint } from './templates-print';

export const designsRoutes: Routes = [
  { path: ':id', title: 'Design', canActivate: [roleGuard('owner', 'workroom')], canDeactivate: [unsavedWorkGuard], component: DesignPage },
  { path: ':id/cut-list', title: 'Cut list', canActivate: [roleGuard('owner', 'workroom')], component: CutListPrint },
  { path: ':id/sewing-order', title: 'Sewing order', canActivate: [roleGuard('owner', 'workroom')], component: SewingOrderPrint },
  { path: ':id/templates', title: 'Templates', canActivate: [roleGuard('owner', 'workroom')], component: TemplatesPrint },
  { path: ':id/care-card', title: 'Care card', canActivate: [roleGuard('owner', 'workroom', 'client')], component: CareCardPrint },
  { path: ':id/review', title: 'Your design', canActivate: [roleGuard('client')], component: DesignReview },
];
