import { CdkDrag, CdkDragDrop, CdkDropList, CdkDropListGroup } from '@angular/cdk/drag-drop';
import { ChangeDetectionStrategy, Component, computed, input, output, signal } from '@angular/core';
import { MatButtonModule } from '@angular/material/button';
import { MatIconModule } from '@angular/material/icon';
import { MatMenuModule } from '@angular/material/menu';
import { MatSelectModule } from '@angular/material/select';
import { MatTableModule } from '@angular/material/table';
import { Assignment, DesignBody, DesignDerivation, FabricRef, fabricKey } from '@keepstitch/shared';

import { Fabric, GarmentGroup, GarmentSource, groupColours, groupFabric, groupsOf, swatchBackground } from './design';
import { GarmentGroupForm } from './garment-group-form';

const ANY = 'any';
const ALL_GARMENTS = 'Any of the garments';

/**
 * Which fabric goes where: drag a garment, a group of garments or a studio
 * fabric onto a block position (or choose it from the block's menu), or choose
 * a fabric for each kind of piece in the table. Groups of garments are made
 * and changed here; the planner picks among a group's garments.
 */
@Component({
  selector: 'ks-fabric-board',
  imports: [CdkDropListGroup, CdkDropList, CdkDrag, MatButtonModule, MatIconModule, MatMenuModule, MatSelectModule, MatTableModule, GarmentGroupForm],
  templateUrl: './fabric-board.html',
  styleUrl: './fabric-board.scss',
  changeDetection: ChangeDetectionStrategy.OnPush,
})
export class FabricBoard {
  readonly body = input.required<DesignBody>();
  readonly derived = input.required<DesignDerivation>();
  readonly fabrics = input.required<readonly Fabric[]>();
  readonly garments = input<readonly GarmentSource[]>([]);
  readonly assignmentsChange = output<Assignment[]>();

  /** Groups made or changed here; a group is stored with the design once something is assigned to it. */
  private readonly madeHere = signal<readonly GarmentGroup[]>([]);
  /** The group being changed, 'new' while one is being made, or null. */
  protected readonly editing = signal<GarmentGroup | 'new' | null>(null);

  /** Every garment of the commission with panels, as one group the planner picks from. */
  private readonly allGarments = computed<GarmentGroup | null>(() => {
    const ids = this.garments().filter((g) => g.panels.length).map((g) => g.id);
    return ids.length < 2 ? null : { kind: 'group', name: ALL_GARMENTS, garmentIds: ids };
  });
  private readonly isAllGarments = (g: GarmentGroup) => g.name === ALL_GARMENTS && !!this.allGarments() && fabricKey(g) === fabricKey(this.allGarments());

  /** The owner's groups: those the design names, then those made here, once each by their garments. */
  protected readonly groups = computed<readonly GarmentGroup[]>(() => {
    const byKey = new Map<string, GarmentGroup>();
    for (const g of groupsOf(this.body().assignments)) if (!this.isAllGarments(g)) byKey.set(fabricKey(g), g);
    for (const g of this.madeHere()) if (!byKey.has(fabricKey(g))) byKey.set(fabricKey(g), g);
    return [...byKey.values()];
  });
  protected readonly groupRows = computed(() => {
    const names = new Map(this.garments().map((g) => [g.id, g.description]));
    const uses = new Map<string, number>();
    for (const a of this.body().assignments) uses.set(fabricKey(a.fabric), (uses.get(fabricKey(a.fabric)) ?? 0) + 1);
    return this.groups().map((g) => {
      const f = groupFabric(g, this.garments(), this.fabrics());
      const n = uses.get(f.key) ?? 0;
      return { group: g, key: f.key, name: g.name, swatch: this.colours()[f.key] ?? f.hex, members: g.garmentIds.map((id) => names.get(id) ?? `garment ${id}`).join(', '), uses: n === 0 ? 'not given to anything yet' : `given to ${n} ${n === 1 ? 'place' : 'places'}` };
    });
  });

