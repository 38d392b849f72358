import { HttpErrorResponse } from '@angular/common/http';
import { Component, signal } from '@angular/core';
import { TestBed } from '@angular/core/testing';
import { Subject, type Observable } from 'rxjs';

import { Loader, type LoaderOptions } from './loader';

/** A host whose loader fetches whatever `id` says from subjects the test answers. */
@Component({ template: '' })
class Host {
  readonly id = signal(1);
  readonly requests = new Map<number, Subject<string>>();
  readonly seen: string[] = [];
  static options: LoaderOptions<string> = {};
  readonly loader = new Loader<string>(() => this.request(this.id()), {
    ...Host.options,
    loaded: (v) => this.seen.push(v),
  });

  private request(id: number): Observable<string> {
    const subject = new Subject<string>();
    this.requests.set(id, subject);
    return subject;
  }
}

describe('Loader', () => {
  function host(options: LoaderOptions<string> = {}) {
    Host.options = options;
    const fixture = TestBed.createComponent(Host);
    fixture.detectChanges();
    return fixture;
  }

  it('loads at once and is ready with the value', () => {
    const h = host().componentInstance;
    expect(h.loader.state()).toBe('loading');
    h.requests.get(1)!.next('first');
    expect(h.loader.value()).toBe('first');
    expect(h.loader.state()).toBe('ready');
  });

  it('loads again when what it reads changes, and a stale answer never lands', () => {
    const fixture = host();
    const h = fixture.componentInstance;
    h.id.set(2);
    fixture.detectChanges();
    h.requests.get(2)!.next('second');
    h.requests.get(1)!.next('stale');
    expect(h.loader.value()).toBe('second');
    expect(h.seen).toEqual(['second']);
  });

  it('reloads in place: what is shown stays, with no progress state', () => {
    const h = host().componentInstance;
    h.requests.get(1)!.next('first');
    h.loader.reload();
    expect(h.loader.state()).toBe('ready');
    expect(h.loader.value()).toBe('first');
    h.requests.get(1)!.next('again');
    expect(h.loader.value()).toBe('again');
  });

  it('shows progress again when trying after a failure', () => {
    const h = host().componentInstance;
    h.requests.get(1)!.error(new HttpErrorResponse({ status: 500 }));
    expect(h.loader.state()).toBe('failed');
    h.loader.reload();
    expect(h.loader.state()).toBe('loading');
  });

  it('tells a 404 apart only where the page asks to', () => {
    const plain = host().componentInstance;
    plain.requests.get(1)!.error(new HttpErrorResponse({ status: 404 }));
    expect(plain.loader.state()).toBe('failed');
    const telling = host({ tellMissing: true }).componentInstance;
    telling.requests.get(1)!.error(new HttpErrorResponse({ status: 404 }));
    expect(telling.loader.state()).toBe('missing');
  });

  it('stops listening when its component goes', () => {
    const fixture = host();
    const subject = fixture.componentInstance.requests.get(1)!;
    fixture.destroy();
    expect(subject.observed).toBeFalse();
  });
});
