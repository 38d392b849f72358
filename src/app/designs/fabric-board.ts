import { CdkDrag, CdkDragDrop, CdkDropList, CdkDropListGroup } from '@angular/cdk/drag-drop';
import { ChangeDetectionStrategy, Component, computed, input, output } from '@angular/core';
import { MatSelectModule } from '@angular/material/select';
import { MatTableModule } from '@angular/material/table';
import { Assignment, DesignBody, DesignDerivation, FabricRef, fabricKey } from '@keepstitch/shared';

import { Fabric, GarmentSource } from './design';

const ANY = 'any';

/**
 * Which fabric goes where: drag a garment or studio fabric onto a block
 * position, or choose a fabric for each kind of piece in the table.
 */
@Component({
  selector: 'ks-fabric-board',
  imports: [CdkDropListGroup, CdkDropList, CdkDrag, MatSelectModule, MatTableModule],
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

  /** Every garment of the commission with panels, as one group the planner picks from. */
  protected readonly allGarments = computed<Fabric | null>(() => {
    const ids = this.garments().filter((g) => g.panels.length).map((g) => g.id);
    if (ids.length < 2) return null;
    return { key: fabricKey({ kind: 'group', name: 'Any of the garments', garmentIds: ids }), kind: 'group', id: null, name: 'Any of the garments', hex: '#b9a98a', detail: `${ids.length} garments` };
  });
  protected readonly choices = computed(() => {
    const all = this.allGarments();
    const list = this.fabrics().filter((f) => f.kind !== 'group');
    return all ? [...list, all] : list;
  });
  protected readonly colours = computed(() => Object.fromEntries(this.choices().map((f) => [f.key, f.hex])) as Record<string, string | undefined>);
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
    return [...seen].map(([key, label]) => ({ key, label: key.startsWith('block:') ? label : label, fabric: byKey.get(key) ?? ANY }));
  });
  protected readonly tableColumns = ['piece', 'fabric'];

  protected nameOf(key: string): string {
    return key === ANY ? 'Planner chooses' : (this.choices().find((f) => f.key === key)?.name ?? key);
  }

  private refOf(key: string): FabricRef | null {
    if (key === ANY) return null;
    const f = this.choices().find((c) => c.key === key);
    if (!f) return null;
    if (f.kind === 'garment') return { kind: 'garment', garmentId: f.id! };
    if (f.kind === 'stock') return { kind: 'stock', stockId: f.id! };
    const ids = key.replace('group:', '').split(',').map(Number);
    return { kind: 'group', name: f.name, garmentIds: ids };
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
}
