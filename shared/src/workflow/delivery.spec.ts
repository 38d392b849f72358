import { checkStageMove, stageOptions } from './commission-stages';
import { checkDelivery, custodyEnding, openCustody, whatComesBack } from './delivery';
import { checkCustodyEvent, custodyEnded, deriveCustody, type CustodyEvent } from './garment-custody';

const at = (day: number) => `2026-11-${String(day).padStart(2, '0')}T10:00:00Z`;

describe('which custody ends a garment', () => {
  it('ends with used in the piece, returned whole, leftovers returned or withdrawn; not while expected, in the studio or cut', () => {
    expect(['used', 'returned', 'leftovers_returned', 'withdrawn'].every((s) => custodyEnded(s as never))).toBe(true);
    expect(['expected', 'in_studio', 'cut'].some((s) => custodyEnded(s as never))).toBe(false);
  });

  it('derives the ending from the events, and a correction reopens it', () => {
    const events: CustodyEvent[] = [
      { id: 1, kind: 'received', at: at(1) },
      { id: 2, kind: 'cut', at: at(2) },
      { id: 3, kind: 'leftovers_returned', returnMethod: 'post', trackingRef: 'KS-77', at: at(3) },
    ];
    expect(deriveCustody(events)).toMatchObject({ status: 'leftovers_returned', place: null });
    expect(custodyEnding(events)?.id).toBe(3);
    const corrected = [...events, { id: 4, kind: 'correction', correctsEventId: 3, at: at(4) } as CustodyEvent];
    expect(deriveCustody(corrected).status).toBe('cut');
    expect(custodyEnding(corrected)).toBeNull();
  });

  it('takes nothing more after used or leftovers returned but a correction', () => {
    const used = deriveCustody([{ id: 1, kind: 'received', at: at(1) }, { id: 2, kind: 'used', at: at(2) }]);
    expect(checkCustodyEvent(used, 'moved')).toEqual({ ok: false, reason: "This garment's custody has ended (used in the piece); correct that entry if it was a mistake." });
    expect(checkCustodyEvent(used, 'correction').ok).toBe(true);
    expect(checkCustodyEvent(deriveCustody([{ id: 1, kind: 'announced', at: at(1) }]), 'used')).toEqual({ ok: false, reason: 'Only a garment in the studio can be used in the piece.' });
  });
});

describe('delivery waits for every garment', () => {
  const garments = [
    { description: 'Blue work shirt', status: 'used' as const },
    { description: 'Floral dress', status: 'cut' as const },
    { description: 'School jumper', status: 'in_studio' as const },
    { description: 'Scarf', status: 'withdrawn' as const },
  ];

  it('names the garments whose custody is open in the refusal', () => {
    expect(openCustody(garments)).toEqual(['Floral dress', 'School jumper']);
    expect(checkDelivery(openCustody(garments))).toEqual({
      ok: false,
      reason: 'Record what became of “Floral dress” and “School jumper” first (used in the piece, returned whole or leftovers returned): their custody is still open.',
    });
    expect(checkDelivery(['Floral dress'])).toEqual({ ok: false, reason: 'Record what became of “Floral dress” first (used in the piece, returned whole or leftovers returned): its custody is still open.' });
    expect(checkDelivery([])).toEqual({ ok: true });
  });

  it('refuses the move to delivered while a custody is open, and allows it once none is', () => {
    const facts = { garmentCount: 2, garmentsReceived: 2, openCustody: ['Floral dress'] };
    expect(checkStageMove('ready', 'delivered', facts)).toMatchObject({ ok: false, reason: expect.stringContaining('“Floral dress”') });
    expect(checkStageMove('ready', 'delivered', { ...facts, openCustody: [] })).toEqual({ ok: true });
    // The balance is still asked first.
    expect(checkStageMove('ready', 'delivered', { ...facts, balanceDue: true })).toMatchObject({ reason: 'The balance has not been paid yet; it is due before delivery.' });
  });
});

describe('every stage offered, allowed or with its reason', () => {
  it('keeps a stage that is not allowed yet, with the reason, and leaves out the current one', () => {
    const options = stageOptions('preparation', { garmentCount: 2, garmentsReceived: 1 });
    expect(options.map((o) => o.stage)).not.toContain('preparation');
    expect(options.find((o) => o.stage === 'cutting')).toEqual({ stage: 'cutting', allowed: false, reason: '1 garment has not been received yet; cutting waits until every garment is in.' });
    expect(options.find((o) => o.stage === 'garments_in')).toEqual({ stage: 'garments_in', allowed: true });
    expect(options.find((o) => o.stage === 'piecing')).toMatchObject({ allowed: false, reason: '"Piecing" comes after "Cutting": move to that stage first.' });
  });
});

describe('what comes back, per garment', () => {
  it('says for each ending what the client gets back, with how and the note', () => {
    const g = { description: 'Floral dress', returnsToClient: 'Collar, cuffs and the buttons' };
    expect(whatComesBack(g, { id: 1, kind: 'leftovers_returned', returnMethod: 'post', trackingRef: 'KS-77', note: 'In a cotton bag', at: at(1) })).toBe(
      'Floral dress: leftovers returned by post (tracking KS-77): Collar, cuffs and the buttons. Note: In a cotton bag',
    );
    expect(whatComesBack({ description: 'Blue work shirt' }, { id: 2, kind: 'returned', returnMethod: 'in_person', at: at(1) })).toBe('Blue work shirt: returned whole in person.');
    expect(whatComesBack({ description: 'Scarf' }, { id: 3, kind: 'used', at: at(1) })).toBe('Scarf: used in the piece; nothing comes back.');
  });
});
