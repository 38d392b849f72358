import { Injectable } from '@angular/core';

/**
 * Leaves the app for another site (the hosted card payment page). A seam of
 * its own so that specs can see where the app would go without leaving.
 */
@Injectable({ providedIn: 'root' })
export class ExternalNavigation {
  goTo(url: string): void {
    window.location.assign(url);
  }
}
