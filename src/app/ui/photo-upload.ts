import { HttpClient, HttpContext, HttpEventType } from '@angular/common/http';
import {
  ChangeDetectionStrategy,
  Component,
  DestroyRef,
  ElementRef,
  computed,
  effect,
  inject,
  input,
  output,
  signal,
  viewChild,
} from '@angular/core';
import { MatButtonModule } from '@angular/material/button';
import { MatIconModule } from '@angular/material/icon';
import { MatProgressBarModule } from '@angular/material/progress-bar';
import { Subscription } from 'rxjs';

import { REPORT_API_ERRORS, messageFor } from '../core/api-error';
import { Photo, photoUploadReplySchema } from './photo';

/** The image types the server accepts (it checks the bytes again). */
export const ACCEPTED_PHOTO_TYPES = ['image/jpeg', 'image/png', 'image/webp'] as const;
/** The server's limit per file. */
export const MAX_PHOTO_BYTES = 15 * 1024 * 1024;

type UploadState = 'waiting' | 'uploading' | 'done' | 'failed' | 'refused';

interface UploadItem {
  key: number;
  name: string;
  file: File;
  previewUrl: string | null;
  state: UploadState;
  /** 0–100 while uploading, when the browser reports a total. */
  progress: number | null;
  error: string | null;
}

function megabytes(bytes: number): string {
  return `${(bytes / (1024 * 1024)).toFixed(1)} MB`;
}

/** Why a file will not be sent, or null when it may go. */
export function refusalFor(file: File): string | null {
  if (!(ACCEPTED_PHOTO_TYPES as readonly string[]).includes(file.type)) {
    return `“${file.name}” is not a JPEG, PNG or WebP image, so it was not sent. Save it as one of those and try again.`;
  }
  if (file.size === 0) {
    return `“${file.name}” is empty, so it was not sent.`;
  }
  if (file.size > MAX_PHOTO_BYTES) {
    return `“${file.name}” is ${megabytes(file.size)}; a photo can be at most 15 MB, so it was not sent.`;
  }
  return null;
}

/**
 * Choose or drop photos; each goes to `url` in its own request (field "photos")
 * with its own progress bar and its own error. While `url` is null, chosen files
 * wait and are sent as soon as it is set (for a record that is still being saved).
 */
@Component({
  selector: 'ks-photo-upload',
  imports: [MatButtonModule, MatIconModule, MatProgressBarModule],
  templateUrl: './photo-upload.html',
  styleUrl: './photo-upload.scss',
  changeDetection: ChangeDetectionStrategy.OnPush,
})
export class PhotoUpload {
  private readonly http = inject(HttpClient);
  private readonly subscriptions = new Map<number, Subscription>();
  private nextKey = 1;

  /** Where to POST the photos; null to hold them until it is known. */
  readonly url = input<string | null>(null);
  readonly caption = input<string | null>(null);
  /** Names the drop zone for screen readers, e.g. "Photos of the garment". */
  readonly label = input('Photos');
  /** Emits the stored photos of each file once the server has them. */
  readonly uploaded = output<Photo[]>();

  private readonly fileInput = viewChild.required<ElementRef<HTMLInputElement>>('fileInput');

  protected readonly accept = ACCEPTED_PHOTO_TYPES.join(',');
  protected readonly items = signal<UploadItem[]>([]);
  protected readonly dragging = signal(false);
  protected readonly waiting = computed(() => this.items().some((item) => item.state === 'waiting'));
  protected readonly status = computed(() => {
    const items = this.items();
    const sending = items.filter((i) => i.state === 'uploading').length;
    const done = items.filter((i) => i.state === 'done').length;
    if (sending) return `Uploading ${sending} photo${sending === 1 ? '' : 's'}…`;
    if (done) return `${done} photo${done === 1 ? '' : 's'} uploaded.`;
    return '';
  });

  constructor() {
    effect(() => {
      const url = this.url();
      if (url) {
        for (const item of this.items()) {
          if (item.state === 'waiting') this.send(item, url);
        }
      }
    });
    inject(DestroyRef).onDestroy(() => {
      for (const subscription of this.subscriptions.values()) subscription.unsubscribe();
      for (const item of this.items()) {
        if (item.previewUrl) URL.revokeObjectURL(item.previewUrl);
      }
    });
  }

  protected choose(): void {
    this.fileInput().nativeElement.click();
  }

  protected filesChosen(event: Event): void {
    const inputElement = event.target as HTMLInputElement;
    this.addFiles(Array.from(inputElement.files ?? []));
    inputElement.value = '';
  }

  protected dragOver(event: DragEvent): void {
    event.preventDefault();
    this.dragging.set(true);
  }

  protected dragLeave(): void {
    this.dragging.set(false);
  }

  protected dropped(event: DragEvent): void {
    event.preventDefault();
    this.dragging.set(false);
    this.addFiles(Array.from(event.dataTransfer?.files ?? []));
  }

  /** Checks each file, shows it, and sends it (now, or when the URL is known). */
  addFiles(files: readonly File[]): void {
    const url = this.url();
    for (const file of files) {
      const refusal = refusalFor(file);
      const item: UploadItem = {
        key: this.nextKey++,
        name: file.name,
        file,
        previewUrl: refusal ? null : URL.createObjectURL(file),
        state: refusal ? 'refused' : 'waiting',
        progress: null,
        error: refusal,
      };
      this.items.update((items) => [...items, item]);
      if (!refusal && url) this.send(item, url);
    }
  }

  protected retry(item: UploadItem): void {
    const url = this.url();
    if (url) this.send(item, url);
  }

  protected remove(item: UploadItem): void {
    this.subscriptions.get(item.key)?.unsubscribe();
    this.subscriptions.delete(item.key);
    if (item.previewUrl) URL.revokeObjectURL(item.previewUrl);
    this.items.update((items) => items.filter((i) => i.key !== item.key));
  }

  private patch(key: number, changes: Partial<UploadItem>): void {
    this.items.update((items) => items.map((i) => (i.key === key ? { ...i, ...changes } : i)));
  }

  private send(item: UploadItem, url: string): void {
    const body = new FormData();
    body.append('photos', item.file, item.file.name);
    const caption = this.caption();
    if (caption) body.append('caption', caption);
    this.patch(item.key, { state: 'uploading', progress: 0, error: null });
    const subscription = this.http
      .post<unknown>(url, body, {
        reportProgress: true,
        observe: 'events',
        context: new HttpContext().set(REPORT_API_ERRORS, false),
      })
      .subscribe({
        next: (event) => {
          if (event.type === HttpEventType.UploadProgress) {
            const progress = event.total ? Math.round((100 * event.loaded) / event.total) : null;
            this.patch(item.key, { progress });
          } else if (event.type === HttpEventType.Response) {
            const reply = photoUploadReplySchema.safeParse(event.body);
            this.patch(item.key, { state: 'done', progress: 100 });
            this.uploaded.emit(reply.success ? reply.data.items : []);
          }
        },
        error: (error: unknown) => {
          this.patch(item.key, { state: 'failed', progress: null, error: messageFor(error) });
          this.subscriptions.delete(item.key);
        },
        complete: () => this.subscriptions.delete(item.key),
      });
    this.subscriptions.set(item.key, subscription);
  }
}
