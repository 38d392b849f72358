import { DatePipe } from '@angular/common';
import { ChangeDetectionStrategy, Component, inject, signal } from '@angular/core';
import { MatCardModule } from '@angular/material/card';
import { MatIconModule } from '@angular/material/icon';

import { Client } from '../clients/client';
import { ClientsApi } from '../clients/clients-api';
import { LoadStatus } from '../ui/load-status';

/** A client's own record, to check what the studio holds about them. */
@Component({
  selector: 'ks-my-details',
  imports: [DatePipe, LoadStatus, MatCardModule, MatIconModule],
  templateUrl: './my-details.html',
  styleUrl: './my-details.scss',
  changeDetection: ChangeDetectionStrategy.OnPush,
})
export class MyDetails {
  private readonly clientsApi = inject(ClientsApi);
  protected readonly client = signal<Client | null>(null);
  protected readonly state = signal<'loading' | 'ready' | 'none' | 'failed'>('loading');

  constructor() {
    this.load();
  }

  protected load(): void {
    this.state.set('loading');
    this.clientsApi.own().subscribe({
      next: (client) => {
        this.client.set(client);
        this.state.set(client ? 'ready' : 'none');
      },
      error: () => this.state.set('failed'),
    });
  }
}
