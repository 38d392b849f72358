import { HttpErrorResponse, HttpInterceptorFn } from '@angular/common/http';
import { inject } from '@angular/core';
import { Router } from '@angular/router';
import { catchError, throwError } from 'rxjs';

import { REPORT_API_ERRORS, messageFor } from './api-error';
import { Auth } from './auth';
import { Notices } from './notices';

/**
 * Shows the server's message for a failed API call, and sends the person to
 * the sign-in page (keeping the page they wanted) when the session is gone.
 * The error still reaches the caller, which can show it in place as well.
 */
export const apiErrorInterceptor: HttpInterceptorFn = (request, next) => {
  const notices = inject(Notices);
  const router = inject(Router);
  const auth = inject(Auth);

  return next(request).pipe(
    catchError((error: unknown) => {
      if (error instanceof HttpErrorResponse) {
        const isAuthCall = request.url.startsWith('/api/auth/');
        if (error.status === 401 && !isAuthCall) {
          auth.forget();
          const navigation = router.currentNavigation();
          const wanted = navigation ? router.serializeUrl(navigation.extractedUrl) : router.url;
          const queryParams = wanted.startsWith('/sign-in') ? {} : { returnUrl: wanted };
          void router.navigate(['/sign-in'], { queryParams });
          notices.error(messageFor(error));
        } else if (request.context.get(REPORT_API_ERRORS)) {
          notices.error(messageFor(error));
        }
      }
      return throwError(() => error);
    }),
  );
};
