import { HttpErrorResponse } from '@angular/common/http';
import { ChangeDetectionStrategy, Component, inject, signal } from '@angular/core';
import { toSignal } from '@angular/core/rxjs-interop';
import { FormControl, FormGroup, ReactiveFormsModule, Validators } from '@angular/forms';
import { MatButtonModule } from '@angular/material/button';
import { MatFormFieldModule } from '@angular/material/form-field';
import { MatIconModule } from '@angular/material/icon';
import { MatInputModule } from '@angular/material/input';
import { MatProgressBarModule } from '@angular/material/progress-bar';
import { MatSelectModule } from '@angular/material/select';
import { Router, RouterLink } from '@angular/router';
import { USER_TEXT_LIMITS } from '@keepstitch/shared';
import { catchError, map, of, startWith } from 'rxjs';

import { apiErrorOf, messageFor } from '../core/api-error';
import { Notices } from '../core/notices';
import { ClientsApi } from '../clients/clients-api';
import { keepUnsavedWork } from '../core/unsaved-work';
import { applyServerFieldErrors } from '../ui/server-field-errors';
import { NewUser, UsersApi, minPasswordLength } from './users-api';

type NewRole = NewUser['role'];

/** Opens a sign-in for a workroom helper, or for a client linked to their record. */
@Component({
  selector: 'ks-user-form',
  imports: [
    ReactiveFormsModule,
    RouterLink,
    MatFormFieldModule,
    MatInputModule,
    MatSelectModule,
    MatButtonModule,
    MatIconModule,
    MatProgressBarModule,
  ],
  templateUrl: './user-form.html',
  styleUrl: './user-form.scss',
  changeDetection: ChangeDetectionStrategy.OnPush,
})
export class UserForm {
  private readonly usersApi = inject(UsersApi);
  private readonly router = inject(Router);
  private readonly notices = inject(Notices);

  protected readonly minLength = minPasswordLength;
  protected readonly form = new FormGroup({
    name: new FormControl('', { nonNullable: true, validators: [Validators.required, Validators.maxLength(USER_TEXT_LIMITS.name)] }),
    email: new FormControl('', { nonNullable: true, validators: [Validators.required, Validators.email] }),
    role: new FormControl<NewRole>('workroom', { nonNullable: true }),
    clientId: new FormControl<number | null>({ value: null, disabled: true }, [Validators.required]),
    password: new FormControl('', {
      nonNullable: true,
      validators: [Validators.required, Validators.minLength(minPasswordLength)],
    }),
  });

  /** Client records to link a client sign-in to (the first hundred, by name). */
  protected readonly clients = toSignal(
    inject(ClientsApi)
      .list({ page: 0, pageSize: 100, sort: 'name', dir: 'asc' })
      .pipe(
        map((page) => page.items),
        catchError(() => of([])),
      ),
    { initialValue: [] },
  );
  protected readonly role = toSignal(
    this.form.controls.role.valueChanges.pipe(startWith(this.form.controls.role.value)),
    { requireSync: true },
  );
  protected readonly saving = signal(false);
  protected readonly formError = signal<string | null>(null);

  constructor() {
    keepUnsavedWork(() => this.form.dirty);
    // A client record is asked for (and required) only for a client sign-in.
    this.form.controls.role.valueChanges.subscribe((role) => {
      const clientId = this.form.controls.clientId;
      if (role === 'client') {
        clientId.enable();
      } else {
        clientId.disable();
      }
    });
  }

  protected createUser(): void {
    if (this.saving()) {
      return;
    }
    this.formError.set(null);
    if (this.form.invalid) {
      this.form.markAllAsTouched();
      return;
    }
    const value = this.form.getRawValue();
    const user: NewUser = {
      name: value.name.trim(),
      email: value.email.trim(),
      role: value.role,
      password: value.password,
    };
    if (value.role === 'client' && value.clientId !== null) {
      user.clientId = value.clientId;
    }
    this.saving.set(true);
    this.usersApi.create(user).subscribe({
      next: (created) => {
        this.saving.set(false);
        this.notices.info(`${created.name} can now sign in`);
        this.form.markAsPristine();
        void this.router.navigateByUrl('/users');
      },
      error: (error: unknown) => {
        this.saving.set(false);
        const body = apiErrorOf(error);
        const unmatched = applyServerFieldErrors(this.form, body?.fields);
        if (error instanceof HttpErrorResponse && error.status === 409 && !body?.fields) {
          this.form.controls.email.setErrors({ server: body?.message ?? 'That e-mail is already in use' });
          this.form.controls.email.markAsTouched();
        }
        this.formError.set([body?.message ?? messageFor(error), ...unmatched].join(' '));
      },
    });
  }
}
