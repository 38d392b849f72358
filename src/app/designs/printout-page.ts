import { ChangeDetectionStrategy, Component, computed, inject, input } from '@angular/core';
import { MatButtonModule } from '@angular/material/button';
import { buildPrintout, printoutOf, printoutPdfs, type PrintoutSources } from '@keepstitch/shared';

import { Auth } from '../core/auth';
import { DesignsApi } from './designs-api';
import { Loader } from '../ui/loader';
import { PrintBar } from './print-bar';
import { PrintoutBlocks } from './printout-blocks';

/** Today in the browser's calendar, YYYY-MM-DD, as a printout is dated. */
function today(): string {
  const d = new Date();
  return `${d.getFullYear()}-${String(d.getMonth() + 1).padStart(2, '0')}-${String(d.getDate()).padStart(2, '0')}`;
}

/**
 * Any printout as a page made for paper: its content, built once in shared
 * for this page and the PDF alike, drawn as it is; above it, the bar with
 * back, Print and the PDFs. The route says which printout (`printout`).
 */
@Component({
  selector: 'ks-printout-page',
  imports: [MatButtonModule, PrintBar, PrintoutBlocks],
  templateUrl: './printout-page.html',
  styleUrl: './printout-page.scss',
  changeDetection: ChangeDetectionStrategy.OnPush,
})
export class PrintoutPage {
  private readonly api = inject(DesignsApi);
  private readonly auth = inject(Auth);
  /** From the route: the commission id, and the printout's id (route data). */
  readonly id = input.required<string>();
  readonly printout = input.required<string>();

  protected readonly commissionId = computed(() => Number(this.id()));
  protected readonly def = computed(() => {
    const p = printoutOf(this.printout());
    if (!p) throw new Error(`No printout "${this.printout()}".`);
    return p;
  });
  protected readonly loaded = new Loader<PrintoutSources[keyof PrintoutSources]>(() => this.api.printoutData(this.def().source, this.commissionId()), { reloadInPlace: false });
  protected readonly content = computed(() => {
    const data = this.loaded.value();
    return data ? buildPrintout(this.def(), data as never, { printedOn: today() }) : null;
  });
  protected readonly pdfs = computed(() => printoutPdfs(this.def(), this.commissionId()).map((p) => ({ url: p.url, label: p.paperName ? `PDF, ${p.paperName}` : 'PDF' })));
  /** Clients came from their portal; the studio from the design. */
  protected readonly back = computed(() =>
    this.auth.role() === 'client'
      ? { link: ['/portal', this.commissionId()], label: 'Back to my commission' }
      : { link: ['/designs', this.commissionId()], label: 'Back to the design' },
  );
}
