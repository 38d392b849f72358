import { ChangeDetectionStrategy, Component, DestroyRef, effect, inject, input, output, signal, untracked } from '@angular/core';
import type { Observable, Subscription } from 'rxjs';
import { MatButtonModule } from '@angular/material/button';
import { MatIconModule } from '@angular/material/icon';
import { RouterLink } from '@angular/router';

import { LoadStatus } from '../shared/load-status';

/** Where a print page's loading stands. */
export type PrintState = 'loading' | 'ready' | 'failed';

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
  readonly state = input.required<PrintState>();
  readonly retry = output<void>();

  protected print(): void {
    window.print();
  }
}

/**
 * What a print page loads, with the state its bar shows and a way to load it
 * again. Create it in a field initialiser: it loads at once and again when
 * what `fetch` reads changes (the commission id), and stops with the page.
 */
export class PrintLoad<T> {
  readonly value = signal<T | null>(null);
  readonly state = signal<PrintState>('loading');
  private running?: Subscription;

  constructor(private readonly fetch: () => Observable<T>) {
    effect(() => {
      const request = this.fetch();
      untracked(() => this.start(request));
    });
    inject(DestroyRef).onDestroy(() => this.running?.unsubscribe());
  }

  reload(): void {
    this.start(untracked(() => this.fetch()));
  }

  private start(request: Observable<T>): void {
    this.running?.unsubscribe();
    this.state.set('loading');
    this.running = request.subscribe({
      next: (v) => {
        this.value.set(v);
        this.state.set('ready');
      },
      error: () => this.state.set('failed'),
    });
  }
}
