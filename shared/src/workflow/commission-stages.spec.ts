import { ALL_STAGES, checkStageMove, moveNeedsNote, nextStages, STAGES } from './commission-stages';

const allIn = { garmentCount: 3, garmentsReceived: 3 };

describe('commission stage moves', () => {
  it('keeps the workroom order of stages', () => {
    expect(STAGES).toEqual(['enquiry', 'quoted', 'booked', 'garments_in', 'preparation', 'cutting', 'piecing', 'quilting', 'binding', 'ready', 'delivered']);
  });

  it('lets the paperwork stages be skipped', () => {
    expect(checkStageMove('enquiry', 'booked', allIn).ok).toBe(true);
    expect(checkStageMove('enquiry', 'garments_in', allIn).ok).toBe(true);
  });

  it('refuses cutting before the garments are in and prepared', () => {
    expect(checkStageMove('booked', 'cutting', allIn)).toEqual({ ok: false, reason: '"Cutting" comes after "Garments in": move to that stage first.' });
    expect(checkStageMove('garments_in', 'cutting', allIn).ok).toBe(false);
    expect(checkStageMove('preparation', 'cutting', allIn).ok).toBe(true);
  });

  it('refuses cutting while any garment is still on its way', () => {
    const res = checkStageMove('preparation', 'cutting', { garmentCount: 3, garmentsReceived: 2 });
    expect(res).toEqual({ ok: false, reason: '1 garment has not been received yet; cutting waits until every garment is in.' });
    expect(checkStageMove('preparation', 'cutting', { garmentCount: 0, garmentsReceived: 0 }).ok).toBe(false);
  });

  it('needs a garment received before "Garments in"', () => {
    expect(checkStageMove('booked', 'garments_in', { garmentCount: 2, garmentsReceived: 0 }).ok).toBe(false);
    expect(checkStageMove('booked', 'garments_in', { garmentCount: 2, garmentsReceived: 1 }).ok).toBe(true);
  });

  it('refuses delivery before ready', () => {
    expect(checkStageMove('binding', 'delivered', allIn).ok).toBe(false);
    expect(checkStageMove('ready', 'delivered', allIn).ok).toBe(true);
  });

  it('refuses delivery while the balance of an accepted quote is owed', () => {
    expect(checkStageMove('ready', 'delivered', { ...allIn, balanceDue: true })).toEqual({ ok: false, reason: 'The balance has not been paid yet; it is due before delivery.' });
    expect(checkStageMove('ready', 'delivered', { ...allIn, balanceDue: false }).ok).toBe(true);
  });

  it('allows cancelling from any stage but delivered, and nothing after cancelling', () => {
    for (const s of STAGES.filter((x) => x !== 'delivered')) expect(checkStageMove(s, 'cancelled', allIn).ok).toBe(true);
    expect(checkStageMove('delivered', 'cancelled', allIn).ok).toBe(false);
    expect(nextStages('cancelled', allIn)).toEqual([]);
  });

  it('allows going back to correct a mistake', () => {
    expect(checkStageMove('piecing', 'cutting', allIn).ok).toBe(true);
  });

  it('lists the moves open from a stage', () => {
    expect(nextStages('preparation', allIn)).toEqual(['enquiry', 'quoted', 'booked', 'garments_in', 'cutting', 'cancelled']);
  });
});

describe('a note for a move', () => {
  it('is needed going back a stage and when cancelling, not going forward', () => {
    expect(moveNeedsNote('cutting', 'preparation')).toBe(true);
    expect(moveNeedsNote('quoted', 'cancelled')).toBe(true);
    expect(moveNeedsNote('preparation', 'cutting')).toBe(false);
    expect(moveNeedsNote('enquiry', 'booked')).toBe(false);
  });

  it('is asked for exactly the allowed moves that run against the stage order', () => {
    for (const from of ALL_STAGES) {
      for (const to of ALL_STAGES) {
        const backwards = to === 'cancelled' || (from !== 'cancelled' && ALL_STAGES.indexOf(to) < ALL_STAGES.indexOf(from));
        expect(moveNeedsNote(from, to)).toBe(backwards);
      }
    }
  });
});
