import { ChangeDetectionStrategy, Component, computed, input, output } from '@angular/core';
import { MatButtonModule } from '@angular/material/button';
import { MatIconModule } from '@angular/material/icon';
import { MatProgressBarModule } from '@angular/material/progress-bar';

/**
 * Where a page's (or a part's) loading stands: a thin progress bar while it
 * loads, in a slot that keeps its height so nothing below jumps, and when it
 * could not be loaded a message with Try again (and any other way out the
 * page projects, such as a link back).
 */
@Component({
  selector: 'ks-load-status',
  imports: [MatButtonModule, MatIconModule, MatProgressBarModule],
  template: `
    <div class="loading-slot" aria-live="polite">
      @if (label(); as text) {
        <mat-progress-bar mode="indeterminate" [attr.aria-label]="text" />
      }
    </div>
    @if (failed()) {
      <div class="load-failed" role="alert">
        <mat-icon aria-hidden="true">cloud_off</mat-icon>
        <p>{{ failedText() }}</p>
        <div class="ways">
          <button mat-stroked-button type="button" (click)="retry.emit()">Try again</button>
          <ng-content />
        </div>
      </div>
    }
  `,
  styles: `
    :host {
      display: block;
    }
    .loading-slot {
      margin: 0.5rem 0;
    }
    .load-failed {
      display: flex;
      flex-wrap: wrap;
      align-items: center;
      gap: 0.5rem 0.75rem;
      margin: 0.5rem 0 1rem;
      padding: 0.75rem 1rem;
      border-radius: var(--mat-sys-corner-medium);
      background: var(--mat-sys-error-container);
      color: var(--mat-sys-on-error-container);
    }
    p {
      margin: 0;
      flex: 1 1 12rem;
    }
    .ways {
      display: flex;
      flex-wrap: wrap;
      gap: 0.5rem;
    }
  `,
  changeDetection: ChangeDetectionStrategy.OnPush,
})
export class LoadStatus {
  /** What is loaded, as it reads after "Loading": "the clients", "your quote". */
  readonly what = input.required<string>();
  readonly loading = input(false);
  readonly failed = input(false);
  /** Why it failed, when the server said something more useful than that it did. */
  readonly reason = input<string | null>(null);
  /** Other work the same bar shows while it runs ("Saving settings"), or null. */
  readonly working = input<string | null>(null);
  readonly retry = output<void>();

  /** The bar's name for screen readers, or null when there is no bar. */
  protected readonly label = computed(() => (this.loading() ? `Loading ${this.what()}` : this.working()));
  protected readonly failedText = computed(() => {
    const what = this.what();
    const said = `${what.charAt(0).toUpperCase()}${what.slice(1)} could not be loaded.`;
    const why = this.reason();
    return why ? `${said} ${why}` : said;
  });
}
