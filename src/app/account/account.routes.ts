import { Routes } from '@angular/router';

import { unsavedWorkGuard } from '../core/unsaved-work';
import { ChangePassword } from './change-password';

export const accountRoutes: Routes = [{ path: '', canDeactivate: [unsavedWorkGuard], component: ChangePassword }];
