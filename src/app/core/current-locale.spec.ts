import { provideHttpClient } from '@angular/common/http';
import { HttpTestingController, provideHttpClientTesting } from '@angular/common/http/testing';
import { TestBed } from '@angular/core/testing';

import { signedInAs } from '../../testing/signed-in-as';
import { Role } from './user';
import { CurrentLocale, loadLocaleOnSignIn } from './current-locale';

describe('CurrentLocale', () => {
  let httpMock: HttpTestingController;

  function start(role: Role | null): CurrentLocale {
    TestBed.configureTestingModule({ providers: [provideHttpClient(), provideHttpClientTesting(), signedInAs(role)] });
    httpMock = TestBed.inject(HttpTestingController);
    TestBed.runInInjectionContext(loadLocaleOnSignIn);
    TestBed.tick();
    return TestBed.inject(CurrentLocale);
  }

  afterEach(() => httpMock?.verify());

  it('reads the studio locale at start for whoever is signed in', () => {
    const current = start('workroom');
    expect(current.locale()).toBe('en-GB');
    httpMock.expectOne({ method: 'GET', url: '/api/settings/locale' }).flush({ locale: 'ja-JP' });
    expect(current.locale()).toBe('ja-JP');
  });

  it('asks nothing while nobody is signed in, and stays British English', () => {
    const current = start(null);
    httpMock.expectNone('/api/settings/locale');
    expect(current.locale()).toBe('en-GB');
  });

  it('keeps the locale it has when the read fails or sends no locale', () => {
    const current = start('owner');
    httpMock.expectOne('/api/settings/locale').flush({ error: { code: 'unavailable', message: 'Try again.' } }, { status: 503, statusText: 'Unavailable' });
    expect(current.locale()).toBe('en-GB');
    current.load();
    httpMock.expectOne('/api/settings/locale').flush({});
    expect(current.locale()).toBe('en-GB');
  });
});
