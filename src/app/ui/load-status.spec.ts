import { Component, signal } from '@angular/core';
import { TestBed } from '@angular/core/testing';

import { LoadStatus } from './load-status';

@Component({
  imports: [LoadStatus],
  template: `
    <ks-load-status what="the clients" [loading]="loading()" [failed]="failed()" [working]="working()" [reason]="reason()" (retry)="retries = retries + 1">
      <a href="/elsewhere">Back</a>
    </ks-load-status>
  `,
})
class Host {
  readonly loading = signal(true);
  readonly failed = signal(false);
  readonly working = signal<string | null>(null);
  readonly reason = signal<string | null>(null);
  retries = 0;
}

describe('LoadStatus', () => {
  function setUp() {
    const fixture = TestBed.createComponent(Host);
    fixture.detectChanges();
    const el = fixture.nativeElement as HTMLElement;
    return { fixture, host: fixture.componentInstance, el };
  }

  it('names the bar while loading, and shows no message', () => {
    const { el } = setUp();
    expect(el.querySelector('mat-progress-bar')!.getAttribute('aria-label')).toBe('Loading the clients');
    expect(el.querySelector('[role=alert]')).toBeNull();
  });

  it('shows other work under its own name, and no bar when nothing runs', () => {
    const { fixture, host, el } = setUp();
    host.loading.set(false);
    host.working.set('Saving settings');
    fixture.detectChanges();
    expect(el.querySelector('mat-progress-bar')!.getAttribute('aria-label')).toBe('Saving settings');
    host.working.set(null);
    fixture.detectChanges();
    expect(el.querySelector('mat-progress-bar')).toBeNull();
    // The slot keeps its place, so what is below does not move when the bar goes.
    expect(el.querySelector('.loading-slot')).not.toBeNull();
  });

  it('says what could not be loaded, offers Try again and the page’s own way out', () => {
    const { fixture, host, el } = setUp();
    host.loading.set(false);
    host.failed.set(true);
    fixture.detectChanges();
    const alert = el.querySelector('[role=alert]')!;
    expect(alert.querySelector('p')!.textContent).toBe('The clients could not be loaded.');
    expect(alert.querySelector('a')!.textContent).toBe('Back');
    const button = [...alert.querySelectorAll('button')].find((b) => b.textContent!.includes('Try again'))!;
    button.click();
    button.click();
    expect(host.retries).toBe(2);
  });

  it('adds the reason the server gave, when there is one', () => {
    const { fixture, host, el } = setUp();
    host.loading.set(false);
    host.failed.set(true);
    host.reason.set('The local mail server is not answering.');
    fixture.detectChanges();
    expect(el.querySelector('[role=alert] p')!.textContent!.replace(/\s+/g, ' ').trim()).toBe('The clients could not be loaded. The local mail server is not answering.');
  });
});
