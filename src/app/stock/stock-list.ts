import { ChangeDetectionStrategy, Component, computed, inject, signal } from '@angular/core';
import { toSignal } from '@angular/core/rxjs-interop';
import { FormControl, FormGroup, ReactiveFormsModule, Validators } from '@angular/forms';
import { MatButtonModule } from '@angular/material/button';
import { MatDialog } from '@angular/material/dialog';
import { MatFormFieldModule } from '@angular/material/form-field';
import { MatIconModule } from '@angular/material/icon';
import { MatInputModule } from '@angular/material/input';
import { MatSelectModule } from '@angular/material/select';
import { MatTableModule } from '@angular/material/table';
import { FIBRE, Fibre, Length, STOCK_TEXT_LIMITS, formatFabricLength } from '@keepstitch/shared';

import { apiErrorOf, messageFor } from '../core/api-error';
import { Auth } from '../core/auth';
import { Notices } from '../core/notices';
import { lengthText, readingText, showMillimetres } from '../ui/length-text';
import { LoadStatus } from '../ui/load-status';
import { applyServerFieldErrors } from '../ui/server-field-errors';
import { DeleteStockDialog, DeleteStockDialogData } from './delete-stock-dialog';
import { StockApi } from './stock-api';
import { StockDraft, StockItem } from './stock-item';

const POUNDS = /^\d{1,6}(\.\d{1,2})?$/;

function toPence(pounds: string): number {
  const [whole, fraction = ''] = pounds.trim().split('.');
  return Number(whole) * 100 + Number((fraction + '00').slice(0, 2));
}

function orNull(value: string): string | null {
  return value.trim() === '' ? null : value.trim();
}

/**
 * The studio's fabrics for backing, binding, sashing and borders. The owner
 * adds, changes and removes them; the workroom reads the list (without costs).
 */
@Component({
  selector: 'ks-stock-list',
  imports: [
    ReactiveFormsModule,
    MatTableModule,
    MatFormFieldModule,
    MatInputModule,
    MatSelectModule,
    MatButtonModule,
    MatIconModule,
    LoadStatus,
  ],
  templateUrl: './stock-list.html',
  styleUrl: './stock-list.scss',
  changeDetection: ChangeDetectionStrategy.OnPush,
})
export class StockList {
  private readonly api = inject(StockApi);
  private readonly notices = inject(Notices);
  private readonly dialog = inject(MatDialog);
  private readonly auth = inject(Auth);

  protected readonly fibres = FIBRE.options;
  protected readonly fibreLabels: Readonly<Record<string, string>> = FIBRE.labels;
  /** Only the owner changes the shelves or sees what the fabric cost. */
  protected readonly isOwner = computed(() => this.auth.role() === 'owner');
  protected readonly columns = computed(() =>
    this.isOwner() ? ['name', 'fibre', 'width', 'length', 'cost', 'supplier', 'actions'] : ['name', 'fibre', 'width', 'length', 'notes'],
  );
  protected readonly showMillimetres = showMillimetres;

  protected readonly items = signal<StockItem[]>([]);
  protected readonly loading = signal(true);
  protected readonly failed = signal(false);
  protected readonly formOpen = signal(false);
  protected readonly editing = signal<StockItem | null>(null);
  protected readonly saving = signal(false);
  protected readonly formError = signal<string | null>(null);

  private readonly unitOf = () => this.form.controls.unit.value;
  protected readonly form = new FormGroup({
    name: new FormControl('', { nonNullable: true, validators: [Validators.required, Validators.maxLength(STOCK_TEXT_LIMITS.name)] }),
    colour: new FormControl('', { nonNullable: true }),
    fibre: new FormControl<Fibre | null>(null),
    width: new FormControl('', { nonNullable: true, validators: [lengthText(this.unitOf, true)] }),
    length: new FormControl('', { nonNullable: true, validators: [lengthText(this.unitOf, true)] }),
    unit: new FormControl<'in' | 'cm' | 'm' | 'yd'>('in', { nonNullable: true }),
    cost: new FormControl('', { nonNullable: true, validators: [Validators.pattern(POUNDS)] }),
    costUnit: new FormControl<'metre' | 'yard'>('metre', { nonNullable: true }),
    supplier: new FormControl('', { nonNullable: true }),
    notes: new FormControl('', { nonNullable: true }),
  });
  private readonly value = toSignal(this.form.valueChanges, { initialValue: this.form.getRawValue() });
  protected readonly widthReading = computed(() => readingText(this.value().width ?? '', this.value().unit ?? 'in'));
  protected readonly lengthReading = computed(() => readingText(this.value().length ?? '', this.value().unit ?? 'in'));
  protected readonly status = computed(() => {
    if (this.loading()) return 'Loading studio fabric…';
    if (this.failed()) return 'The studio fabric could not be loaded.';
    const n = this.items().length;
    return n === 0 ? 'No studio fabric yet.' : `${n} fabric${n === 1 ? '' : 's'}.`;
  });

