import { HttpErrorResponse } from '@angular/common/http';
import { ErrorHandler, Injectable, Injector, inject } from '@angular/core';

import { Notices } from './notices';

/**
 * Last line for errors nothing else caught: log them for the developer and
 * tell the person, in plain words, that the page hit a problem.
 * Failed API calls were already reported by the HTTP interceptor.
 */
@Injectable()
export class AppErrorHandler implements ErrorHandler {
  // Resolved late: the handler is created before the overlay services exist.
  private readonly injector = inject(Injector);

  handleError(error: unknown): void {
    console.error(error);
    if (error instanceof HttpErrorResponse) {
      return;
    }
    try {
      this.injector
        .get(Notices)
        .error('Something went wrong on this page. Please try again, or reload the page if it keeps happening.');
    } catch (reportError) {
      console.error(reportError);
    }
  }
}
