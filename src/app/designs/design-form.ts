import { ChangeDetectionStrategy, Component, DestroyRef, effect, inject, input, output, untracked } from '@angular/core';
import { takeUntilDestroyed } from '@angular/core/rxjs-interop';
import { AbstractControl, FormArray, FormControl, FormGroup, ReactiveFormsModule, ValidationErrors, Validators } from '@angular/forms';
import { MatButtonModule } from '@angular/material/button';
import { MatCheckboxModule } from '@angular/material/checkbox';
import { MatFormFieldModule } from '@angular/material/form-field';
import { MatIconModule } from '@angular/material/icon';
import { MatInputModule } from '@angular/material/input';
import { MatSelectModule } from '@angular/material/select';
import { BLOCK_KINDS, BLOCK_KIND_LABELS, BlockKind, DesignBody, Length, LengthUnit, tryParseLength } from '@keepstitch/shared';
import { debounceTime } from 'rxjs';

import { StockSource } from './design';

type BlockGroup = FormGroup<{
  id: FormControl<string>;
  name: FormControl<string>;
  kind: FormControl<BlockKind>;
  units: FormControl<number>;
  blades: FormControl<number>;
  outer: FormControl<string>;
  inner: FormControl<string>;
}>;

const unitOf = (units: 'imperial' | 'metric'): LengthUnit => (units === 'imperial' ? 'in' : 'cm');

/** A stored length shown for editing in the maker's unit ("12", "30.5"). */
export function lengthForEditing(mm: string | undefined | null, units: 'imperial' | 'metric'): string {
  if (!mm) return '';
  return Length.millimetres(mm).to(unitOf(units)).toDecimalPlaces(4).toString();
}

/** Typed text to exact millimetres, or null when it cannot be read. */
export function millimetresOf(text: string, units: 'imperial' | 'metric'): string | null {
  if (text.trim() === '') return null;
  const parsed = tryParseLength(text, unitOf(units));
  return parsed.ok && parsed.length.mm.gt(0) ? parsed.length.mm.toString() : null;
}

function lengthValidator(form: () => 'imperial' | 'metric', required = true) {
  return (c: AbstractControl<string>): ValidationErrors | null => {
    const text = c.value ?? '';
    if (text.trim() === '') return required ? { required: true } : null;
    const parsed = tryParseLength(text, unitOf(form()));
    return parsed.ok ? null : { length: parsed.error.message };
  };
}

function lengthsValidator(form: () => 'imperial' | 'metric') {
  return (c: AbstractControl<string>): ValidationErrors | null => {
    const parts = (c.value ?? '').split(',').map((s) => s.trim()).filter(Boolean);
    for (const p of parts) {
      const parsed = tryParseLength(p, unitOf(form()));
      if (!parsed.ok) return { length: `"${p}": ${parsed.error.message}` };
    }
    return null;
  };
}

/** The design's size, layout, blocks and finishing, as a typed form; emits a design body while valid. */
@Component({
  selector: 'ks-design-form',
  imports: [ReactiveFormsModule, MatFormFieldModule, MatInputModule, MatSelectModule, MatCheckboxModule, MatButtonModule, MatIconModule],
  templateUrl: './design-form.html',
  styleUrl: './design-form.scss',
  changeDetection: ChangeDetectionStrategy.OnPush,
})
export class DesignForm {
  private readonly destroyRef = inject(DestroyRef);

  /** The design to start from; assignments are kept as they are. */
  readonly design = input.required<DesignBody>();
  readonly stock = input<readonly StockSource[]>([]);
  readonly designChange = output<DesignBody>();

  protected readonly kinds = BLOCK_KINDS;
  protected readonly kindLabels = BLOCK_KIND_LABELS;

