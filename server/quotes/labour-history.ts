import { mainBlockKind, type FinishedCommission } from '@keepstitch/shared';
import { HoursModel, StageMoveModel } from '../models/commission-model';
import { DesignVersionModel } from '../models/design-model';
import { QuoteLineModel } from '../models/quote-model';

/**
 * Finished commissions to learn the labour estimate from, newest first: each
 * delivered commission's accepted quote's labour hours per stage, the hours
 * logged per stage, and the main block kind of its latest design. Enough are
 * read (30) for the last ten of one block kind to be among them most of the time.
 */
export async function finishedCommissions(exceptId: number, limit = 30): Promise<FinishedCommission[]> {
  const finished = await StageMoveModel.query()
    .join('commissions', 'commissions.id', 'stageMoves.commissionId')
    .where('commissions.stage', 'delivered')
    .where('stageMoves.toStage', 'delivered')
    .whereNot('stageMoves.commissionId', exceptId)
    .groupBy('stageMoves.commissionId')
    .select('stageMoves.commissionId')
    .max('stageMoves.movedAt as finishedAt')
    .orderBy('finishedAt', 'desc')
    .limit(limit)
    .castTo<{ commissionId: number; finishedAt: Date }[]>();
  if (finished.length === 0) return [];
  const ids = finished.map((f) => f.commissionId);
  const [quoted, logged, designs] = await Promise.all([
    QuoteLineModel.query()
      .join('quotes', 'quotes.id', 'quoteLines.quoteId')
      .whereIn('quotes.commissionId', ids)
      .where('quotes.status', 'accepted')
      .where('quoteLines.kind', 'labour')
      .whereNotNull('quoteLines.stage')
      .groupBy('quotes.commissionId', 'quoteLines.stage')
      .select('quotes.commissionId', 'quoteLines.stage')
      .sum('quoteLines.quantity as hours')
      .castTo<{ commissionId: number; stage: string; hours: string }[]>(),
    HoursModel.query().whereIn('commissionId', ids).groupBy('commissionId', 'stage').select('commissionId', 'stage').sum('hours as hours').castTo<{ commissionId: number; stage: string; hours: string }[]>(),
    DesignVersionModel.query().select('commissionId', 'version', 'body', 'derived').whereIn('commissionId', ids).distinctOn('commissionId').orderBy('commissionId').orderBy('version', 'desc'),
  ]);
  return finished.map((f) => {
    const stages: Record<string, { quotedHours: string; loggedHours: string }> = {};
    const at = (stage: string) => (stages[stage] ??= { quotedHours: '0', loggedHours: '0' });
    for (const q of quoted) if (q.commissionId === f.commissionId) at(q.stage).quotedHours = String(q.hours);
    for (const h of logged) if (h.commissionId === f.commissionId) at(h.stage).loggedHours = String(h.hours);
    const design = designs.find((d) => d.commissionId === f.commissionId);
    return { commissionId: f.commissionId, finishedAt: new Date(f.finishedAt).toISOString(), blockKind: design ? mainBlockKind(design.body, design.derived) : null, stages };
  });
}
