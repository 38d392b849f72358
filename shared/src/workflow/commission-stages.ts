import { checkDelivery } from './delivery';

/**
 * The stages a commission moves through in the workroom, in order, and the
 * rules for moving between them. Shared by the server (which enforces them)
 * and the app (which offers only the moves that will be accepted).
 */
export const STAGES = [
  'enquiry',
  'quoted',
  'booked',
  'garments_in',
  'preparation',
  'cutting',
  'piecing',
  'quilting',
  'binding',
  'ready',
  'delivered',
] as const;

export type WorkStage = (typeof STAGES)[number];
export type Stage = WorkStage | 'cancelled';
export const ALL_STAGES = [...STAGES, 'cancelled'] as const satisfies readonly Stage[];

export const STAGE_LABELS: Readonly<Record<Stage, string>> = {
  enquiry: 'Enquiry',
  quoted: 'Quoted',
  booked: 'Booked',
  garments_in: 'Garments in',
  preparation: 'Preparation (wash, press, stabilise)',
  cutting: 'Cutting',
  piecing: 'Piecing',
  quilting: 'Quilting',
  binding: 'Binding and label',
  ready: 'Ready',
  delivered: 'Delivered',
  cancelled: 'Cancelled',
};

export function isStage(value: unknown): value is Stage {
  return typeof value === 'string' && (ALL_STAGES as readonly string[]).includes(value);
}

export function stageIndex(stage: WorkStage): number {
  return STAGES.indexOf(stage);
}

/** Facts about the commission that some moves depend on. */
export interface StageFacts {
  /** Garments expected (every garment not withdrawn). */
  garmentCount: number;
  /** Of those, how many the studio has received. */
  garmentsReceived: number;
  /** An accepted quote still has money owing. */
  balanceDue?: boolean;
  /** Garments (by description) whose custody has not ended: delivery waits for them. */
  openCustody?: string[];
}

export type MoveCheck = { ok: true } | { ok: false; reason: string };

const FIRST_HANDS_ON = stageIndex('garments_in');

/**
 * May a commission move from one stage to another?
 * - Cancelled is reachable from any stage but delivered, and is final.
 * - Going back is allowed (to correct a mistaken move); a note is asked for by the caller.
 * - Forward, the paperwork stages (enquiry, quoted, booked) may be skipped, but from
 *   "garments in" on each stage is passed one at a time: no cutting before the
 *   garments are in and prepared, no delivery before ready.
 * - "Garments in" needs at least one garment received; cutting needs every garment received.
 * - Delivery waits for the balance of an accepted quote and for every garment's custody to end.
 */
export function checkStageMove(from: Stage, to: Stage, facts: StageFacts): MoveCheck {
  if (from === to) return { ok: false, reason: `The commission is already at "${STAGE_LABELS[to]}".` };
  if (from === 'cancelled') return { ok: false, reason: 'A cancelled commission does not move again.' };
  if (to === 'cancelled') {
    return from === 'delivered' ? { ok: false, reason: 'A delivered commission cannot be cancelled.' } : { ok: true };
  }
  const a = stageIndex(from);
  const b = stageIndex(to);
  if (b < a) return { ok: true };
  if (b > FIRST_HANDS_ON && b - a > 1) {
    const next = STAGES[a + 1]!;
    return { ok: false, reason: `"${STAGE_LABELS[to]}" comes after "${STAGE_LABELS[next]}": move to that stage first.` };
  }
  if (to === 'delivered' && facts.balanceDue) {
    return { ok: false, reason: 'The balance has not been paid yet; it is due before delivery.' };
  }
  if (to === 'delivered') {
    const custody = checkDelivery(facts.openCustody ?? []);
    if (!custody.ok) return custody;
  }
  if (to === 'garments_in' && facts.garmentsReceived === 0) {
    return { ok: false, reason: 'Record at least one garment as received before moving to "Garments in".' };
  }
  if (to === 'cutting' && (facts.garmentCount === 0 || facts.garmentsReceived < facts.garmentCount)) {
    const waiting = facts.garmentCount - facts.garmentsReceived;
    return {
      ok: false,
      reason:
        facts.garmentCount === 0
          ? 'There are no garments to cut yet.'
          : `${waiting} garment${waiting === 1 ? ' has' : 's have'} not been received yet; cutting waits until every garment is in.`,
    };
  }
  return { ok: true };
}

/**
 * Does a move need a note saying why? Going back a stage (a correction) and
 * cancelling do; the app asks for one and the server refuses the move without it.
 */
export function moveNeedsNote(from: Stage, to: Stage): boolean {
  if (to === 'cancelled') return true;
  if (from === 'cancelled') return false;
  return stageIndex(to) < stageIndex(from);
}

/** The stages a commission may move to next, in order. */
export function nextStages(from: Stage, facts: StageFacts): Stage[] {
  return ALL_STAGES.filter((to) => checkStageMove(from, to, facts).ok);
}

/** A stage the commission might move to, whether it may now, and if not why. */
export type StageOption = { stage: Stage; allowed: true } | { stage: Stage; allowed: false; reason: string };

/** Every stage but the current one, in order, each allowed or refused with the reason. */
export function stageOptions(from: Stage, facts: StageFacts): StageOption[] {
  return ALL_STAGES.filter((to) => to !== from).map((to) => {
    const check = checkStageMove(from, to, facts);
    return check.ok ? { stage: to, allowed: true as const } : { stage: to, allowed: false as const, reason: check.reason };
  });
}