  protected readonly form = new FormGroup({
    units: new FormControl<'imperial' | 'metric'>('imperial', { nonNullable: true }),
    targetWidth: new FormControl('', { nonNullable: true, validators: [lengthValidator(() => this.units())] }),
    targetLength: new FormControl('', { nonNullable: true, validators: [lengthValidator(() => this.units())] }),
    setting: new FormControl<'straight' | 'on-point'>('straight', { nonNullable: true }),
    rows: new FormControl(4, { nonNullable: true, validators: [Validators.required, Validators.min(1), Validators.max(60)] }),
    columns: new FormControl(4, { nonNullable: true, validators: [Validators.required, Validators.min(1), Validators.max(60)] }),
    block: new FormControl('', { nonNullable: true, validators: [lengthValidator(() => this.units())] }),
    sashing: new FormControl('', { nonNullable: true, validators: [lengthValidator(() => this.units(), false)] }),
    cornerstones: new FormControl(true, { nonNullable: true }),
    borders: new FormControl('', { nonNullable: true, validators: [lengthsValidator(() => this.units())] }),
    blocks: new FormArray<BlockGroup>([]),
    pattern: new FormControl('A', { nonNullable: true, validators: [Validators.required] }),
    bindingStockId: new FormControl<number | null>(null),
    bindingStrip: new FormControl('2.5', { nonNullable: true, validators: [lengthValidator(() => this.units())] }),
    backingStockId: new FormControl<number | null>(null),
    waddingStockId: new FormControl<number | null>(null),
    prewash: new FormControl(true, { nonNullable: true }),
    shrinkPercent: new FormControl(3, { nonNullable: true, validators: [Validators.min(0), Validators.max(19)] }),
    minimumPerGarment: new FormControl(0, { nonNullable: true, validators: [Validators.min(0), Validators.max(100)] }),
  });

  private loadedFrom: DesignBody | null = null;

  private units(): 'imperial' | 'metric' {
    // Validators first run while the form is still being built.
    const form = this.form as typeof this.form | undefined;
    return form?.controls.units.value ?? 'imperial';
  }

  constructor() {
    effect(() => {
      const d = this.design();
      untracked(() => {
        if (d !== this.loadedFrom && !this.isOwnEmission(d)) this.load(d);
      });
    });
    this.form.valueChanges.pipe(debounceTime(150), takeUntilDestroyed(this.destroyRef)).subscribe(() => this.emit());
  }

  private lastEmitted: DesignBody | null = null;
  private isOwnEmission(d: DesignBody): boolean {
    return d === this.lastEmitted;
  }

  protected get blocks(): FormArray<BlockGroup> {
    return this.form.controls.blocks;
  }

  private blockGroup(b: DesignBody['blocks'][number], units: 'imperial' | 'metric'): BlockGroup {
    return new FormGroup({
      id: new FormControl(b.id, { nonNullable: true }),
      name: new FormControl(b.name, { nonNullable: true, validators: [Validators.required, Validators.maxLength(100)] }),
      kind: new FormControl<BlockKind>(b.kind, { nonNullable: true }),
      units: new FormControl(b.units ?? (b.kind === 'flying-geese' ? 2 : 1), { nonNullable: true, validators: [Validators.min(1), Validators.max(12)] }),
      blades: new FormControl(b.blades ?? (b.kind === 'fan' ? 5 : 20), { nonNullable: true, validators: [Validators.min(3), Validators.max(120)] }),
      outer: new FormControl(lengthForEditing(b.outerRadiusMm, units), { nonNullable: true, validators: [lengthValidator(() => this.units(), false)] }),
      inner: new FormControl(lengthForEditing(b.innerRadiusMm, units), { nonNullable: true, validators: [lengthValidator(() => this.units(), false)] }),
    });
  }

