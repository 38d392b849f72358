import { DatePipe, PercentPipe } from '@angular/common';
import { ChangeDetectionStrategy, Component, DestroyRef, computed, effect, inject, input, signal } from '@angular/core';
import { takeUntilDestroyed } from '@angular/core/rxjs-interop';
import { FormControl, ReactiveFormsModule } from '@angular/forms';
import { MatButtonModule } from '@angular/material/button';
import { MatFormFieldModule } from '@angular/material/form-field';
import { MatIconModule } from '@angular/material/icon';
import { MatInputModule } from '@angular/material/input';
import { RouterLink } from '@angular/router';
import { DesignBody, DesignDerivation, DesignPlanSummary, DomainError, Length, deriveDesign, designKeptFeatures, formatFabricLength, formatLength, printoutPdfs, PRINTOUTS } from '@keepstitch/shared';
import { Subject, debounceTime, switchMap, catchError, of } from 'rxjs';

import { messageFor } from '../core/api-error';
import { Auth } from '../core/auth';
import { Notices } from '../core/notices';
import { keepUnsavedWork } from '../core/unsaved-work';
import { LoadStatus } from '../ui/load-status';
import { DesignScreen, DesignVersion, Fabric, starterDesign } from './design';
import { DesignForm } from './design-form';
import { DesignVersionView } from './design-version-view';
import { DesignsApi } from './designs-api';
import { FabricBoard, FabricChoices } from './fabric-board';
import { QuiltDrawing } from './quilt-drawing';

type LoadState = 'loading' | 'ready' | 'missing' | 'failed';

/** A commission's design: the form, the live drawing, who gives which fabric, and what the plan says. */
@Component({
  selector: 'ks-design-page',
  imports: [DatePipe, PercentPipe, ReactiveFormsModule, RouterLink, MatButtonModule, MatIconModule, MatFormFieldModule, MatInputModule, DesignForm, QuiltDrawing, FabricBoard, DesignVersionView, LoadStatus],
  templateUrl: './design-page.html',
  styleUrl: './design-page.scss',
  changeDetection: ChangeDetectionStrategy.OnPush,
})
export class DesignPage {
  private readonly api = inject(DesignsApi);
  private readonly auth = inject(Auth);
  private readonly notices = inject(Notices);
  private readonly destroyRef = inject(DestroyRef);

  /** From the route, `/designs/:id` (the commission id). */
  readonly id = input.required<string>();
  protected readonly commissionId = computed(() => Number(this.id()));
  protected readonly isOwner = computed(() => this.auth.role() === 'owner');

  protected readonly state = signal<LoadState>('loading');
  protected readonly screen = signal<DesignScreen | null>(null);
  protected readonly body = signal<DesignBody | null>(null);
  protected readonly plan = signal<DesignPlanSummary | null>(null);
  protected readonly fabrics = signal<readonly Fabric[]>([]);
  protected readonly planning = signal(false);
  protected readonly planError = signal<string | null>(null);
  protected readonly saving = signal(false);
  /** Changed here since it was loaded or saved. */
  protected readonly edited = signal(false);
  protected readonly note = new FormControl('', { nonNullable: true });
  /** An earlier version opened for reading. */
  protected readonly viewing = signal<DesignVersion | null>(null);
  protected readonly versionError = signal<string | null>(null);

  /** Derived in the browser with the same maths as the server, so the drawing follows every keystroke. */
  protected readonly derivation = computed<{ derived: DesignDerivation | null; error: string | null }>(() => {
    const b = this.body();
    if (!b) return { derived: null, error: null };
    try {
      return { derived: deriveDesign(b), error: null };
    } catch (err) {
      return { derived: null, error: err instanceof DomainError ? err.message : 'The design cannot be worked out.' };
    }
  });
  protected readonly colours = computed(() => Object.fromEntries(this.fabrics().map((f) => [f.key, f.hex])) as Record<string, string>);
  protected readonly size = computed(() => {
    const d = this.derivation().derived;
    if (!d) return null;
    const both = (mm: string) => `${formatLength(Length.millimetres(mm), 'imperial')} (${formatLength(Length.millimetres(mm), 'metric')})`;
    const diff = (mm: string) => {
      const l = Length.millimetres(mm);
      if (l.isZero()) return 'on target';
      return `${l.isNegative() ? '' : '+'}${formatLength(l, 'imperial')} (${l.isNegative() ? '' : '+'}${formatLength(l, 'metric')})`;
    };
    return { width: both(d.finished.widthMm), length: both(d.finished.lengthMm), targetWidth: both(d.target.widthMm), targetLength: both(d.target.lengthMm), diffWidth: diff(d.difference.widthMm), diffLength: diff(d.difference.lengthMm) };
  });
  protected readonly garmentName = computed(() => new Map(this.fabrics().map((f) => [f.key, f.name])));
  /** Where the plan keeps features whole, for the drawing to mark. */
  protected readonly keptPlaces = computed(() => {
    const b = this.body();
    const d = this.derivation().derived;
    const p = this.plan();
    return b && d && p ? designKeptFeatures({ body: b, derived: d, plan: p }) : [];
  });

