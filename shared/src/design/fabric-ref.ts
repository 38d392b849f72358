// Which fabric a piece is cut from, and its stable key.

/** A fabric: one garment, one of the design's groups of garments (by id), or a studio stock fabric. */
export type FabricRef =
  | { kind: 'garment'; garmentId: number }
  | { kind: 'group'; groupId: string }
  | { kind: 'stock'; stockId: number };

/** A stable text key for a fabric reference. */
export function fabricKey(fabric: FabricRef | null): string {
  if (!fabric) return 'any';
  switch (fabric.kind) {
    case 'garment':
      return `garment:${fabric.garmentId}`;
    case 'stock':
      return `stock:${fabric.stockId}`;
    case 'group':
      return `group:${fabric.groupId}`;
  }
}
