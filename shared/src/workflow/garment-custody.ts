/**
 * A garment's custody is an append-only list of events; where it is and what
 * has been done to it are derived from them, never stored on their own. A
 * mistaken event is not edited or deleted: a later "correction" event voids it.
 */
export const CUSTODY_KINDS = ['announced', 'received', 'washed', 'stored', 'moved', 'cut', 'used', 'returned', 'leftovers_returned', 'withdrawn', 'correction'] as const;
export type CustodyKind = (typeof CUSTODY_KINDS)[number];

export const CUSTODY_LABELS: Readonly<Record<CustodyKind, string>> = {
  announced: 'Announced by the client',
  received: 'Received',
  washed: 'Washed',
  stored: 'Stored',
  moved: 'Moved',
  cut: 'Cut',
  used: 'Used in the piece (nothing comes back)',
  returned: 'Returned whole to the client',
  leftovers_returned: 'Leftovers returned to the client',
  withdrawn: 'Withdrawn (not coming)',
  correction: 'Correction',
};

export const RETURN_METHODS = ['in_person', 'post'] as const;
export type ReturnMethod = (typeof RETURN_METHODS)[number];

export interface CustodyEvent {
  id: number;
  kind: CustodyKind;
  /** ISO time of the event. */
  at: string;
  place?: string | null;
  returnMethod?: ReturnMethod | null;
  trackingRef?: string | null;
  note?: string | null;
  /** For a correction: the event it voids. */
  correctsEventId?: number | null;
}

export const GARMENT_STATUSES = ['expected', 'in_studio', 'cut', 'used', 'returned', 'leftovers_returned', 'withdrawn'] as const;
export type GarmentStatus = (typeof GARMENT_STATUSES)[number];

export const GARMENT_STATUS_LABELS: Readonly<Record<GarmentStatus, string>> = {
  expected: 'Expected',
  in_studio: 'In the studio',
  cut: 'Cut',
  used: 'Used in the piece',
  returned: 'Returned whole',
  leftovers_returned: 'Leftovers returned',
  withdrawn: 'Withdrawn',
};

/**
 * The statuses that end a garment's custody: it went into the piece, went
 * back whole, its leftovers went back, or it never came. Any other status
 * (expected, in the studio, cut) is still open.
 */
export const CUSTODY_ENDED: readonly GarmentStatus[] = ['used', 'returned', 'leftovers_returned', 'withdrawn'];

export function custodyEnded(status: GarmentStatus): boolean {
  return CUSTODY_ENDED.includes(status);
}

export interface CustodyState {
  status: GarmentStatus;
  received: boolean;
  washed: boolean;
  /** Box or shelf code where it is now; null when not in the studio or not stored yet. */
  place: string | null;
  lastEventAt: string | null;
}

/** Events in the order they happened (time, then id). */
function inOrder(events: readonly CustodyEvent[]): CustodyEvent[] {
  return [...events].sort((a, b) => (a.at < b.at ? -1 : a.at > b.at ? 1 : a.id - b.id));
}

export function deriveCustody(events: readonly CustodyEvent[]): CustodyState {
  const voided = new Set(events.filter((e) => e.kind === 'correction' && e.correctsEventId != null).map((e) => e.correctsEventId));
  const state: CustodyState = { status: 'expected', received: false, washed: false, place: null, lastEventAt: null };
  for (const e of inOrder(events)) {
    state.lastEventAt = e.at;
    if (voided.has(e.id) || e.kind === 'correction') continue;
    switch (e.kind) {
      case 'announced':
        break;
      case 'received':
        state.received = true;
        if (state.status === 'expected' || state.status === 'withdrawn') state.status = 'in_studio';
        // A place given on receipt is where it is stored.
        if (e.place) state.place = e.place;
        break;
      case 'washed':
        state.washed = true;
        break;
      case 'stored':
      case 'moved':
        state.place = e.place ?? null;
        break;
      case 'cut':
        state.status = 'cut';
        break;
      case 'used':
      case 'returned':
      case 'leftovers_returned':
        state.status = e.kind;
        state.place = null;
        break;
      case 'withdrawn':
        if (!state.received) state.status = 'withdrawn';
        break;
    }
  }
  return state;
}

/** Which events make sense next; the server refuses the others with the reason. */
export function checkCustodyEvent(current: CustodyState, kind: CustodyKind): { ok: true } | { ok: false; reason: string } {
  const inStudio = current.status === 'in_studio' || current.status === 'cut';
  if ((current.status === 'used' || current.status === 'leftovers_returned') && kind !== 'correction') {
    return { ok: false, reason: `This garment's custody has ended (${GARMENT_STATUS_LABELS[current.status].toLowerCase()}); correct that entry if it was a mistake.` };
  }
  switch (kind) {
    case 'announced':
      return { ok: false, reason: 'A garment is announced once, when it is added.' };
    case 'received':
      return current.received && current.status !== 'returned'
        ? { ok: false, reason: 'This garment is already in the studio.' }
        : { ok: true };
    case 'washed':
    case 'stored':
    case 'moved':
    case 'cut':
      return inStudio ? { ok: true } : { ok: false, reason: 'Record the garment as received first.' };
    case 'used':
      return inStudio ? { ok: true } : { ok: false, reason: 'Only a garment in the studio can be used in the piece.' };
    case 'returned':
    case 'leftovers_returned':
      return inStudio ? { ok: true } : { ok: false, reason: 'Only a garment in the studio can be returned.' };
    case 'withdrawn':
      return current.received ? { ok: false, reason: 'A garment already received cannot be withdrawn; record its return instead.' } : { ok: true };
    case 'correction':
      return { ok: true };
  }
}

/**
 * The event a maker most likely records next, for the first choice of the
 * custody form: received while the garment is not here, stored until it has a
 * place, then moved; returned once it is cut. Every choice it makes is one
 * `checkCustodyEvent` allows.
 */
export function likelyNextEvent(current: Pick<CustodyState, 'status' | 'place'>): 'received' | 'stored' | 'moved' | 'returned' {
  if (current.status === 'cut') return 'returned';
  if (current.status !== 'in_studio') return 'received';
  return current.place === null ? 'stored' : 'moved';
}
