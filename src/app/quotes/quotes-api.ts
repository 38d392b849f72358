import { HttpClient, HttpContext } from '@angular/common/http';
import { Injectable, inject } from '@angular/core';
import { Observable, map } from 'rxjs';

import { REPORT_API_ERRORS } from '../core/api-error';
import { ManualPayment, Payment, Payments, Quote, QuoteDraft, QuoteSuggestion, checkoutSchema, paymentSchema, paymentsSchema, quoteListSchema, quoteSchema, suggestionSchema } from './quote';

/** Errors of these calls are shown by the page beside the button or form that made them. */
const quiet = { context: new HttpContext().set(REPORT_API_ERRORS, false) };

/** Every call about a commission's quotes and payments, for the owner and the client. */
@Injectable({ providedIn: 'root' })
export class QuotesApi {
  private readonly http = inject(HttpClient);

  /** Newest version first; a client gets only the versions that were sent. */
  list(commissionId: number): Observable<Quote[]> {
    return this.http
      .get<unknown>(`/api/commissions/${commissionId}/quotes`)
      .pipe(map((body) => quoteListSchema.parse(body).items));
  }

  /** Lines priced from the commission's current design (owner). */
  suggestion(commissionId: number): Observable<QuoteSuggestion> {
    return this.http
      .get<unknown>(`/api/commissions/${commissionId}/quote-suggestion`, quiet)
      .pipe(map((body) => suggestionSchema.parse(body)));
  }

  create(commissionId: number, draft: QuoteDraft): Observable<Quote> {
    return this.http
      .post<unknown>(`/api/commissions/${commissionId}/quotes`, draft, quiet)
      .pipe(map((body) => quoteSchema.parse(body)));
  }

  update(id: number, draft: QuoteDraft): Observable<Quote> {
    return this.http.put<unknown>(`/api/quotes/${id}`, draft, quiet).pipe(map((body) => quoteSchema.parse(body)));
  }

  send(id: number): Observable<Quote> {
    return this.http.post<unknown>(`/api/quotes/${id}/send`, null, quiet).pipe(map((body) => quoteSchema.parse(body)));
  }

  accept(id: number, name: string): Observable<Quote> {
    return this.http.post<unknown>(`/api/quotes/${id}/accept`, { name }, quiet).pipe(map((body) => quoteSchema.parse(body)));
  }

  decline(id: number, note?: string): Observable<Quote> {
    return this.http
      .post<unknown>(`/api/quotes/${id}/decline`, note ? { note } : {}, quiet)
      .pipe(map((body) => quoteSchema.parse(body)));
  }

  pdfUrl(id: number): string {
    return `/api/quotes/${id}/pdf`;
  }

  payments(commissionId: number): Observable<Payments> {
    return this.http
      .get<unknown>(`/api/commissions/${commissionId}/payments`)
      .pipe(map((body) => paymentsSchema.parse(body)));
  }

  /** The address of the hosted card payment page for the deposit. */
  depositCheckout(quoteId: number): Observable<string> {
    return this.http
      .post<unknown>(`/api/quotes/${quoteId}/deposit-checkout`, null, quiet)
      .pipe(map((body) => checkoutSchema.parse(body).url));
  }

  balanceCheckout(commissionId: number): Observable<string> {
    return this.http
      .post<unknown>(`/api/commissions/${commissionId}/balance-checkout`, null, quiet)
      .pipe(map((body) => checkoutSchema.parse(body).url));
  }

  refundDeposit(commissionId: number): Observable<Payment> {
    return this.http
      .post<unknown>(`/api/commissions/${commissionId}/refund-deposit`, null, quiet)
      .pipe(map((body) => paymentSchema.parse(body)));
  }

  /** The owner counts a payment held for review as it arrived. */
  acceptPayment(commissionId: number, paymentId: number): Observable<Payment> {
    return this.http
      .post<unknown>(`/api/commissions/${commissionId}/payments/${paymentId}/accept`, null, quiet)
      .pipe(map((body) => paymentSchema.parse(body)));
  }

  /** The owner sends a held payment, or a second payment, back to the client's card. */
  refundPayment(commissionId: number, paymentId: number): Observable<Payment> {
    return this.http
      .post<unknown>(`/api/commissions/${commissionId}/payments/${paymentId}/refund`, null, quiet)
      .pipe(map((body) => paymentSchema.parse(body)));
  }

  /** The owner records money received outside the card checkout. */
  recordPayment(commissionId: number, payment: ManualPayment): Observable<Payment> {
    return this.http
      .post<unknown>(`/api/commissions/${commissionId}/payments/manual`, payment, quiet)
      .pipe(map((body) => paymentSchema.parse(body)));
  }

  /** The owner takes back a payment recorded by hand, saying why. */
  undoPayment(commissionId: number, paymentId: number, note: string): Observable<Payment> {
    return this.http
      .post<unknown>(`/api/commissions/${commissionId}/payments/${paymentId}/undo`, { note }, quiet)
      .pipe(map((body) => paymentSchema.parse(body)));
  }

  /** A payment's receipt, and the commission's balance invoice, as PDFs opened by link. */
  receiptUrl(commissionId: number, paymentId: number): string {
    return `/api/commissions/${commissionId}/payments/${paymentId}/receipt`;
  }

  invoiceUrl(commissionId: number): string {
    return `/api/commissions/${commissionId}/invoice`;
  }
}
