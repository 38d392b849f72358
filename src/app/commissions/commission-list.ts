import {
  AfterViewInit,
  ChangeDetectionStrategy,
  Component,
  DestroyRef,
  computed,
  inject,
  viewChild,
} from '@angular/core';
import { FormControl, ReactiveFormsModule } from '@angular/forms';
import { MatButtonModule } from '@angular/material/button';
import { MatFormFieldModule } from '@angular/material/form-field';
import { MatIconModule } from '@angular/material/icon';
import { MatInputModule } from '@angular/material/input';
import { MatPaginator, MatPaginatorModule } from '@angular/material/paginator';
import { MatSelectModule } from '@angular/material/select';
import { MatSort, MatSortModule } from '@angular/material/sort';
import { MatTableModule } from '@angular/material/table';
import { Router, RouterLink } from '@angular/router';
import { ALL_STAGES, COMMISSION_KIND, STAGE_LABELS, Stage } from '@keepstitch/shared';
import { debounceTime, distinctUntilChanged, map, merge } from 'rxjs';

import { Auth } from '../core/auth';
import { LoadStatus } from '../ui/load-status';
import { LIST_FILTER_DELAY, ServerPage } from '../ui/server-page';
import { Commission, CommissionSortField, daysLeftText } from './commission';
import { showDate } from '../ui/dates';
import { CommissionsApi } from './commissions-api';

const sortFields: readonly CommissionSortField[] = ['deadline', 'createdAt', 'title', 'stage'];

/** The commissions, paged, sorted and filtered on the server; deadlines first by default. */
@Component({
  selector: 'ks-commission-list',
  imports: [
    ReactiveFormsModule,
    RouterLink,
    MatTableModule,
    MatSortModule,
    MatPaginatorModule,
    MatFormFieldModule,
    MatInputModule,
    MatSelectModule,
    MatButtonModule,
    MatIconModule,
    LoadStatus,
  ],
  templateUrl: './commission-list.html',
  styleUrl: './commission-list.scss',
  changeDetection: ChangeDetectionStrategy.OnPush,
})
export class CommissionList implements AfterViewInit {
  private readonly api = inject(CommissionsApi);
  private readonly auth = inject(Auth);
  private readonly router = inject(Router);
  private readonly destroyRef = inject(DestroyRef);
  private readonly filterDelay = inject(LIST_FILTER_DELAY);
  private readonly page = new ServerPage<Commission>();

  protected readonly paginator = viewChild.required(MatPaginator);
  protected readonly sort = viewChild.required(MatSort);

  protected readonly stageLabels: Readonly<Record<string, string>> = STAGE_LABELS;
  protected readonly kindLabels: Readonly<Record<string, string>> = COMMISSION_KIND.labels;
  protected readonly allStages = ALL_STAGES;
  protected readonly daysLeftText = daysLeftText;
  protected readonly showDate = showDate;
  protected readonly pageSizeOptions = [10, 25, 50, 100];
  protected readonly displayedColumns = ['client', 'title', 'kind', 'stage', 'deadline'];

  protected readonly filter = new FormControl('', { nonNullable: true });
  protected readonly stages = new FormControl<Stage[]>([], { nonNullable: true });
  protected readonly dueWithin = new FormControl<number | null>(null);

  protected readonly isOwner = computed(() => this.auth.role() === 'owner');
  protected readonly rows = this.page.rows;
  protected readonly total = this.page.total;
  protected readonly loading = this.page.loading;
  protected readonly failed = this.page.failed;
  protected readonly nothingYet = this.page.nothingYet;
  protected readonly noMatches = this.page.noMatches;
  protected readonly status = this.page.status({ one: 'commission', many: 'commissions', noMatch: () => 'No commissions match these filters.' });

  ngAfterViewInit(): void {
    const filterChange = merge(
      this.filter.valueChanges.pipe(debounceTime(this.filterDelay), map((t) => t.trim()), distinctUntilChanged()),
      this.stages.valueChanges,
      this.dueWithin.valueChanges.pipe(debounceTime(this.filterDelay), distinctUntilChanged()),
    );
    this.page.connect(
      this.sort(),
      this.paginator(),
      filterChange,
      ({ page, pageSize, sortBy, dir }) => {
        const q = this.filter.value.trim();
        const due = this.dueWithin.value;
        const dueWithinDays = due !== null && Number.isInteger(due) && due >= 0 ? due : null;
        this.page.filtered.set(q !== '' || this.stages.value.length > 0 || dueWithinDays !== null);
        return this.api.list({ page, pageSize, sort: sortFields.find((f) => f === sortBy) ?? 'deadline', dir, stages: this.stages.value, q, dueWithinDays });
      },
      this.destroyRef,
    );
  }

  protected openFromRow(row: Commission, event: MouseEvent): void {
    if ((event.target as Element | null)?.closest('a, button')) return;
    void this.router.navigate(['/commissions', row.id]);
  }

  protected newCommission(): void {
    void this.router.navigate(['/commissions/new']);
  }

  protected clearFilters(): void {
    this.filter.setValue('');
    this.stages.setValue([]);
    this.dueWithin.setValue(null);
  }

  protected loadAgain(): void {
    this.page.reload();
  }
}
