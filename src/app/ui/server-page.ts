import { DestroyRef, InjectionToken, Signal, computed, signal } from '@angular/core';
import { takeUntilDestroyed } from '@angular/core/rxjs-interop';
import type { MatPaginator } from '@angular/material/paginator';
import type { MatSort } from '@angular/material/sort';
import { Observable, Subject, catchError, merge, of, share, startWith, switchMap, tap } from 'rxjs';

/** How long a list waits after the last key press in its filter before asking the server (ms). */
export const LIST_FILTER_DELAY = new InjectionToken<number>('LIST_FILTER_DELAY', {
  factory: () => 300,
});

/** What a list asks the server for besides its own filters: which page, how long, in which order. */
export interface PageRequest {
  page: number;
  pageSize: number;
  /** The column the table is sorted by, as Material's sort names it ('' when none). */
  sortBy: string;
  dir: 'asc' | 'desc';
}

/** How a list names what it holds, for the sentence a screen reader hears as it changes. */
export interface ListWords {
  /** "client", "commission". */
  one: string;
  /** "clients", "commissions". */
  many: string;
  /** What to say when the filters match nothing ("No clients match “ann”."). */
  noMatch: () => string;
}

/**
 * A table paged, sorted and filtered on the server: its rows, their total,
 * and whether a page is loading or could not be loaded. Connected once the
 * table's sort and paginator exist; then a new order or filter starts again
 * from the first page, and the latest request wins over any still running.
 */
export class ServerPage<T> {
  readonly rows = signal<T[]>([]);
  readonly total = signal(0);
  readonly loading = signal(true);
  readonly failed = signal(false);
  /** Whether the request in hand was narrowed by any of the list's filters (the list sets it as it asks). */
  readonly filtered = signal(false);
  /** Loaded, empty, and not because of a filter: the list has nothing yet. */
  readonly nothingYet = computed(() => !this.loading() && !this.failed() && this.total() === 0 && !this.filtered());
  /** Loaded, empty, because of the filters. */
  readonly noMatches = computed(() => !this.loading() && !this.failed() && this.total() === 0 && this.filtered());
  private readonly retry = new Subject<void>();

  /** Where the list stands, in one sentence: loading, could not be loaded, empty, no matches, or how many. */
  status(words: ListWords): Signal<string> {
    return computed(() => {
      if (this.loading()) return `Loading ${words.many}…`;
      if (this.failed()) return `The ${words.many} could not be loaded.`;
      if (this.nothingYet()) return `No ${words.many} yet.`;
      if (this.noMatches()) return words.noMatch();
      const total = this.total();
      return total === 1 ? `1 ${words.one}.` : `${total} ${words.many}.`;
    });
  }

  /**
   * @param filterChange emits when the list's own filters change (debounced by the caller).
   * @param fetch asks the server for one page; it reads the filters itself.
   */
  connect(
    sort: MatSort,
    paginator: MatPaginator,
    filterChange: Observable<unknown>,
    fetch: (request: PageRequest) => Observable<{ items: T[]; total: number }>,
    destroyRef: DestroyRef,
  ): void {
    const filters = filterChange.pipe(share());
    merge(sort.sortChange, filters)
      .pipe(takeUntilDestroyed(destroyRef))
      .subscribe(() => (paginator.pageIndex = 0));

    merge(sort.sortChange, filters, paginator.page, this.retry)
      .pipe(
        startWith(null),
        tap(() => {
          this.loading.set(true);
          this.failed.set(false);
        }),
        switchMap(() =>
          fetch({ page: paginator.pageIndex, pageSize: paginator.pageSize, sortBy: sort.active, dir: sort.direction === 'desc' ? 'desc' : 'asc' }).pipe(
            catchError(() => of(null)),
          ),
        ),
        takeUntilDestroyed(destroyRef),
      )
      .subscribe((page) => {
        this.loading.set(false);
        if (page === null) {
          this.failed.set(true);
          this.rows.set([]);
          return;
        }
        this.rows.set(page.items);
        this.total.set(page.total);
      });
  }

  /** Asks for the same page again (after a failure). */
  reload(): void {
    this.retry.next();
  }
}
