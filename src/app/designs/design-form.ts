import { ChangeDetectionStrategy, Component, DestroyRef, effect, inject, input, output, untracked } from '@angular/core';
import { takeUntilDestroyed } from '@angular/core/rxjs-interop';
import { AbstractControl, FormArray, FormControl, FormGroup, ReactiveFormsModule, ValidationErrors, Validators } from '@angular/forms';
import { MatButtonModule } from '@angular/material/button';
import { MatCheckboxModule } from '@angular/material/checkbox';
import { MatFormFieldModule } from '@angular/material/form-field';
import { MatIconModule } from '@angular/material/icon';
import { MatInputModule } from '@angular/material/input';
import { MatSelectModule } from '@angular/material/select';
import { BLOCK_KINDS, DESIGN_TEXT_LIMITS, BLOCK_KIND_LABELS, BlockKind, BlockParams, BlockSpec, DesignBody, DomainError, Length, Size, TYPICAL_DROP, formatLength, KindInput, blockInputsByName, blockKind, tryParseLength } from '@keepstitch/shared';
import { debounceTime } from 'rxjs';

import { unitOf, lengthForEditing, lengthAsMeasured, millimetresOf, lengthValidator, lengthsValidator, sameButFabrics, PRESET_GROUPS, presetOf, lengthOrZero, bedQuiltSize, bedGives } from './design-lengths';
import { StockSource } from './design';

/** A block input's control: a count as a number, a length as typed in the maker's unit, a choice as its value. */
type ParamControl = FormControl<number | string>;

type BlockGroup = FormGroup<{
  id: FormControl<string>;
  name: FormControl<string>;
  kind: FormControl<BlockKind>;
  /** A control for every input any block kind has, by the field it sets, so changing the kind keeps what was typed. */
  params: FormGroup<Record<string, ParamControl>>;
}>;

