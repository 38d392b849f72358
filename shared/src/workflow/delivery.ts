/**
 * Delivery as a checklist: every garment's custody ends (used in the piece,
 * returned whole, leftovers returned, or withdrawn) before the commission is
 * delivered, and the client is told what comes back. Shared by the server
 * (which refuses delivery while a custody is open) and the app (which shows
 * the checklist and why delivery is not offered yet).
 */
import { custodyEnded, type CustodyEvent, type GarmentStatus } from './garment-custody';

export interface DeliveryGarment {
  description: string;
  status: GarmentStatus;
}

/** The garments whose custody is still open, by description, in the order given. */
export function openCustody(garments: readonly DeliveryGarment[]): string[] {
  return garments.filter((g) => !custodyEnded(g.status)).map((g) => g.description);
}

/** Names in a sentence: "A", "A and B", "A, B and C", each in quotes. */
function namesInWords(names: readonly string[]): string {
  const quoted = names.map((n) => `“${n}”`);
  return quoted.length <= 1 ? (quoted[0] ?? '') : `${quoted.slice(0, -1).join(', ')} and ${quoted.at(-1)}`;
}

/** May the commission be delivered, given the garments whose custody is still open? */
export function checkDelivery(open: readonly string[]): { ok: true } | { ok: false; reason: string } {
  if (open.length === 0) return { ok: true };
  const one = open.length === 1;
  return {
    ok: false,
    reason: `Record what became of ${namesInWords(open)} first (used in the piece, returned whole or leftovers returned): ${one ? 'its' : 'their'} custody is still open.`,
  };
}

/** The entry that ended a garment's custody (the latest not voided by a correction), if any. */
export function custodyEnding(events: readonly CustodyEvent[]): CustodyEvent | null {
  const voided = new Set(events.filter((e) => e.kind === 'correction').map((e) => e.correctsEventId));
  const endings = events.filter((e) => (e.kind === 'used' || e.kind === 'returned' || e.kind === 'leftovers_returned' || e.kind === 'withdrawn') && !voided.has(e.id));
  return [...endings].sort((a, b) => (a.at < b.at ? -1 : a.at > b.at ? 1 : a.id - b.id)).at(-1) ?? null;
}

function how(e: CustodyEvent): string {
  if (e.returnMethod === 'post') return e.trackingRef ? `by post (tracking ${e.trackingRef})` : 'by post';
  return e.returnMethod === 'in_person' ? 'in person' : '';
}

/**
 * One line per garment saying what comes back to the client, for the
 * delivery mail: the garment's "returns to the client" words go with
 * leftovers, and the entry's note follows.
 */
export function whatComesBack(garment: { description: string; returnsToClient?: string | null }, ending: CustodyEvent | null): string {
  const note = ending?.note ? ` Note: ${ending.note}` : '';
  const join = (...parts: string[]) => parts.filter(Boolean).join(' ');
  switch (ending?.kind) {
    case 'used':
      return `${garment.description}: used in the piece; nothing comes back.${note}`;
    case 'returned':
      return `${join(`${garment.description}: returned whole`, how(ending))}.${note}`;
    case 'leftovers_returned':
      return `${join(`${garment.description}: leftovers returned`, how(ending))}${garment.returnsToClient ? `: ${garment.returnsToClient}` : ''}.${note}`;
    case 'withdrawn':
      return `${garment.description}: did not come to the studio.${note}`;
    default:
      return `${garment.description}: not recorded yet.`;
  }
}
