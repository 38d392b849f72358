import { HttpErrorResponse } from '@angular/common/http';
import { ChangeDetectionStrategy, Component, inject, signal } from '@angular/core';
import { MatButtonModule } from '@angular/material/button';
import { MatExpansionModule } from '@angular/material/expansion';
import { MatIconModule } from '@angular/material/icon';

import { messageFor } from '../core/api-error';
import { Notices } from '../core/notices';
import { showDateTime } from '../ui/dates';
import { LoadStatus } from '../ui/load-status';
import { MailApi, OutboxMail, SentMail } from './mail-api';

type SentState = 'loading' | 'ready' | 'not-here' | 'failed';

/** Mail not delivered yet (with a retry), and in development the mails the local mail server caught. */
@Component({
  selector: 'ks-mail-page',
  imports: [MatButtonModule, MatIconModule, MatExpansionModule, LoadStatus],
  templateUrl: './mail-page.html',
  styleUrl: './mail-page.scss',
  changeDetection: ChangeDetectionStrategy.OnPush,
})
export class MailPage {
  private readonly api = inject(MailApi);
  private readonly notices = inject(Notices);

  protected readonly showDateTime = showDateTime;
  protected readonly outboxState = signal<'loading' | 'ready' | 'failed'>('loading');
  protected readonly outbox = signal<OutboxMail[]>([]);
  protected readonly retrying = signal<number | null>(null);
  protected readonly retryError = signal<string | null>(null);
  protected readonly sentState = signal<SentState>('loading');
  protected readonly sent = signal<SentMail[]>([]);
  protected readonly sentError = signal<string | null>(null);

  constructor() {
    this.loadOutbox();
    this.loadSent();
  }

  protected loadOutbox(): void {
    this.outboxState.set('loading');
    this.api.outbox().subscribe({
      next: (items) => {
        this.outbox.set(items);
        this.outboxState.set('ready');
      },
      error: () => this.outboxState.set('failed'),
    });
  }

  protected loadSent(): void {
    this.sentState.set('loading');
    this.api.sent().subscribe({
      next: (items) => {
        this.sent.set([...items].reverse());
        this.sentState.set('ready');
      },
      error: (error: unknown) => {
        if (error instanceof HttpErrorResponse && error.status === 404) {
          this.sentState.set('not-here');
        } else {
          this.sentError.set(messageFor(error));
          this.sentState.set('failed');
        }
      },
    });
  }

  protected retryMail(mail: OutboxMail): void {
    this.retrying.set(mail.id);
    this.retryError.set(null);
    this.api.retry(mail.id).subscribe({
      next: () => {
        this.retrying.set(null);
        this.notices.info(`“${mail.subject}” is being sent again.`);
        this.loadOutbox();
      },
      error: (error: unknown) => {
        this.retrying.set(null);
        this.retryError.set(messageFor(error));
      },
    });
  }

  protected recipients(mail: SentMail): string {
    return Array.isArray(mail.to) ? mail.to.join(', ') : mail.to;
  }

  protected size(bytes: number): string {
    return bytes < 1024 ? `${bytes} bytes` : bytes < 1024 * 1024 ? `${Math.round(bytes / 1024)} KB` : `${(bytes / 1024 / 1024).toFixed(1)} MB`;
  }
}
