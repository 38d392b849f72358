// Every printout, once: what it is called, who may print it, what it is
// drawn from and the builder of its content. The server's PDF routes and
// their access, the app's print pages and their links, and the end-to-end
// lists all come from here; one PDF renderer and one print page draw them.

import { careCardPrintout, type CareCardData } from './care-card-printout';
import { cutListPrintout } from './cut-list-printout';
import { PAPERS, type Paper, type PrintOptions, type PrintableDesign } from './printable-design';
import type { PrintoutContent } from './printout-content';
import { sewingOrderPrintout } from './sewing-order-printout';
import { templatesPrintout } from './templates-printout';

/** What a printout is drawn from: a commission's latest design, or its care card. */
export interface PrintoutSources {
  design: PrintableDesign;
  'care-card': CareCardData;
}
export type PrintoutSource = keyof PrintoutSources;

export type PrintoutRole = 'owner' | 'workroom' | 'client';

export interface Printout<S extends PrintoutSource = PrintoutSource> {
  /** Its name in addresses: the print page `/designs/:id/<id>` and the PDF `<id>.pdf`. */
  id: string;
  /** What links and the page's tab call it: "Cut list". */
  title: string;
  /** What it is in a sentence: "the cut list could not be loaded". */
  what: string;
  /** Who may print it. The workroom never sees prices, so no printout holds one. */
  roles: readonly PrintoutRole[];
  source: S;
  /** The sheets its PDF is laid out for, when it offers a choice (a full-size template must fit the paper). */
  papers?: readonly Paper[];
  build: (data: PrintoutSources[S], options: PrintOptions) => PrintoutContent;
}

type AnyPrintout = { [S in PrintoutSource]: Printout<S> }[PrintoutSource];

const STUDIO: readonly PrintoutRole[] = ['owner', 'workroom'];

export const PRINTOUTS: readonly AnyPrintout[] = [
  { id: 'cut-list', title: 'Cut list', what: 'cut list', roles: STUDIO, source: 'design', build: cutListPrintout },
  { id: 'sewing-order', title: 'Sewing order', what: 'sewing order', roles: STUDIO, source: 'design', build: sewingOrderPrintout },
  { id: 'templates', title: 'Templates', what: 'templates', roles: STUDIO, source: 'design', papers: ['a4', 'letter'], build: templatesPrintout },
  { id: 'care-card', title: 'Care card', what: 'care card', roles: ['owner', 'workroom', 'client'], source: 'care-card', build: careCardPrintout },
];

/** The printout of an id, or undefined. */
export function printoutOf(id: string): AnyPrintout | undefined {
  return PRINTOUTS.find((p) => p.id === id);
}

/** A printout's content from its data. */
export function buildPrintout<S extends PrintoutSource>(p: Printout<S> | AnyPrintout, data: PrintoutSources[S], options: PrintOptions): PrintoutContent {
  return (p.build as (d: PrintoutSources[S], o: PrintOptions) => PrintoutContent)(data, options);
}

/** Where a printout's PDF is under `/api/commissions/:id`: design printouts under `/design`. */
export function printoutPdfPath(p: Pick<Printout, 'id' | 'source'>): string {
  return p.source === 'design' ? `/design/${p.id}.pdf` : `/${p.id}.pdf`;
}

/** The route of a printout's PDF as the route policy names it. */
export function printoutRoute(p: Pick<Printout, 'id' | 'source'>): `GET /api/commissions/:id/${string}` {
  return `GET /api/commissions/:id${printoutPdfPath(p)}` as `GET /api/commissions/:id/${string}`;
}

/** Each PDF of a printout for a commission: one, or one for each paper it offers. */
export function printoutPdfs(p: Pick<Printout, 'id' | 'source' | 'papers'>, commissionId: number): { url: string; paper?: Paper; paperName?: string }[] {
  const url = `/api/commissions/${commissionId}${printoutPdfPath(p)}`;
  return p.papers ? p.papers.map((paper) => ({ url: `${url}?paper=${paper}`, paper, paperName: PAPERS[paper] })) : [{ url }];
}

/** The PDF's file name: the printout, the commission, the version and the paper ("templates-5-v3-a4.pdf"). */
export function printoutFileName<S extends PrintoutSource>(p: Printout<S> | AnyPrintout, data: PrintoutSources[S], paper?: Paper): string {
  const version = 'version' in data && data.version ? `-v${data.version.version}` : '';
  return `${p.id}-${data.commission.id}${version}${paper ? `-${paper}` : ''}.pdf`;
}
