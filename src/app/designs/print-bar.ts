import { ChangeDetectionStrategy, Component, input, output } from '@angular/core';
import { MatButtonModule } from '@angular/material/button';
import { MatIconModule } from '@angular/material/icon';
import { RouterLink } from '@angular/router';

import { LoadStatus } from '../ui/load-status';
import type { LoadState } from '../ui/loader';

/**
 * The strip above a page made for paper: back, Print, the page's PDF links
 * (projected), then while it loads a progress bar, and if it could not be
 * loaded a message with a way to try again. None of it is printed.
 */
@Component({
  selector: 'ks-print-bar',
  imports: [RouterLink, MatButtonModule, MatIconModule, LoadStatus],
  template: `
    <div class="actions">
      <a mat-icon-button [routerLink]="back()" [attr.aria-label]="backLabel()" data-testid="print-back"><mat-icon>arrow_back</mat-icon></a>
      <button mat-flat-button type="button" (click)="print()" [disabled]="state() !== 'ready'"><mat-icon>print</mat-icon> Print</button>
      <ng-content />
    </div>
    <ks-load-status [what]="'the ' + what()" [loading]="state() === 'loading'" [failed]="state() === 'failed'" (retry)="retry.emit()" />
  `,
  styles: `
    :host {
      display: block;
      margin-bottom: 0.5rem;
    }
    .actions {
      display: flex;
      flex-wrap: wrap;
      gap: 0.5rem;
      align-items: center;
    }
  `,
  host: { class: 'ks-no-print' },
  changeDetection: ChangeDetectionStrategy.OnPush,
})
export class PrintBar {
  /** Where back leads, as a router link. */
  readonly back = input.required<string | readonly unknown[]>();
  readonly backLabel = input('Back to the design');
  /** What the page is, in a sentence: "cut list", "care card". */
  readonly what = input.required<string>();
  readonly state = input.required<LoadState>();
  readonly retry = output<void>();

  protected print(): void {
    window.print();
  }
}