  private load(d: DesignBody): void {
    this.loadedFrom = d;
    const u = d.units;
    this.blocks.clear({ emitEvent: false });
    for (const b of d.blocks) this.blocks.push(this.blockGroup(b, u), { emitEvent: false });
    this.form.patchValue(
      {
        units: u,
        targetWidth: lengthForEditing(d.target.widthMm, u),
        targetLength: lengthForEditing(d.target.lengthMm, u),
        setting: d.layout.setting,
        rows: d.layout.rows,
        columns: d.layout.columns,
        block: lengthForEditing(d.layout.blockMm, u),
        sashing: lengthForEditing(d.layout.sashing?.widthMm, u),
        cornerstones: d.layout.sashing?.cornerstones ?? true,
        borders: d.layout.borders.map((b) => lengthForEditing(b, u)).join(', '),
        pattern: d.pattern.join(' '),
        bindingStockId: d.finishing.bindingStockId,
        bindingStrip: lengthForEditing(d.finishing.bindingStripMm, u),
        backingStockId: d.finishing.backingStockId,
        waddingStockId: d.finishing.waddingStockId,
        prewash: d.finishing.prewash,
        shrinkPercent: Number(d.finishing.shrinkPercent),
        minimumPerGarment: d.rules.minimumPerGarment,
      },
      { emitEvent: false },
    );
  }

  protected addBlock(): void {
    const used = new Set(this.blocks.controls.map((c) => c.controls.id.value));
    const id = 'ABCDEFGHIJKL'.split('').find((l) => !used.has(l));
    if (!id) return;
    this.blocks.push(this.blockGroup({ id, name: `Block ${id}`, kind: 'square' }, this.units()));
  }

  protected removeBlock(i: number): void {
    if (this.blocks.length > 1) this.blocks.removeAt(i);
  }

  /** The body the form describes, or null while a field is wrong. */
  value(): DesignBody | null {
    if (this.form.invalid) return null;
    const v = this.form.getRawValue();
    const u = v.units;
    const mm = (t: string) => millimetresOf(t, u);
    const base = this.loadedFrom ?? this.design();
    const ids = v.blocks.map((b) => b.id);
    const pattern = v.pattern.split(/[\s,]+/).map((s) => s.trim().toUpperCase()).filter(Boolean);
    if (pattern.some((p) => !ids.includes(p))) return null;
    return {
      units: u,
      target: { preset: base.target.preset, dropMm: base.target.dropMm, widthMm: mm(v.targetWidth)!, lengthMm: mm(v.targetLength)! },
      layout: {
        setting: v.setting,
        rows: v.rows,
        columns: v.columns,
        blockMm: mm(v.block)!,
        sashing: v.sashing.trim() && v.setting === 'straight' ? { widthMm: mm(v.sashing)!, cornerstones: v.cornerstones } : null,
        borders: v.borders.split(',').map((s) => s.trim()).filter(Boolean).map((s) => mm(s)!),
      },
      blocks: v.blocks.map((b) => ({
        id: b.id,
        name: b.name,
        kind: b.kind,
        ...(['rectangles', 'hst', 'qst', 'flying-geese'].includes(b.kind) ? { units: b.units } : {}),
        ...(b.kind === 'plate' || b.kind === 'fan' ? { blades: b.blades, ...(mm(b.outer) ? { outerRadiusMm: mm(b.outer)! } : {}), ...(mm(b.inner) ? { innerRadiusMm: mm(b.inner)! } : {}) } : {}),
      })),
      pattern,
      assignments: base.assignments,
      finishing: { bindingStockId: v.bindingStockId, bindingStripMm: mm(v.bindingStrip)!, backingStockId: v.backingStockId, waddingStockId: v.waddingStockId, prewash: v.prewash, shrinkPercent: String(v.shrinkPercent) },
      rules: { minimumPerGarment: v.minimumPerGarment },
    };
  }

  protected patternProblem(): string | null {
    const ids = this.blocks.controls.map((c) => c.controls.id.value);
    const bad = this.form.controls.pattern.value.split(/[\s,]+/).map((s) => s.trim().toUpperCase()).filter((p) => p && !ids.includes(p));
    return bad.length ? `No block ${bad.join(', ')} in the design.` : null;
  }

  private emit(): void {
    const body = this.value();
    if (!body) return;
    this.lastEmitted = body;
    this.loadedFrom = body;
    this.designChange.emit(body);
  }

  protected errorOf(c: AbstractControl): string | null {
    if (c.hasError('required')) return 'Required.';
    if (c.hasError('length')) return c.getError('length') as string;
    if (c.hasError('min') || c.hasError('max')) return 'Out of range.';
    return null;
  }
}
