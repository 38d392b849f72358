import { DatePipe } from '@angular/common';
import {
  AfterViewInit,
  ChangeDetectionStrategy,
  Component,
  DestroyRef,
  computed,
  inject,
  signal,
  viewChild,
} from '@angular/core';
import { FormControl, ReactiveFormsModule } from '@angular/forms';
import { MatButtonModule } from '@angular/material/button';
import { MatFormFieldModule } from '@angular/material/form-field';
import { MatIconModule } from '@angular/material/icon';
import { MatInputModule } from '@angular/material/input';
import { MatPaginator, MatPaginatorModule } from '@angular/material/paginator';
import { MatSort, MatSortModule } from '@angular/material/sort';
import { MatTableModule } from '@angular/material/table';
import { ActivatedRoute, Router, RouterLink } from '@angular/router';
import { debounceTime, distinctUntilChanged, map, tap } from 'rxjs';

import { Auth } from '../core/auth';
import { LoadStatus } from '../ui/load-status';
import { LIST_FILTER_DELAY, ServerPage } from '../ui/server-page';
import { ClientRow, ClientSortField } from './client';
import { ClientsApi } from './clients-api';

const sortFields: readonly ClientSortField[] = ['name', 'email', 'createdAt'];

/**
 * The client records, paged, sorted and filtered on the server.
 * The owner sees contact details; the workroom sees names only.
 */
@Component({
  selector: 'ks-client-list',
  imports: [
    DatePipe,
    ReactiveFormsModule,
    RouterLink,
    MatTableModule,
    MatSortModule,
    MatPaginatorModule,
    MatFormFieldModule,
    MatInputModule,
    MatButtonModule,
    MatIconModule,
    LoadStatus,
  ],
  templateUrl: './client-list.html',
  styleUrl: './client-list.scss',
  changeDetection: ChangeDetectionStrategy.OnPush,
})
export class ClientList implements AfterViewInit {
  private readonly api = inject(ClientsApi);
  private readonly auth = inject(Auth);
  private readonly router = inject(Router);
  private readonly route = inject(ActivatedRoute);
  private readonly destroyRef = inject(DestroyRef);
  private readonly filterDelay = inject(LIST_FILTER_DELAY);
  private readonly page = new ServerPage<ClientRow>();

  protected readonly paginator = viewChild.required(MatPaginator);
  protected readonly sort = viewChild.required(MatSort);

  protected readonly pageSizeOptions = [10, 25, 50, 100];
  protected readonly filter = new FormControl('', { nonNullable: true });
  protected readonly isOwner = computed(() => this.auth.user()?.role === 'owner');
  protected readonly displayedColumns = computed(() =>
    this.isOwner() ? ['name', 'email', 'phone', 'createdAt'] : ['name'],
  );

  protected readonly rows = this.page.rows;
  protected readonly total = this.page.total;
  protected readonly loading = this.page.loading;
  protected readonly failed = this.page.failed;
  /** The filter text of the last request sent (not what is being typed). */
  protected readonly appliedFilter = signal('');

  protected readonly noClientsYet = this.page.nothingYet;
  protected readonly noMatches = this.page.noMatches;
  protected readonly status = this.page.status({ one: 'client', many: 'clients', noMatch: () => `No clients match “${this.appliedFilter()}”.` });

  ngAfterViewInit(): void {
    const filterChange = this.filter.valueChanges.pipe(
      debounceTime(this.filterDelay),
      map((text) => text.trim()),
      distinctUntilChanged(),
      tap((text) => {
        this.appliedFilter.set(text);
        this.page.filtered.set(text !== '');
      }),
    );
    this.page.connect(
      this.sort(),
      this.paginator(),
      filterChange,
      ({ page, pageSize, sortBy, dir }) =>
        this.api.list({ page, pageSize, sort: sortFields.find((field) => field === sortBy) ?? 'name', dir, q: this.appliedFilter() }),
      this.destroyRef,
    );
  }

  /** A click anywhere on an owner's row opens the record; the name link is the keyboard way in. */
  protected openFromRow(row: ClientRow, event: MouseEvent): void {
    const target = event.target as Element | null;
    if (!this.isOwner() || target?.closest('a, button')) {
      return;
    }
    void this.router.navigate([row.id], { relativeTo: this.route });
  }

  protected addClient(): void {
    void this.router.navigate(['new'], { relativeTo: this.route });
  }

  protected clearFilter(): void {
    this.filter.setValue('');
  }

  protected loadAgain(): void {
    this.page.reload();
  }
}
