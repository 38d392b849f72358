import { buildPrintout, printoutFileName, printoutOf } from '@keepstitch/shared';
import { today } from '../core/calendar';
import { careCard } from './designs-service';
import { printoutPdf } from './printouts/printout-pdf';

/** The care card as the PDF its printout route gives, for a mail to attach. */
export async function careCardPdf(user: Express.User, commissionId: number): Promise<{ pdf: Buffer; fileName: string }> {
  const printout = printoutOf('care-card')!;
  const data = await careCard(user, commissionId);
  const content = buildPrintout(printout, data, { printedOn: today() });
  return { pdf: await printoutPdf(content, { documentTitle: `${printout.title}: ${data.commission.title}` }), fileName: printoutFileName(printout, data) };
}