  /** What can be assigned: garments and studio fabrics, the owner's groups, and all the garments together. */
  protected readonly choices = computed<readonly (Fabric & { ref: FabricRef })[]>(() => {
    const out: (Fabric & { ref: FabricRef })[] = [];
    for (const f of this.fabrics()) {
      if (f.kind === 'garment' && f.id != null) out.push({ ...f, ref: { kind: 'garment', garmentId: f.id } });
      if (f.kind === 'stock' && f.id != null) out.push({ ...f, ref: { kind: 'stock', stockId: f.id } });
    }
    for (const g of this.groups()) out.push({ ...groupFabric(g, this.garments(), this.fabrics()), ref: g });
    const all = this.allGarments();
    if (all && !out.some((f) => f.key === fabricKey(all))) {
      out.push({ ...groupFabric(all, this.garments(), this.fabrics()), detail: `${all.garmentIds.length} garments`, ref: all });
    }
    return out;
  });
  /** Swatch backgrounds by fabric key: a group shows its garments' colours in stripes, as the drawing does. */
  protected readonly colours = computed(() => {
    const hex = Object.fromEntries(this.fabrics().map((f) => [f.key, f.hex])) as Record<string, string | undefined>;
    return Object.fromEntries(this.choices().map((f) => [f.key, f.kind === 'group' ? swatchBackground(groupColours(f.key, hex)) : f.hex])) as Record<string, string | undefined>;
  });
  protected readonly columns = computed(() => (this.body().layout.setting === 'straight' ? this.body().layout.columns : Math.max(1, this.body().layout.columns * 2 - 1)));
  protected readonly positions = computed(() => {
    const byIndex = new Map<number, string>();
    for (const a of this.body().assignments) if (a.target.kind === 'position') byIndex.set(a.target.index, fabricKey(a.fabric));
    return this.derived().positions.map((p) => ({ index: p.index, blockId: p.blockId, key: byIndex.get(p.index) ?? ANY }));
  });
  protected readonly pieceKinds = computed(() => {
    const byKey = new Map<string, string>();
    for (const a of this.body().assignments) if (a.target.kind === 'piece') byKey.set(a.target.key, fabricKey(a.fabric));
    const seen = new Map<string, string>();
    for (const p of this.derived().pieces) if (!seen.has(p.key)) seen.set(p.key, p.group === 'block' ? p.label : p.label.replace(/,.*$/, '').replace(/ \(joined\)$/, ''));
    return [...seen].map(([key, label]) => ({ key, label, fabric: byKey.get(key) ?? ANY }));
  });
  protected readonly tableColumns = ['piece', 'fabric'];

  protected nameOf(key: string): string {
    return key === ANY ? 'Planner chooses' : (this.choices().find((f) => f.key === key)?.name ?? key);
  }

  private refOf(key: string): FabricRef | null {
    return key === ANY ? null : (this.choices().find((c) => c.key === key)?.ref ?? null);
  }

  private replace(target: Assignment['target'], key: string): void {
    const same = (a: Assignment) => (a.target.kind === 'position' && target.kind === 'position' ? a.target.index === target.index : a.target.kind === 'piece' && target.kind === 'piece' && a.target.key === target.key);
    const rest = this.body().assignments.filter((a) => !same(a));
    const fabric = this.refOf(key);
    this.assignmentsChange.emit(fabric ? [...rest, { target, fabric }] : rest);
  }

  /** A fabric dropped on a block position. */
  protected dropped(event: CdkDragDrop<number, unknown, string>): void {
    if (event.container.data === undefined || event.container.data < 0) return;
    this.replace({ kind: 'position', index: event.container.data }, event.item.data);
  }

  assignPosition(index: number, key: string): void {
    this.replace({ kind: 'position', index }, key);
  }

  assignPiece(pieceKey: string, key: string): void {
    this.replace({ kind: 'piece', key: pieceKey }, key);
  }

  /** The groups a group being made or changed may not copy (by name or garments). */
  protected othersThan(editing: GarmentGroup | 'new'): readonly GarmentGroup[] {
    return editing === 'new' ? this.groups() : this.groups().filter((g) => fabricKey(g) !== fabricKey(editing));
  }

  /** A group made or changed: kept here, and every place given the old group is given the changed one. */
  protected saveGroup(group: GarmentGroup): void {
    const old = this.editing();
    this.editing.set(null);
    if (old === null) return;
    const oldKey = old === 'new' ? null : fabricKey(old);
    this.madeHere.update((list) => [...list.filter((g) => fabricKey(g) !== oldKey && fabricKey(g) !== fabricKey(group)), group]);
    if (oldKey === null) return;
    const assignments = this.body().assignments;
    if (assignments.some((a) => fabricKey(a.fabric) === oldKey)) {
      this.assignmentsChange.emit(assignments.map((a) => (fabricKey(a.fabric) === oldKey ? { ...a, fabric: group } : a)));
    }
  }

  /** A group removed: the places given it go back to the planner's choice. */
  protected removeGroup(group: GarmentGroup): void {
    const key = fabricKey(group);
    if (this.editing() !== 'new' && this.editing() !== null && fabricKey(this.editing() as GarmentGroup) === key) this.editing.set(null);
    this.madeHere.update((list) => list.filter((g) => fabricKey(g) !== key));
    const assignments = this.body().assignments;
    if (assignments.some((a) => fabricKey(a.fabric) === key)) this.assignmentsChange.emit(assignments.filter((a) => fabricKey(a.fabric) !== key));
  }
}
