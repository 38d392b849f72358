import { ChangeDetectionStrategy, Component, input } from '@angular/core';

import { Photo } from './photo';

/** Thumbnails that open the full image; says so when there are none. */
@Component({
  selector: 'ks-photo-gallery',
  template: `
    @if (photos().length === 0) {
      <p class="empty" data-testid="gallery-empty">{{ emptyText() }}</p>
    } @else {
      <ul class="gallery" [attr.aria-label]="label()">
        @for (photo of photos(); track photo.id) {
          <li>
            <a [href]="photo.url" target="_blank" rel="noopener">
              <img
                [src]="photo.thumbUrl"
                [alt]="photo.caption || photo.originalName || 'Photo'"
                loading="lazy"
              />
            </a>
            @if (photo.caption) {
              <span class="caption">{{ photo.caption }}</span>
            }
          </li>
        }
      </ul>
    }
  `,
  styles: `
    .gallery {
      list-style: none;
      margin: 0;
      padding: 0;
      display: grid;
      grid-template-columns: repeat(auto-fill, minmax(7.5rem, 1fr));
      gap: 0.5rem;
    }
    li {
      display: flex;
      flex-direction: column;
      gap: 0.25rem;
    }
    img {
      width: 100%;
      aspect-ratio: 1;
      object-fit: cover;
      border-radius: var(--mat-sys-corner-small);
      display: block;
    }
    a:focus-visible img {
      outline: 3px solid var(--mat-sys-primary);
    }
    .caption,
    .empty {
      font: var(--mat-sys-body-small);
      color: var(--mat-sys-on-surface-variant);
    }
  `,
  changeDetection: ChangeDetectionStrategy.OnPush,
})
export class PhotoGallery {
  readonly photos = input<readonly Photo[]>([]);
  readonly label = input('Photos');
  readonly emptyText = input('No photos yet.');
}
