import { ChangeDetectionStrategy, Component, inject, input, output, signal } from '@angular/core';
import { MatButtonModule } from '@angular/material/button';
import { MatFormFieldModule } from '@angular/material/form-field';
import { MatInputModule } from '@angular/material/input';

import { messageFor } from '../core/api-error';
import { showDateTime } from '../ui/dates';
import { SettingsApi } from './settings-api';

/**
 * The calendar feed of deadlines: its address holds a secret, shown once when
 * it is made. Making a new one stops the old; turning it off stops them all.
 */
@Component({
  selector: 'ks-calendar-feed-settings',
  imports: [MatButtonModule, MatFormFieldModule, MatInputModule],
  template: `
    <section class="feed" aria-labelledby="feed-heading">
      <h2 id="feed-heading">Calendar feed of deadlines</h2>
      <p class="hint">
        Subscribe to this address in a calendar app to see each commission's deadline as an all-day event with its stage. It names no client. Anyone with the
        address can read it: if it gets out, make a new one.
      </p>
      @if (url(); as address) {
        <mat-form-field class="address">
          <mat-label>Feed address</mat-label>
          <input matInput readonly [value]="address" (focus)="selectAll($event)" />
          <mat-hint>Copy it now: it is shown only this once.</mat-hint>
        </mat-form-field>
      } @else if (madeAt(); as made) {
        <p>A feed address was made on {{ showDateTime(made) }}. It is not shown again; make a new one to see an address.</p>
      } @else {
        <p>There is no feed address yet.</p>
      }
      @if (error(); as message) {
        <div class="form-error" role="alert">{{ message }}</div>
      }
      <div class="actions">
        <button mat-stroked-button type="button" [disabled]="busy()" (click)="makeFeed()">{{ madeAt() ? 'Make a new address (the old one stops working)' : 'Make a feed address' }}</button>
        @if (madeAt()) {
          <button mat-button type="button" [disabled]="busy()" (click)="stopFeed()">Turn the feed off</button>
        }
      </div>
    </section>
  `,
  styles: `
    .feed {
      margin-top: 2rem;
      max-width: 44rem;
    }
    .address {
      width: 100%;
    }
    .hint {
      color: var(--mat-sys-on-surface-variant);
    }
    .form-error {
      margin-bottom: 0.5rem;
      padding: 0.75rem 1rem;
      border-radius: var(--mat-sys-corner-small);
      background: var(--mat-sys-error-container);
      color: var(--mat-sys-on-error-container);
    }
    .actions {
      display: flex;
      flex-wrap: wrap;
      gap: 0.5rem;
    }
  `,
  changeDetection: ChangeDetectionStrategy.OnPush,
})
export class CalendarFeedSettings {
  private readonly api = inject(SettingsApi);

  readonly madeAt = input<string | null>(null);
  readonly madeAtChange = output<string | null>();

  protected readonly showDateTime = showDateTime;
  protected readonly url = signal<string | null>(null);
  protected readonly busy = signal(false);
  protected readonly error = signal<string | null>(null);

  protected makeFeed(): void {
    this.run(() =>
      this.api.makeCalendarFeed().subscribe({
        next: (feed) => {
          this.url.set(feed.url);
          this.madeAtChange.emit(feed.madeAt);
          this.busy.set(false);
        },
        error: (e: unknown) => this.fail(e),
      }),
    );
  }

  protected stopFeed(): void {
    this.run(() =>
      this.api.stopCalendarFeed().subscribe({
        next: () => {
          this.url.set(null);
          this.madeAtChange.emit(null);
          this.busy.set(false);
        },
        error: (e: unknown) => this.fail(e),
      }),
    );
  }

  protected selectAll(event: FocusEvent): void {
    (event.target as HTMLInputElement).select();
  }

  private run(start: () => void): void {
    this.error.set(null);
    this.busy.set(true);
    start();
  }

  private fail(e: unknown): void {
    this.busy.set(false);
    this.error.set(messageFor(e));
  }
}