/** Every block kind's inputs by the field they set (kinds sharing a field declare it alike). */
const INPUTS_BY_NAME = blockInputsByName();

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

  /** The design to start from; its groups and assignments are kept as they are. */
  readonly design = input.required<DesignBody>();
  readonly stock = input<readonly StockSource[]>([]);
  readonly designChange = output<DesignBody>();

  protected readonly kinds = BLOCK_KINDS;
  protected readonly presetGroups = PRESET_GROUPS;
  protected readonly kindLabels = BLOCK_KIND_LABELS;

  protected readonly form = new FormGroup({
    units: new FormControl<'imperial' | 'metric'>('imperial', { nonNullable: true }),
    /** A bed preset (the size comes from the mattress, drop and tuck), or null for a typed size. */
    preset: new FormControl<string | null>(null),
    drop: new FormControl('', { nonNullable: true, validators: [(c) => this.bedProblem(c, 'drop')] }),
    pillowTuck: new FormControl('', { nonNullable: true, validators: [(c) => this.bedProblem(c, 'pillow tuck')] }),
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
        if (d === this.loadedFrom || this.isOwnEmission(d)) return;
        // Only the fabrics moved (the fabric board): keep what is being typed, send the new groups and assignments with it.
        if (this.loadedFrom && sameButFabrics(d, this.loadedFrom)) this.loadedFrom = d;
        else this.load(d);
      });
    });
    const c = this.form.controls;
    for (const ctrl of [c.preset, c.drop, c.pillowTuck, c.units] as AbstractControl[]) {
      ctrl.valueChanges.pipe(takeUntilDestroyed(this.destroyRef)).subscribe(() => this.applyBed());
    }
    this.form.valueChanges.pipe(debounceTime(150), takeUntilDestroyed(this.destroyRef)).subscribe(() => this.emit());
  }

  /** Errors of the drop and pillow tuck, read against the chosen bed. */
  private bedProblem(c: AbstractControl<string>, field: 'drop' | 'pillow tuck'): ValidationErrors | null {
    const form = this.form as typeof this.form | undefined;
    if (!form?.controls.preset.value) return null;
    const text = c.value ?? '';
    if (field === 'drop' && text.trim() === '') return { required: true };
    const parsed = text.trim() === '' ? null : tryParseLength(text, unitOf(this.units()), { allowZero: true });
    if (parsed && !parsed.ok) return { length: parsed.error.message };
    try {
      const length = parsed?.ok ? parsed.length : Length.zero;
      bedQuiltSize(form.controls.preset.value, field === 'drop' ? length : Length.zero, field === 'pillow tuck' ? length : Length.zero);
      return null;
    } catch (err) {
      if (err instanceof DomainError) return { length: err.message };
      throw err;
    }
  }

  /** The chosen bed's size, or null when there is no bed or its drop or tuck cannot be read. */
  private bedSize(): Size | null {
    const v = this.form.getRawValue();
    if (!v.preset) return null;
    const drop = v.drop.trim() === '' ? null : lengthOrZero(v.drop, v.units);
    const tuck = lengthOrZero(v.pillowTuck, v.units);
    if (!drop || !tuck) return null;
    try {
      return bedQuiltSize(v.preset, drop, tuck);
    } catch {
      return null;
    }
  }

  /** With a bed chosen, the target follows it and cannot be typed; without one, it is typed. */
  private applyBed(): void {
    const c = this.form.controls;
    const quiet = { emitEvent: false };
    c.drop.updateValueAndValidity(quiet);
    c.pillowTuck.updateValueAndValidity(quiet);
    if (!c.preset.value) {
      c.targetWidth.enable(quiet);
      c.targetLength.enable(quiet);
      return;
    }
    const size = this.bedSize();
    if (size) {
      const u = c.units.value;
      // Shown only: with a bed chosen, the target sent is the bed maths' exact size, not this text.
      c.targetWidth.setValue(lengthAsMeasured(size.width, u), quiet);
      c.targetLength.setValue(lengthAsMeasured(size.height, u), quiet);
    }
    c.targetWidth.disable(quiet);
    c.targetLength.disable(quiet);
  }

  /** A first drop for a newly chosen bed: the low end of the usual range for beds, none for cots. */
  protected presetChosen(id: string | null): void {
    const preset = presetOf(id);
    if (!preset || this.form.controls.drop.value.trim() !== '') return;
    const drop = preset.kind === 'bed' ? TYPICAL_DROP.min : Length.zero;
    this.form.controls.drop.setValue(lengthForEditing(drop.mm.toString(), this.units()) || '0');
  }

  /** "Mattress 135 x 190 cm, plus the drop on both sides and the foot, plus the tuck." */
  protected bedHint(): string | null {
    const preset = presetOf(this.form.controls.preset.value);
    if (!preset) return null;
    const u = this.form.controls.units.value;
    return `Mattress ${formatLength(preset.size.width, u)} × ${formatLength(preset.size.height, u)}, plus the drop on both sides and the foot, plus any pillow tuck at the head.`;
  }

  private lastEmitted: DesignBody | null = null;
  private isOwnEmission(d: DesignBody): boolean {
    return d === this.lastEmitted;
  }

  protected get blocks(): FormArray<BlockGroup> {
    return this.form.controls.blocks;
  }

  private blockGroup(b: BlockSpec, units: 'imperial' | 'metric'): BlockGroup {
    const own = new Map(blockKind(b.kind).inputs.map((i) => [i.name, i]));
    const stored: Readonly<Record<string, number | string | undefined>> = { ...b };
    const params: Record<string, ParamControl> = {};
    for (const [name, inputs] of INPUTS_BY_NAME) {
      const input = own.get(name) ?? inputs[0]!;
      params[name] = this.paramControl(input, stored[name], units);
    }
    return new FormGroup({
      id: new FormControl(b.id, { nonNullable: true }),
      name: new FormControl(b.name, { nonNullable: true, validators: [Validators.required, Validators.maxLength(DESIGN_TEXT_LIMITS.blockName)] }),
      kind: new FormControl<BlockKind>(b.kind, { nonNullable: true }),
      params: new FormGroup(params),
    });
  }

  /** The control of one block input, holding the stored value (or the kind's default for a new block). */
  private paramControl(input: KindInput, stored: number | string | undefined, units: 'imperial' | 'metric'): ParamControl {
    switch (input.type) {
      case 'count':
        return new FormControl<number | string>(stored ?? input.default, { nonNullable: true, validators: [Validators.min(input.min), Validators.max(input.max)] });
      case 'length':
        return new FormControl<number | string>(lengthForEditing(stored as string | undefined, units), { nonNullable: true, validators: [lengthValidator(() => this.units(), false)] });
      case 'choice':
        return new FormControl<number | string>(stored ?? input.default, { nonNullable: true });
    }
  }

  /** The inputs the form shows for a block of this kind. */
  protected inputsOf(kind: BlockKind): readonly KindInput[] {
    return blockKind(kind).inputs;
  }

  /** A short number or length keeps a narrow field; one whose label is long gets room to be read whole. */
  protected fieldClass(input: KindInput): string {
    return input.label.length > 15 ? 'medium' : 'narrow';
  }

  /** What a block's inputs set, for its kind only: counts and choices as they are, lengths that can be read as millimetres. */
  private paramsOf(kind: BlockKind, params: Record<string, number | string>, mm: (t: string) => string | null): BlockParams {
    const out: Record<string, number | string> = {};
    for (const input of blockKind(kind).inputs) {
      const value = params[input.name]!;
      if (input.type !== 'length') out[input.name] = value;
      else if (mm(String(value))) out[input.name] = mm(String(value))!;
    }
    return out as BlockParams;
  }

  private load(d: DesignBody): void {
    this.loadedFrom = d;
    const u = d.units;
    // The tuck is not stored: it is what the length has beyond the mattress and the drop at the foot.
    // A stored size that the bed and drop do not give (a tuck below nothing, or a width that is not
    // the mattress plus two drops) is shown as the typed size it is, so opening and saving never changes it.
    const named = presetOf(d.target.preset);
    const namedDrop = named ? Length.millimetres(d.target.dropMm ?? '0') : Length.zero;
    const namedTuck = named ? Length.millimetres(d.target.lengthMm).minus(named.size.height).minus(namedDrop) : Length.zero;
    const preset = named && !namedTuck.isNegative() && bedGives(named.id, namedDrop, namedTuck, d.target.widthMm) ? named : undefined;
    const dropMm = preset ? namedDrop : Length.zero;
    const tuck = preset ? namedTuck : Length.zero;
    this.blocks.clear({ emitEvent: false });
    for (const b of d.blocks) this.blocks.push(this.blockGroup(b, u), { emitEvent: false });
    this.form.patchValue(
      {
        units: u,
        preset: preset?.id ?? null,
        drop: preset ? lengthForEditing(dropMm.mm.toString(), u) || '0' : '',
        pillowTuck: preset && tuck.gt(Length.zero) ? lengthForEditing(tuck.mm.toString(), u) : '',
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
    this.applyBed();
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
    const target = this.target(v.preset, v.drop, v.targetWidth, v.targetLength, u);
    if (!target) return null;
    return {
      units: u,
      target,
      layout: {
        setting: v.setting,
        rows: v.rows,
        columns: v.columns,
        blockMm: mm(v.block)!,
        sashing: v.sashing.trim() && v.setting === 'straight' ? { widthMm: mm(v.sashing)!, cornerstones: v.cornerstones } : null,
        borders: v.borders.split(',').map((s) => s.trim()).filter(Boolean).map((s) => mm(s)!),
      },
      blocks: v.blocks.map((b) => ({ id: b.id, name: b.name, kind: b.kind, ...this.paramsOf(b.kind, b.params, mm) })),
      pattern,
      groups: base.groups ?? [],
      assignments: base.assignments,
      finishing: { bindingStockId: v.bindingStockId, bindingStripMm: mm(v.bindingStrip)!, backingStockId: v.backingStockId, waddingStockId: v.waddingStockId, prewash: v.prewash, shrinkPercent: String(v.shrinkPercent) },
      rules: { minimumPerGarment: v.minimumPerGarment },
    };
  }

  private target(preset: string | null, drop: string, width: string, length: string, u: 'imperial' | 'metric'): DesignBody['target'] | null {
    if (preset) {
      const bed = this.bedSize();
      if (!bed) return null;
      return { preset, dropMm: lengthOrZero(drop, u)!.mm.toString(), widthMm: bed.width.mm.toString(), lengthMm: bed.height.mm.toString() };
    }
    return { preset: null, dropMm: null, widthMm: millimetresOf(width, u)!, lengthMm: millimetresOf(length, u)! };
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
