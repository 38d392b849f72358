import { HttpErrorResponse } from '@angular/common/http';
import {
  ChangeDetectionStrategy,
  Component,
  ElementRef,
  OnInit,
  computed,
  inject,
  input,
  signal,
} from '@angular/core';
import { FormControl, FormGroup, ReactiveFormsModule, Validators } from '@angular/forms';
import { MatButtonModule } from '@angular/material/button';
import { MatDialog } from '@angular/material/dialog';
import { MatFormFieldModule } from '@angular/material/form-field';
import { MatIconModule } from '@angular/material/icon';
import { MatInputModule } from '@angular/material/input';
import { MatProgressBarModule } from '@angular/material/progress-bar';
import { MatSlideToggleModule } from '@angular/material/slide-toggle';
import { Router, RouterLink } from '@angular/router';
import { CLIENT_TEXT_LIMITS } from '@keepstitch/shared';
import { filter, switchMap, tap } from 'rxjs';

import { apiErrorOf, messageFor } from '../core/api-error';
import { Notices } from '../core/notices';
import { keepUnsavedWork } from '../core/unsaved-work';
import { showDate } from '../ui/dates';
import { applyServerFieldErrors } from '../ui/server-field-errors';
import { Client, ClientDraft } from './client';
import { ClientHistory } from './client-history';
import { ClientsApi } from './clients-api';
import { DeleteClientDialog, DeleteClientDialogData } from './delete-client-dialog';

export const clientLimits = CLIENT_TEXT_LIMITS;

/** Optional text: trimmed, and sent as null when left empty. */
function optionalText(value: string): string | null {
  const trimmed = value.trim();
  return trimmed === '' ? null : trimmed;
}

/** Adds a client record, or changes or deletes one (owner only). */
@Component({
  selector: 'ks-client-form',
  imports: [
    ReactiveFormsModule,
    RouterLink,
    MatFormFieldModule,
    MatInputModule,
    MatSlideToggleModule,
    MatButtonModule,
    MatIconModule,
    MatProgressBarModule,
    ClientHistory,
  ],
  templateUrl: './client-form.html',
  styleUrl: './client-form.scss',
  changeDetection: ChangeDetectionStrategy.OnPush,
})
export class ClientForm implements OnInit {
  private readonly api = inject(ClientsApi);
  private readonly router = inject(Router);
  private readonly dialog = inject(MatDialog);
  private readonly notices = inject(Notices);
  private readonly host = inject<ElementRef<HTMLElement>>(ElementRef);

  /** The record's id from the address (`/clients/:id`); absent when adding. */
  readonly id = input<string>();

  protected readonly limits = clientLimits;
  protected readonly form = new FormGroup({
    name: new FormControl('', {
      nonNullable: true,
      validators: [Validators.required, Validators.maxLength(clientLimits.name)],
    }),
    email: new FormControl('', {
      nonNullable: true,
      validators: [Validators.email, Validators.maxLength(clientLimits.email)],
    }),
    phone: new FormControl('', {
      nonNullable: true,
      validators: [Validators.maxLength(clientLimits.phone)],
    }),
    address: new FormControl('', {
      nonNullable: true,
      validators: [Validators.maxLength(clientLimits.address)],
    }),
    notes: new FormControl('', {
      nonNullable: true,
      validators: [Validators.maxLength(clientLimits.notes)],
    }),
    portfolioConsent: new FormControl(false, { nonNullable: true }),
  });

  protected readonly clientId = computed(() => {
    const raw = this.id();
    const id = Number(raw);
    return raw !== undefined && Number.isInteger(id) && id > 0 ? id : null;
  });
  protected readonly editing = computed(() => this.id() !== undefined);
  protected readonly record = signal<Client | null>(null);
  protected readonly loadState = signal<'ready' | 'loading' | 'missing' | 'failed'>('ready');
  protected readonly saving = signal(false);
  protected readonly deleting = signal(false);
  protected readonly formError = signal<string | null>(null);
  protected readonly inviting = signal(false);
  protected readonly inviteError = signal<string | null>(null);
  /** The invitation to the client's page, as the owner sees it (absent for anyone else). */
  protected readonly invitation = computed(() => {
    const client = this.record();
    if (!client?.invitationState) return null;
    const sentOn = client.invitationSentAt ? showDate(client.invitationSentAt.slice(0, 10)) : null;
    return { state: client.invitationState, sentOn, hasEmail: client.email !== null };
  });

