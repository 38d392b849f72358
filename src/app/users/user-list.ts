import { ChangeDetectionStrategy, Component, computed, inject, signal } from '@angular/core';
import { MatButtonModule } from '@angular/material/button';
import { MatDialog } from '@angular/material/dialog';
import { MatIconModule } from '@angular/material/icon';
import { MatTableModule } from '@angular/material/table';
import { Router } from '@angular/router';
import { catchError, forkJoin, map, of } from 'rxjs';

import { Notices } from '../core/notices';
import { User, roleLabels } from '../core/user';
import { ClientsApi } from '../clients/clients-api';
import { LoadStatus } from '../ui/load-status';
import { ResetPasswordDialog, ResetPasswordDialogData } from './reset-password-dialog';
import { UsersApi } from './users-api';

/** Everyone who can sign in to the studio's Keepstitch. */
@Component({
  selector: 'ks-user-list',
  imports: [MatTableModule, MatButtonModule, MatIconModule, LoadStatus],
  templateUrl: './user-list.html',
  styleUrl: './user-list.scss',
  changeDetection: ChangeDetectionStrategy.OnPush,
})
export class UserList {
  private readonly usersApi = inject(UsersApi);
  private readonly clientsApi = inject(ClientsApi);
  private readonly dialog = inject(MatDialog);
  private readonly notices = inject(Notices);
  private readonly router = inject(Router);

  protected readonly columns = ['name', 'email', 'role', 'client', 'actions'];
  protected readonly users = signal<User[]>([]);
  protected readonly clientNames = signal<ReadonlyMap<number, string>>(new Map());
  protected readonly loading = signal(true);
  protected readonly failed = signal(false);
  protected readonly status = computed(() => {
    if (this.loading()) return 'Loading users…';
    if (this.failed()) return 'The users could not be loaded.';
    return `${this.users().length} users.`;
  });

  constructor() {
    this.load();
  }

  protected load(): void {
    this.loading.set(true);
    this.failed.set(false);
    forkJoin({
      users: this.usersApi.list(),
      // Only for showing which record a client sign-in belongs to.
      clients: this.clientsApi.list({ page: 0, pageSize: 100, sort: 'name', dir: 'asc' }).pipe(
        map((page) => page.items),
        catchError(() => of([])),
      ),
    }).subscribe({
      next: ({ users, clients }) => {
        this.users.set(users);
        this.clientNames.set(new Map(clients.map((client) => [client.id, client.name])));
        this.loading.set(false);
      },
      error: () => {
        this.loading.set(false);
        this.failed.set(true);
      },
    });
  }

  protected roleLabel(user: User): string {
    return roleLabels[user.role];
  }

  protected addUser(): void {
    void this.router.navigateByUrl('/users/new');
  }

  protected resetPassword(user: User): void {
    this.dialog
      .open<ResetPasswordDialog, ResetPasswordDialogData, boolean>(ResetPasswordDialog, {
        data: { id: user.id, name: user.name },
        width: '28rem',
      })
      .afterClosed()
      .subscribe((changed) => {
        if (changed) {
          this.notices.info(`New password set for ${user.name}`);
        }
      });
  }
}
