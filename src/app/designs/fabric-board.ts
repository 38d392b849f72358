import { CdkDrag, CdkDragDrop, CdkDropList, CdkDropListGroup } from '@angular/cdk/drag-drop';
import { ChangeDetectionStrategy, Component, computed, input, output, signal } from '@angular/core';
import { MatButtonModule } from '@angular/material/button';
import { MatIconModule } from '@angular/material/icon';
import { MatMenuModule } from '@angular/material/menu';
import { MatSelectModule } from '@angular/material/select';
import { MatTableModule } from '@angular/material/table';
import { Assignment, DesignBody, DesignDerivation, FabricRef, GarmentGroup, fabricKey, garmentGroups, nextGroupId } from '@keepstitch/shared';

import { Fabric, GarmentSource, groupColours, groupFabric, swatchBackground } from './design';
import { GarmentGroupForm, GroupDraft } from './garment-group-form';

const ANY = 'any';
/** The group of every garment with panels, offered beside the owner's groups and kept only while given to something. */
const ALL_GARMENTS: Omit<GarmentGroup, 'garmentIds'> = { id: 'all-garments', name: 'Any of the garments' };

/** What the board changes in the design: its groups of garments and who gives which fabric. */
export interface FabricChoices {
  groups: GarmentGroup[];
  assignments: Assignment[];
}

/**
 * Which fabric goes where: drag a garment, a group of garments or a studio
 * fabric onto a block position (or choose it from the block's menu), or choose
 * a fabric for each kind of piece in the table. Groups of garments are made
 * and changed here and kept with the design, given to something or not yet;
 * the planner picks among a group's garments.
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
  readonly choicesChange = output<FabricChoices>();

  /** The group being changed, 'new' while one is being made, or null. */
  protected readonly editing = signal<GarmentGroup | 'new' | null>(null);

  /** Every garment of the commission with panels, as one group the planner picks from. */
  private readonly allGarments = computed<GarmentGroup | null>(() => {
    const ids = this.garments().filter((g) => g.panels.length).map((g) => g.id);
    return ids.length < 2 ? null : { ...ALL_GARMENTS, garmentIds: ids };
  });

  /** The owner's groups, as the design keeps them. */
  protected readonly groups = computed<readonly GarmentGroup[]>(() => garmentGroups(this.body()).filter((g) => g.id !== ALL_GARMENTS.id));
  protected readonly groupRows = computed(() => {
    const names = new Map(this.garments().map((g) => [g.id, g.description]));
    const uses = new Map<string, number>();
    for (const a of this.body().assignments) uses.set(fabricKey(a.fabric), (uses.get(fabricKey(a.fabric)) ?? 0) + 1);
    return this.groups().map((g) => {
      const f = groupFabric(g, this.fabrics());
      const n = uses.get(f.key) ?? 0;
      return {
        group: g,
        key: f.key,
        name: g.name,
        swatch: this.colours()[f.key] ?? f.hex,
        members: g.garmentIds.length ? g.garmentIds.map((id) => names.get(id) ?? `garment ${id}`).join(', ') : 'no garments yet',
        uses: n === 0 ? 'not given to anything yet' : `given to ${n} ${n === 1 ? 'place' : 'places'}`,
      };
    });
  });

  /** What can be assigned: garments and studio fabrics, the owner's groups, and all the garments together. */
  protected readonly choices = computed<readonly (Fabric & { ref: FabricRef; group?: GarmentGroup })[]>(() => {
    const out: (Fabric & { ref: FabricRef; group?: GarmentGroup })[] = [];
    for (const f of this.fabrics()) {
      if (f.kind === 'garment' && f.id != null) out.push({ ...f, ref: { kind: 'garment', garmentId: f.id } });
      if (f.kind === 'stock' && f.id != null) out.push({ ...f, ref: { kind: 'stock', stockId: f.id } });
    }
    for (const g of this.groups()) out.push({ ...groupFabric(g, this.fabrics()), ref: { kind: 'group', groupId: g.id }, group: g });
    const all = this.allGarments();
    if (all) out.push({ ...groupFabric(all, this.fabrics()), detail: `${all.garmentIds.length} garments`, ref: { kind: 'group', groupId: all.id }, group: all });
    return out;
  });
  /** Swatch backgrounds by fabric key: a group shows its garments' colours in stripes, as the drawing does. */
  protected readonly colours = computed(() => {
    const hex = Object.fromEntries(this.fabrics().map((f) => [f.key, f.hex])) as Record<string, string | undefined>;
    return Object.fromEntries(this.choices().map((f) => [f.key, f.group ? swatchBackground(groupColours(f.group, hex)) : f.hex])) as Record<string, string | undefined>;
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

  /** Sends the design's groups with its assignments; the group of all garments is kept, as it is now, only while given to something. */
  private emit(groups: readonly GarmentGroup[], assignments: Assignment[]): void {
    const own = groups.filter((g) => g.id !== ALL_GARMENTS.id);
    const all = this.allGarments();
    const allUsed = !!all && assignments.some((a) => a.fabric.kind === 'group' && a.fabric.groupId === all.id);
    this.choicesChange.emit({ groups: allUsed ? [...own, all] : own, assignments });
  }

  private replace(target: Assignment['target'], key: string): void {
    const same = (a: Assignment) => (a.target.kind === 'position' && target.kind === 'position' ? a.target.index === target.index : a.target.kind === 'piece' && target.kind === 'piece' && a.target.key === target.key);
    const rest = this.body().assignments.filter((a) => !same(a));
    const fabric = key === ANY ? null : (this.choices().find((c) => c.key === key)?.ref ?? null);
    this.emit(garmentGroups(this.body()), fabric ? [...rest, { target, fabric }] : rest);
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
    const all = garmentGroups(this.body());
    return editing === 'new' ? all : all.filter((g) => g.id !== editing.id);
  }

  /** A group made or changed is kept with the design at once; the places given it keep it, by its id. */
  protected saveGroup(draft: GroupDraft): void {
    const old = this.editing();
    this.editing.set(null);
    if (old === null) return;
    const groups = garmentGroups(this.body());
    const next = old === 'new' ? [...groups, { id: nextGroupId(groups), ...draft }] : groups.map((g) => (g.id === old.id ? { id: g.id, ...draft } : g));
    this.emit(next, this.body().assignments);
  }

  /** A group removed: the places given it go back to the planner's choice. */
  protected removeGroup(group: GarmentGroup): void {
    const editing = this.editing();
    if (editing !== 'new' && editing?.id === group.id) this.editing.set(null);
    const assignments = this.body().assignments.filter((a) => !(a.fabric.kind === 'group' && a.fabric.groupId === group.id));
    this.emit(garmentGroups(this.body()).filter((g) => g.id !== group.id), assignments);
  }
}
