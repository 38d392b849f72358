import { ChangeDetectionStrategy, Component, Resource, input, output } from '@angular/core';
import { MatButtonModule } from '@angular/material/button';
import { MatIconModule } from '@angular/material/icon';
import { MatProgressBarModule } from '@angular/material/progress-bar';
import { RouterLink } from '@angular/router';

/**
 * The strip above a page made for paper: back, Print, the page's PDF links
 * (projected), then while it loads a progress bar, and if it could not be
 * loaded a message with a way to try again. None of it is printed.
 */
@Component({
  selector: 'ks-print-bar',
  imports: [RouterLink, MatButtonModule, MatIconModule, MatProgressBarModule],
  template: `
    <div class="actions">
      <a mat-icon-button [routerLink]="back()" [attr.aria-label]="backLabel()" data-testid="print-back"><mat-icon>arrow_back</mat-icon></a>
      <button mat-flat-button type="button" (click)="print()" [disabled]="state() !== 'ready'"><mat-icon>print</mat-icon> Print</button>
      <ng-content />
    </div>
    <div class="loading-slot">
      @if (state() === 'loading') {
        <mat-progress-bar mode="indeterminate" [attr.aria-label]="'Loading the ' + what()" />
      }
    </div>
    @if (state() === 'failed') {
      <p class="failed" role="alert">
        The {{ what() }} could not be loaded.
        <button mat-button type="button" (click)="retry.emit()">Try again</button>
      </p>
    }
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
    .loading-slot {
      margin-top: 0.25rem;
    }
    .failed {
      display: flex;
      flex-wrap: wrap;
      align-items: center;
      gap: 0.25rem;
      padding: 0.5rem 0.75rem;
      border-radius: var(--mat-sys-corner-small);
      background: var(--mat-sys-error-container);
      color: var(--mat-sys-on-error-container);
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
  readonly state = input.required<'loading' | 'ready' | 'failed'>();
  readonly retry = output<void>();

  protected print(): void {
    window.print();
  }
}

/** A print page's load, as the bar shows it. */
export function printState(loaded: Resource<unknown>): 'loading' | 'ready' | 'failed' {
  if (loaded.status() === 'error') return 'failed';
  return loaded.hasValue() ? 'ready' : 'loading';
}
