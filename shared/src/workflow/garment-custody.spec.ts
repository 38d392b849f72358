import { checkCustodyEvent, deriveCustody, likelyNextEvent, type CustodyEvent } from './garment-custody';

let id = 0;
const ev = (kind: CustodyEvent['kind'], extra: Partial<CustodyEvent> = {}, at = `2026-11-0${++id % 9 + 1}T10:00:00Z`): CustodyEvent => ({ id: ++id, kind, at, ...extra });

describe('garment custody derived from its events', () => {
  it('starts expected, becomes in the studio, stored, moved, cut and returned', () => {
    const events = [
      { id: 1, kind: 'announced', at: '2026-11-01T09:00:00Z' },
      { id: 2, kind: 'received', at: '2026-11-02T09:00:00Z' },
      { id: 3, kind: 'washed', at: '2026-11-03T09:00:00Z' },
      { id: 4, kind: 'stored', place: 'Box 3', at: '2026-11-03T10:00:00Z' },
    ] as CustodyEvent[];
    expect(deriveCustody(events)).toEqual({ status: 'in_studio', received: true, washed: true, place: 'Box 3', lastEventAt: '2026-11-03T10:00:00Z' });
    events.push({ id: 5, kind: 'moved', place: 'Shelf B2', at: '2026-11-04T09:00:00Z' });
    expect(deriveCustody(events).place).toBe('Shelf B2');
    events.push({ id: 6, kind: 'cut', at: '2026-11-05T09:00:00Z' });
    expect(deriveCustody(events).status).toBe('cut');
    events.push({ id: 7, kind: 'returned', returnMethod: 'post', trackingRef: 'TR123', at: '2026-11-06T09:00:00Z' });
    expect(deriveCustody(events)).toMatchObject({ status: 'returned', place: null });
  });

  it('orders by time, not by the order given', () => {
    const events = [ev('moved', { place: 'Later' }, '2026-11-05T00:00:00Z'), ev('received', {}, '2026-11-01T00:00:00Z'), ev('stored', { place: 'Earlier' }, '2026-11-02T00:00:00Z')];
    expect(deriveCustody(events).place).toBe('Later');
  });

  it('voids a mistaken event through a correction, keeping both in the log', () => {
    const wrong = { id: 10, kind: 'stored', place: 'Box 9', at: '2026-11-02T00:00:00Z' } as CustodyEvent;
    const events: CustodyEvent[] = [
      { id: 9, kind: 'received', at: '2026-11-01T00:00:00Z' },
      { id: 8, kind: 'stored', place: 'Box 1', at: '2026-11-01T12:00:00Z' },
      wrong,
      { id: 11, kind: 'correction', correctsEventId: 10, at: '2026-11-03T00:00:00Z' },
    ];
    expect(deriveCustody(events).place).toBe('Box 1');
  });

  it('refuses events that make no sense for where the garment is', () => {
    const expected = deriveCustody([ev('announced')]);
    expect(checkCustodyEvent(expected, 'cut')).toEqual({ ok: false, reason: 'Record the garment as received first.' });
    expect(checkCustodyEvent(expected, 'received').ok).toBe(true);
    const inStudio = deriveCustody([ev('announced'), ev('received')]);
    expect(checkCustodyEvent(inStudio, 'received').ok).toBe(false);
    expect(checkCustodyEvent(inStudio, 'withdrawn').ok).toBe(false);
    expect(checkCustodyEvent(inStudio, 'returned').ok).toBe(true);
  });

  it('lets a garment that never arrived be withdrawn', () => {
    expect(deriveCustody([ev('announced'), ev('withdrawn')]).status).toBe('withdrawn');
  });

  it('offers the usual next event first (receive, store, move, return once cut), always one the log allows', () => {
    const log: CustodyEvent[] = [{ id: 1, kind: 'announced', at: '2026-11-01T09:00:00Z' }];
    const next = () => likelyNextEvent(deriveCustody(log));
    const steps: string[] = [];
    for (const [kind, extra] of [['received', {}], ['washed', {}], ['stored', { place: 'Box 3' }], ['cut', {}], ['returned', { returnMethod: 'in_person' }]] as const) {
      const offered = next();
      steps.push(offered);
      expect(checkCustodyEvent(deriveCustody(log), offered)).toEqual({ ok: true });
      log.push({ id: log.length + 1, kind, at: `2026-11-0${log.length + 1}T09:00:00Z`, ...extra });
    }
    // Before each event above: not here yet, in the studio with no place (twice), stored, cut.
    expect(steps).toEqual(['received', 'stored', 'stored', 'moved', 'returned']);
    // Back with the client: it is received again if it comes back.
    expect(next()).toBe('received');
  });
});

describe('a place given on receipt', () => {
  it('is where the garment is stored, without a separate Stored entry', () => {
    const state = deriveCustody([
      { id: 1, kind: 'announced', at: '2026-11-01T09:00:00Z' },
      { id: 2, kind: 'received', place: 'Box 7', at: '2026-11-02T09:00:00Z' },
    ]);
    expect(state).toMatchObject({ status: 'in_studio', place: 'Box 7' });
    expect(likelyNextEvent(state)).toBe('moved');
  });
});
