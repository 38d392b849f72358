import { ChangeDetectionStrategy, Component } from '@angular/core';
import { MatButtonModule } from '@angular/material/button';
import { MatIconModule } from '@angular/material/icon';
import { RouterLink } from '@angular/router';

@Component({
  selector: 'ks-not-found',
  imports: [RouterLink, MatButtonModule, MatIconModule],
  template: `
    <section class="not-found" aria-labelledby="not-found-heading">
      <mat-icon aria-hidden="true">wrong_location</mat-icon>
      <h1 id="not-found-heading">Page not found</h1>
      <p>There is nothing at this address. It may have moved, or the link may be mistyped.</p>
      <a mat-flat-button routerLink="/">Go to the start page</a>
    </section>
  `,
  styles: `
    .not-found {
      max-width: 36rem;
      margin: 4rem auto;
      padding: 0 1rem;
      text-align: center;
    }
    mat-icon {
      font-size: 48px;
      width: 48px;
      height: 48px;
      color: var(--mat-sys-tertiary);
    }
    h1 {
      font: var(--mat-sys-headline-medium);
    }
  `,
  changeDetection: ChangeDetectionStrategy.OnPush,
})
export class NotFound {}
