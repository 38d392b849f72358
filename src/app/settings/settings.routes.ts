import { Routes } from '@angular/router';

import { unsavedWorkGuard } from '../core/unsaved-work';
import { SettingsPage } from './settings-page';

export const settingsRoutes: Routes = [{ path: '', canDeactivate: [unsavedWorkGuard], component: SettingsPage }];