  private readonly replan$ = new Subject<DesignBody>();

  constructor() {
    keepUnsavedWork(() => this.edited());
    effect(() => this.load(this.commissionId()));
    this.replan$
      .pipe(
        debounceTime(400),
        switchMap((b) => {
          this.planning.set(true);
          return this.api.preview(this.commissionId(), b).pipe(catchError((err: unknown) => of({ error: messageFor(err) })));
        }),
        takeUntilDestroyed(this.destroyRef),
      )
      .subscribe((reply) => {
        this.planning.set(false);
        if ('error' in reply) {
          this.planError.set(reply.error);
          return;
        }
        this.planError.set(null);
        this.plan.set(reply.plan);
        this.fabrics.set(reply.fabrics);
      });
  }

  protected load(id = this.commissionId()): void {
    this.api.screen(id).subscribe({
      next: (s) => {
        this.screen.set(s);
        this.fabrics.set(s.fabrics);
        this.body.set(s.current?.body ?? starterDesign(s.commission.widthMm, s.commission.lengthMm));
        this.plan.set(s.current?.plan ?? null);
        this.edited.set(false);
        this.state.set('ready');
        if (!s.current && this.isOwner()) this.replan$.next(this.body()!);
      },
      error: (err: unknown) => this.state.set((err as { status?: number }).status === 404 ? 'missing' : 'failed'),
    });
  }

  protected designChanged(b: DesignBody): void {
    this.body.set(b);
    this.edited.set(true);
    if (this.isOwner() && !this.derivationOf(b).error) this.replan$.next(b);
  }

  protected fabricChoicesChanged(choices: FabricChoices): void {
    const b = this.body();
    if (b) this.designChanged({ ...b, ...choices });
  }

  private derivationOf(b: DesignBody): { error: string | null } {
    try {
      deriveDesign(b);
      return { error: null };
    } catch (err) {
      return { error: err instanceof Error ? err.message : 'error' };
    }
  }

  protected save(): void {
    const b = this.body();
    if (!b || this.derivation().error) return;
    this.saving.set(true);
    this.api.save(this.commissionId(), b, this.note.value.trim() || null).subscribe({
      next: (v) => {
        this.saving.set(false);
        this.note.reset('');
        this.edited.set(false);
        this.notices.info(`Saved as version ${v.version}.`);
        this.load();
      },
      error: (err: unknown) => {
        this.saving.set(false);
        this.planError.set(messageFor(err));
      },
    });
  }

  protected share(): void {
    this.api.share(this.commissionId()).subscribe({
      next: () => {
        this.notices.info('Shared with the client.');
        this.load();
      },
      error: (err: unknown) => this.planError.set(messageFor(err)),
    });
  }

  protected viewVersion(version: number): void {
    this.versionError.set(null);
    this.api.version(this.commissionId(), version).subscribe({
      next: (v) => this.viewing.set(v),
      error: (err: unknown) => {
        this.viewing.set(null);
        this.versionError.set(messageFor(err));
      },
    });
  }

  /** Each printout this role may print, its page and its PDFs, from the printouts' registry. */
  protected readonly printouts = computed(() =>
    PRINTOUTS.filter((p) => this.auth.role() !== null && p.roles.includes(this.auth.role()!)).map((p) => ({
      id: p.id,
      title: p.title,
      needsDesign: p.source === 'design',
      pdfs: printoutPdfs(p, this.commissionId()).map((x) => ({ url: x.url, testId: `pdf-${p.id}${x.paper ? `-${x.paper}` : ''}`, label: x.paperName ? `${p.title} PDF, ${x.paperName}` : `${p.title} PDF` })),
    })),
  );

  protected fabricLength(mm: string): string {
    const l = Length.millimetres(mm);
    return `${formatFabricLength(l, 'yd')} (${formatFabricLength(l, 'm')})`;
  }

  protected both(mm: string): string {
    const l = Length.millimetres(mm);
    return `${formatLength(l, 'imperial')} (${formatLength(l, 'metric')})`;
  }

  protected areaText(mm2: number): string {
    return `${(mm2 / 645.16).toFixed(0)} sq in`;
  }
}
