import { Routes } from '@angular/router';

import { StockList } from './stock-list';

export const stockRoutes: Routes = [{ path: '', title: 'Studio fabric', component: StockList }];