  constructor() {
    keepUnsavedWork(() => this.form.dirty);
  }

  ngOnInit(): void {
    if (!this.editing()) {
      return;
    }
    const id = this.clientId();
    if (id === null) {
      this.loadState.set('missing');
      return;
    }
    this.loadState.set('loading');
    this.api.get(id).subscribe({
      next: (client) => {
        this.record.set(client);
        this.form.reset({
          name: client.name,
          email: client.email ?? '',
          phone: client.phone ?? '',
          address: client.address ?? '',
          notes: client.notes ?? '',
          portfolioConsent: client.portfolioConsent,
        });
        this.loadState.set('ready');
      },
      error: (error: unknown) => {
        const missing = error instanceof HttpErrorResponse && error.status === 404;
        this.loadState.set(missing ? 'missing' : 'failed');
      },
    });
  }

  protected saveClient(): void {
    if (this.saving()) {
      return;
    }
    this.formError.set(null);
    if (this.form.invalid) {
      this.form.markAllAsTouched();
      this.focusFirstProblem();
      return;
    }
    const id = this.clientId();
    const draft = this.draft();
    this.saving.set(true);
    const request = id === null ? this.api.create(draft) : this.api.update(id, draft);
    request.subscribe({
      next: (client) => {
        this.saving.set(false);
        this.form.markAsPristine();
        this.notices.info(id === null ? `${client.name} added` : `Changes to ${client.name} saved`);
        void this.router.navigateByUrl('/clients');
      },
      error: (error: unknown) => {
        // The form keeps every value typed, so nothing is lost.
        this.saving.set(false);
        const body = apiErrorOf(error);
        const unmatched = applyServerFieldErrors(this.form, body?.fields);
        this.formError.set([body?.message ?? messageFor(error), ...unmatched].join(' '));
        this.focusFirstProblem();
      },
    });
  }

  protected deleteClient(): void {
    const client = this.record();
    if (!client || this.deleting()) {
      return;
    }
    this.dialog
      .open<DeleteClientDialog, DeleteClientDialogData, boolean>(DeleteClientDialog, {
        data: { name: client.name },
        width: '28rem',
      })
      .afterClosed()
      .pipe(
        filter((confirmed) => confirmed === true),
        tap(() => {
          this.deleting.set(true);
          this.formError.set(null);
        }),
        switchMap(() => this.api.remove(client.id)),
      )
      .subscribe({
        next: () => {
          this.notices.info(`${client.name} deleted`);
          void this.router.navigateByUrl('/clients');
        },
        error: (error: unknown) => {
          this.deleting.set(false);
          this.formError.set(messageFor(error));
        },
      });
  }

  /** Sends the invitation to the saved e-mail address (again), then shows its new state. */
  protected inviteClient(): void {
    const client = this.record();
    if (!client || this.inviting()) {
      return;
    }
    this.inviting.set(true);
    this.inviteError.set(null);
    this.api.invite(client.id).subscribe({
      next: (updated) => {
        this.inviting.set(false);
        this.record.set(updated);
        this.notices.info(`Invitation sent to ${updated.email ?? client.email ?? client.name}`);
      },
      error: (error: unknown) => {
        this.inviting.set(false);
        this.inviteError.set(apiErrorOf(error)?.message ?? messageFor(error));
      },
    });
  }

    protected cancel(): void {
    void this.router.navigateByUrl('/clients');
  }

  private draft(): ClientDraft {
    const value = this.form.getRawValue();
    return {
      name: value.name.trim(),
      email: optionalText(value.email),
      phone: optionalText(value.phone),
      address: optionalText(value.address),
      notes: optionalText(value.notes),
      portfolioConsent: value.portfolioConsent,
    };
  }

  private focusFirstProblem(): void {
    queueMicrotask(() => {
      const invalid = this.host.nativeElement.querySelector<HTMLElement>(
        'input.ng-invalid, textarea.ng-invalid',
      );
      (invalid ?? this.host.nativeElement.querySelector<HTMLElement>('.form-error'))?.focus();
    });
  }
}