  constructor() {
    this.form.controls.unit.valueChanges.subscribe(() => {
      this.form.controls.width.updateValueAndValidity();
      this.form.controls.length.updateValueAndValidity();
    });
    this.load();
  }

  protected load(): void {
    this.loading.set(true);
    this.failed.set(false);
    this.api.list().subscribe({
      next: (items) => {
        this.items.set(items);
        this.loading.set(false);
      },
      error: () => {
        this.failed.set(true);
        this.loading.set(false);
      },
    });
  }

  protected onHand(item: StockItem): string {
    const length = Length.millimetres(item.lengthMm);
    return `${formatFabricLength(length, 'm')} (${formatFabricLength(length, 'yd')})`;
  }

  protected cost(item: StockItem): string {
    if (item.costPence === null || item.costPence === undefined) return '';
    return `£${(item.costPence / 100).toFixed(2)} per ${item.costUnit ?? 'metre'}`;
  }

  protected addFabric(): void {
    this.editing.set(null);
    this.form.reset();
    this.formError.set(null);
    this.formOpen.set(true);
  }

  protected editFabric(item: StockItem): void {
    this.editing.set(item);
    this.formError.set(null);
    this.form.reset({
      name: item.name,
      colour: item.colour ?? '',
      fibre: item.fibre ?? null,
      width: `${showMillimetres(item.widthMm).split(' (')[0]}`,
      length: formatFabricLength(Length.millimetres(item.lengthMm), 'm'),
      unit: 'in',
      cost: item.costPence === null || item.costPence === undefined ? '' : (item.costPence / 100).toFixed(2),
      costUnit: item.costUnit ?? 'metre',
      supplier: item.supplier ?? '',
      notes: item.notes ?? '',
    });
    this.formOpen.set(true);
  }

  protected closeForm(): void {
    this.formOpen.set(false);
    this.editing.set(null);
  }

  protected saveFabric(): void {
    this.formError.set(null);
    if (this.form.invalid) {
      this.form.markAllAsTouched();
      return;
    }
    const v = this.form.getRawValue();
    const c = this.form.controls;
    const editing = this.editing();
    const draft: StockDraft = {
      name: v.name.trim(),
      colour: orNull(v.colour),
      fibre: v.fibre,
      costPence: v.cost.trim() ? toPence(v.cost) : null,
      costUnit: v.cost.trim() ? v.costUnit : null,
      supplier: orNull(v.supplier),
      notes: orNull(v.notes),
    };
    // An edit sends a length only when it was changed, so it is not re-rounded.
    if (!editing || c.width.dirty || c.unit.dirty) draft.width = v.width.trim();
    if (!editing || c.length.dirty || c.unit.dirty) draft.length = v.length.trim();
    if (draft.width || draft.length) draft.unit = v.unit;
    this.saving.set(true);
    const request = editing ? this.api.update(editing.id, draft) : this.api.create(draft);
    request.subscribe({
      next: (item) => {
        this.saving.set(false);
        this.notices.info(`“${item.name}” saved.`);
        this.closeForm();
        this.load();
      },
      error: (error: unknown) => {
        this.saving.set(false);
        const fields = { ...apiErrorOf(error)?.fields };
        if (fields['costPence']) fields['cost'] = fields['costPence'];
        applyServerFieldErrors(this.form, fields);
        this.formError.set(messageFor(error));
      },
    });
  }

  protected deleteFabric(item: StockItem): void {
    this.dialog
      .open<DeleteStockDialog, DeleteStockDialogData, boolean>(DeleteStockDialog, { data: { name: item.name } })
      .afterClosed()
      .subscribe((yes) => {
        if (!yes) return;
        this.api.remove(item.id).subscribe({
          next: () => {
            this.notices.info(`“${item.name}” removed.`);
            this.load();
          },
        });
      });
  }
}
