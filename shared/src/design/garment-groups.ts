// A design's groups of garments: the list the owner keeps (a group stays in it
// whether or not anything is given to it yet), the checks on that list and on
// the assignments naming its groups, and reading designs saved before the
// list existed, whose assignments wrote each group's name and garments out in full.

import { fabricKey, type AssignmentTarget, type DesignBody, type FabricRef, type GarmentGroup } from './design-body';
import { groupStripes, meanColour } from './fabric-colour';

/** Limits on a design's groups, the same for the form and the server. */
export const GARMENT_GROUP_LIMITS = { groups: 40, name: 100, garments: 100 } as const;

/** A group id: a lower-case letter, then lower-case letters, digits or dashes, 32 at most ("g1"). */
export const GARMENT_GROUP_ID = /^[a-z][a-z0-9-]{0,31}$/;

/** The design's groups; none when it lists none. */
export function garmentGroups(body: Pick<DesignBody, 'groups'>): GarmentGroup[] {
  return body.groups ?? [];
}

/** The group a reference names, or undefined when the design has no such group. */
export function groupOf(body: Pick<DesignBody, 'groups'>, ref: FabricRef | null | undefined): GarmentGroup | undefined {
  if (ref?.kind !== 'group') return undefined;
  return garmentGroups(body).find((g) => g.id === ref.groupId);
}

/**
 * A group as the fabric legend shows it, the same for the app and the server:
 * its key, name, the stripes of its garments' colours it is drawn in (with
 * their mean where one colour must do) and how many garments it holds.
 */
export function groupLegendEntry(group: GarmentGroup, colourOf: (garmentId: number) => string | null | undefined): { key: string; name: string; hex: string; stripes: string[]; detail: string } {
  const stripes = groupStripes(group.garmentIds, colourOf);
  const n = group.garmentIds.length;
  return { key: fabricKey({ kind: 'group', groupId: group.id }), name: group.name, hex: meanColour(stripes), stripes, detail: `any of ${n} garment${n === 1 ? '' : 's'}` };
}

/** The first id of the form g1, g2... that no group has. */
export function nextGroupId(groups: readonly Pick<GarmentGroup, 'id'>[]): string {
  const taken = new Set(groups.map((g) => g.id));
  let n = 1;
  while (taken.has(`g${n}`)) n++;
  return `g${n}`;
}

/** A group name as compared for sameness: trimmed, case not counted. */
const nameKey = (name: string) => name.trim().toLowerCase();

/**
 * What is wrong with a design's groups and with the assignments naming them,
 * by field path (`groups.1.name`, `assignments.4.fabric.groupId`); empty when
 * nothing is. Each group has its own id and its own name, lists each garment
 * once, and every group an assignment names is in the list.
 */
export function garmentGroupProblems(body: Pick<DesignBody, 'groups' | 'assignments'>): Record<string, string> {
  const problems: Record<string, string> = {};
  const ids = new Set<string>();
  const names = new Set<string>();
  garmentGroups(body).forEach((g, i) => {
    if (ids.has(g.id)) problems[`groups.${i}.id`] = 'Another group has this id.';
    ids.add(g.id);
    if (names.has(nameKey(g.name))) problems[`groups.${i}.name`] = 'Another group has this name.';
    names.add(nameKey(g.name));
    if (new Set(g.garmentIds).size !== g.garmentIds.length) problems[`groups.${i}.garmentIds`] = 'A garment is in this group twice.';
  });
  body.assignments.forEach((a, i) => {
    if (a.fabric.kind === 'group' && !ids.has(a.fabric.groupId)) problems[`assignments.${i}.fabric.groupId`] = 'The design has no group with this id.';
  });
  return problems;
}

/** A group as designs saved before the list wrote it into each assignment. */
export interface InlineGroupRef {
  kind: 'group';
  name: string;
  garmentIds: number[];
}

/** A fabric reference as stored: current, or a group written out in full. */
export type StoredFabricRef = FabricRef | InlineGroupRef;

/** A design body as stored, perhaps from before its groups were listed. */
export type StoredDesignBody = Omit<DesignBody, 'assignments'> & { assignments: { target: AssignmentTarget; fabric: StoredFabricRef }[] };

const isInline = (f: StoredFabricRef | null | undefined): f is InlineGroupRef => f?.kind === 'group' && !('groupId' in f);

/** Older designs told groups apart by their garments alone. */
const inlineKey = (f: InlineGroupRef) => [...f.garmentIds].sort((a, b) => a - b).join(',');

/** The parts of a stored derivation (see derive-design.ts) that name fabrics. */
interface FabricsNamed {
  positions: Array<{ fabrics: Record<string, StoredFabricRef | null> }>;
  pieces: Array<{ fabric: StoredFabricRef | null }>;
  layoutFabrics: Record<string, StoredFabricRef | null>;
}

/**
 * A stored design with its list of groups. One saved with the list comes back
 * as it is (with an empty list when it had none to keep). One saved before
 * gets its groups from its assignments: once each by their garments, in the
 * order first given, with ids g1, g2...; its assignments, and the derivation
 * stored with it, then name them by id.
 */
export function upgradeStoredDesign<D extends FabricsNamed | undefined>(stored: StoredDesignBody, derived: D): { body: DesignBody; derived: D } {
  const inline = stored.assignments.map((a) => a.fabric).filter(isInline);
  if (inline.length === 0) {
    return { body: { ...stored, groups: stored.groups ?? [] } as DesignBody, derived };
  }
  const groups: GarmentGroup[] = [...(stored.groups ?? [])];
  const idByKey = new Map<string, string>();
  for (const f of inline) {
    const key = inlineKey(f);
    if (idByKey.has(key)) continue;
    const id = nextGroupId(groups);
    idByKey.set(key, id);
    groups.push({ id, name: f.name, garmentIds: [...f.garmentIds] });
  }
  const ref = (f: StoredFabricRef | null): FabricRef | null => (isInline(f) ? { kind: 'group', groupId: idByKey.get(inlineKey(f))! } : f);
  const body: DesignBody = { ...stored, groups, assignments: stored.assignments.map((a) => ({ ...a, fabric: ref(a.fabric)! })) };
  if (!derived) return { body, derived };
  const refs = (record: Record<string, StoredFabricRef | null>) => Object.fromEntries(Object.entries(record).map(([k, f]) => [k, ref(f)]));
  const upgraded: FabricsNamed = {
    ...derived,
    positions: derived.positions.map((p) => ({ ...p, fabrics: refs(p.fabrics) })),
    pieces: derived.pieces.map((p) => ({ ...p, fabric: ref(p.fabric) })),
    layoutFabrics: refs(derived.layoutFabrics),
  };
  return { body, derived: upgraded as D };
}
