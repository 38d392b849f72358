import { HttpEventType, provideHttpClient } from '@angular/common/http';
import { HttpTestingController, provideHttpClientTesting } from '@angular/common/http/testing';
import { ChangeDetectionStrategy, Component, signal, viewChild } from '@angular/core';
import { ComponentFixture, TestBed } from '@angular/core/testing';
import { TestbedHarnessEnvironment } from '@angular/cdk/testing/testbed';
import { HarnessLoader } from '@angular/cdk/testing';
import { MatButtonHarness } from '@angular/material/button/testing';
import { MatProgressBarHarness } from '@angular/material/progress-bar/testing';

import { Photo } from './photo';
import { MAX_PHOTO_BYTES, PhotoUpload } from './photo-upload';

@Component({
  imports: [PhotoUpload],
  template: `<ks-photo-upload [url]="url()" label="Photos of the shirt" (uploaded)="stored.push($event)" />`,
  changeDetection: ChangeDetectionStrategy.OnPush,
})
class Host {
  readonly url = signal<string | null>('/api/garments/7/photos');
  readonly stored: Photo[][] = [];
  readonly upload = viewChild.required(PhotoUpload);
}

const photo: Photo = {
  id: 31,
  garmentId: 7,
  kind: 'garment',
  originalName: 'shirt.jpg',
  width: 800,
  height: 600,
  caption: null,
  createdAt: '2026-11-02T10:00:00Z',
  url: '/api/photos/31/image',
  thumbUrl: '/api/photos/31/thumb',
};

function jpeg(name: string, bytes = 1200): File {
  return new File([new Uint8Array(bytes)], name, { type: 'image/jpeg' });
}

describe('PhotoUpload', () => {
  let fixture: ComponentFixture<Host>;
  let host: Host;
  let loader: HarnessLoader;
  let httpMock: HttpTestingController;
  let element: HTMLElement;

  beforeEach(async () => {
    TestBed.configureTestingModule({
      imports: [Host],
      providers: [provideHttpClient(), provideHttpClientTesting()],
    });
    fixture = TestBed.createComponent(Host);
    host = fixture.componentInstance;
    element = fixture.nativeElement as HTMLElement;
    loader = TestbedHarnessEnvironment.loader(fixture);
    httpMock = TestBed.inject(HttpTestingController);
    await fixture.whenStable();
  });

  afterEach(() => httpMock?.verify());

  function fileRows(): HTMLElement[] {
    return Array.from(element.querySelectorAll<HTMLElement>('[data-testid="upload-file"]'));
  }

  it('sends each file as "photos" and shows its upload progress from the events', async () => {
    host.upload().addFiles([jpeg('sunday-shirt.jpg')]);
    await fixture.whenStable();

    const request = httpMock.expectOne('/api/garments/7/photos');
    expect(request.request.method).toBe('POST');
    const body = request.request.body as FormData;
    expect((body.get('photos') as File).name).toBe('sunday-shirt.jpg');
    expect(request.request.reportProgress).toBeTrue();

    request.event({ type: HttpEventType.UploadProgress, loaded: 300, total: 1200 });
    await fixture.whenStable();
    const bar = await loader.getHarness(MatProgressBarHarness);
    expect(await bar.getMode()).toBe('determinate');
    expect(await bar.getValue()).toBe(25);

    request.flush({ items: [photo] }, { status: 201, statusText: 'Created' });
    await fixture.whenStable();
    expect(await loader.getAllHarnesses(MatProgressBarHarness)).toEqual([]);
    expect(fileRows()[0].textContent).toContain('Uploaded');
    expect(host.stored).toEqual([[photo]]);
  });

  it("shows the server's refusal beside the file it concerns, and the other file still goes", async () => {
    host.upload().addFiles([jpeg('renamed.jpg'), jpeg('cardigan.jpg')]);
    await fixture.whenStable();

    const [first, second] = httpMock.match('/api/garments/7/photos');
    first.flush(
      { error: { code: 'unsupported_type', message: 'That file is not a JPEG, PNG or WebP image.' } },
      { status: 415, statusText: 'Unsupported Media Type' },
    );
    second.flush({ items: [photo] }, { status: 201, statusText: 'Created' });
    await fixture.whenStable();

    const [failed, sent] = fileRows();
    expect(failed.querySelector('[data-testid="upload-error"]')?.textContent).toContain(
      'That file is not a JPEG, PNG or WebP image.',
    );
    expect(sent.querySelector('[data-testid="upload-error"]')).toBeNull();
    expect(sent.textContent).toContain('Uploaded');
    expect(host.stored.length).toBe(1);
  });

  it('refuses a file over 15 MB and a HEIC photo before sending anything', async () => {
    const big = jpeg('huge.jpg', MAX_PHOTO_BYTES + 1);
    const heic = new File([new Uint8Array(10)], 'phone.heic', { type: 'image/heic' });
    host.upload().addFiles([big, heic]);
    await fixture.whenStable();

    httpMock.expectNone('/api/garments/7/photos');
    const errors = fileRows().map((row) => row.querySelector('[data-testid="upload-error"]')?.textContent ?? '');
    expect(errors[0]).toContain('at most 15 MB');
    expect(errors[1]).toContain('not a JPEG, PNG or WebP image');
  });

  it('holds chosen files until the address to send them to is known', async () => {
    host.url.set(null);
    await fixture.whenStable();
    host.upload().addFiles([jpeg('scarf.png')]);
    await fixture.whenStable();
    httpMock.expectNone(() => true);
    expect(element.textContent).toContain('Waiting to be sent');

    host.url.set('/api/garments/9/photos');
    await fixture.whenStable();
    httpMock.expectOne('/api/garments/9/photos').flush({ items: [photo] }, { status: 201, statusText: 'Created' });
    await fixture.whenStable();
    expect(host.stored.length).toBe(1);
  });

  it('opens the file chooser from the "Upload photos" button', async () => {
    const input = element.querySelector<HTMLInputElement>('input[type=file]')!;
    expect(input.accept).toBe('image/jpeg,image/png,image/webp');
    expect(input.multiple).toBeTrue();
    const click = spyOn(input, 'click');
    await (await loader.getHarness(MatButtonHarness.with({ text: /Upload photos/ }))).click();
    expect(click).toHaveBeenCalled();
  });
});
