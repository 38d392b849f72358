import { CdkDragDrop, DragDropModule } from '@angular/cdk/drag-drop';
import { ChangeDetectionStrategy, Component, computed, inject, signal } from '@angular/core';
import { MatButtonModule } from '@angular/material/button';
import { MatDialog } from '@angular/material/dialog';
import { MatIconModule } from '@angular/material/icon';
import { MatMenuModule } from '@angular/material/menu';
import { RouterLink } from '@angular/router';
import { ALL_STAGES, STAGES, STAGE_LABELS, Stage, WorkStage, moveNeedsNote } from '@keepstitch/shared';
import { Observable, of } from 'rxjs';

import { messageFor } from '../core/api-error';
import { Auth } from '../core/auth';
import { Notices } from '../core/notices';
import { LoadStatus } from '../ui/load-status';
import { Commission, daysLeftText } from './commission';
import { CommissionsApi } from './commissions-api';
import { MoveNoteDialog, MoveNoteDialogData } from './move-note-dialog';

/**
 * Open commissions as cards in one column per stage. The owner drags a card to
 * another column, or uses its "Move to…" menu; the server decides, and a refused
 * move puts the card back with the server's reason.
 */
@Component({
  selector: 'ks-commission-board',
  imports: [DragDropModule, RouterLink, MatButtonModule, MatIconModule, MatMenuModule, LoadStatus],
  templateUrl: './commission-board.html',
  styleUrl: './commission-board.scss',
  changeDetection: ChangeDetectionStrategy.OnPush,
})
export class CommissionBoard {
  private readonly api = inject(CommissionsApi);
  private readonly notices = inject(Notices);
  private readonly dialog = inject(MatDialog);
  private readonly auth = inject(Auth);

  protected readonly stageLabels = STAGE_LABELS;
  protected readonly allStages = ALL_STAGES;
  protected readonly daysLeftText = daysLeftText;
  protected readonly canMove = computed(() => this.auth.role() === 'owner');

  protected readonly items = signal<Commission[]>([]);
  protected readonly loading = signal(true);
  protected readonly failed = signal(false);
  protected readonly moving = signal<number | null>(null);
  protected readonly announcement = signal('');

  protected readonly columns = computed(() =>
    STAGES.map((stage) => ({ stage, cards: this.items().filter((c) => c.stage === stage) })),
  );
  protected readonly status = computed(() => {
    if (this.loading()) return 'Loading the board…';
    if (this.failed()) return 'The board could not be loaded.';
    return this.items().length === 0 ? 'No open commissions.' : this.announcement();
  });

  constructor() {
    this.load();
  }

  protected load(): void {
    this.loading.set(true);
    this.failed.set(false);
    this.api.list({ page: 0, pageSize: 100, sort: 'deadline', dir: 'asc', stages: STAGES }).subscribe({
      next: (page) => {
        this.items.set(page.items);
        this.loading.set(false);
      },
      error: () => {
        this.failed.set(true);
        this.loading.set(false);
      },
    });
  }

  protected dropped(event: CdkDragDrop<WorkStage>): void {
    if (event.previousContainer === event.container) return;
    this.moveCard(event.item.data as Commission, event.container.data);
  }

  /** Moves the card at once, asks the server, and puts it back if the server says no. */
  protected moveCard(card: Commission, to: Stage): void {
    const from = card.stage;
    if (from === to || this.moving() !== null) return;
    this.askNote(card, to).subscribe((note) => {
      if (note === undefined) return;
      this.setStage(card.id, to);
      this.moving.set(card.id);
      this.api.moveStage(card.id, to, note ?? undefined).subscribe({
        next: (reply) => {
          this.setStage(card.id, reply.stage);
          this.moving.set(null);
          this.announcement.set(`“${card.title}” moved to ${STAGE_LABELS[reply.stage]}.`);
          if (reply.stage === 'cancelled') this.items.update((items) => items.filter((c) => c.id !== card.id));
        },
        error: (error: unknown) => {
          this.setStage(card.id, from);
          this.moving.set(null);
          this.announcement.set(`“${card.title}” stays at ${STAGE_LABELS[from]}.`);
          this.notices.error(messageFor(error));
        },
      });
    });
  }

  /** Undefined when the person backs out; null when no note is needed. */
  private askNote(card: Commission, to: Stage): Observable<string | null | undefined> {
    if (!moveNeedsNote(card.stage, to)) return of(null);
    return this.dialog
      .open<MoveNoteDialog, MoveNoteDialogData, string>(MoveNoteDialog, {
        data: { title: card.title, stageLabel: STAGE_LABELS[to] },
      })
      .afterClosed();
  }

  private setStage(id: number, stage: Stage): void {
    this.items.update((items) => items.map((c) => (c.id === id ? { ...c, stage } : c)));
  }
}
