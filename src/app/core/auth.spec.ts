import { provideHttpClient } from '@angular/common/http';
import { HttpTestingController, provideHttpClientTesting } from '@angular/common/http/testing';
import { TestBed } from '@angular/core/testing';

import { testUsers } from '../../testing/signed-in-as';
import { Auth } from './auth';

describe('Auth', () => {
  let auth: Auth;
  let httpMock: HttpTestingController;

  beforeEach(() => {
    TestBed.configureTestingModule({ providers: [provideHttpClient(), provideHttpClientTesting()] });
    auth = TestBed.inject(Auth);
    httpMock = TestBed.inject(HttpTestingController);
  });

  afterEach(() => httpMock?.verify());

  async function settle(): Promise<void> {
    await new Promise((resolve) => setTimeout(resolve));
  }

  it('learns who is signed in from the server at start', async () => {
    const loaded = auth.load();
    httpMock.expectOne('/api/auth/me').flush({ user: testUsers.workroom });
    await loaded;
    expect(auth.user()).toEqual(testUsers.workroom);
    expect(auth.homeUrl()).toBe('/commissions');
  });

  it('counts a server that does not answer as nobody signed in', async () => {
    const loaded = auth.load();
    httpMock.expectOne('/api/auth/me').flush(null, { status: 503, statusText: 'Unavailable' });
    await loaded;
    expect(auth.user()).toBeNull();
  });

  it('counts a reply that does not describe a user as nobody signed in', async () => {
    const loaded = auth.load();
    httpMock.expectOne('/api/auth/me').flush({ user: { ...testUsers.client, role: 'admin' } });
    await loaded;
    expect(auth.user()).toBeNull();
  });

  it('keeps only the known fields of the user the server names', async () => {
    const loaded = auth.load();
    httpMock.expectOne('/api/auth/me').flush({ user: { ...testUsers.client, passwordHash: 'x' } });
    await loaded;
    expect(auth.user()).toEqual(testUsers.client);
  });

  it('fails a sign-in whose reply does not name the user', () => {
    const failed = jasmine.createSpy('failed');
    auth.signIn('maker@studio.test', 'correct horse battery').subscribe({ error: failed });
    httpMock.expectOne('/api/auth/sign-in').flush({ user: { id: 1, email: 'maker@studio.test' } });
    expect(failed).toHaveBeenCalled();
    expect(auth.user()).toBeNull();
  });

  it('asks the server again after signing out, which brings a fresh security token', async () => {
    const loaded = auth.load();
    httpMock.expectOne('/api/auth/me').flush({ user: testUsers.owner });
    await loaded;

    const done = jasmine.createSpy('done');
    auth.signOut().subscribe({ complete: done });
    httpMock.expectOne({ method: 'POST', url: '/api/auth/sign-out' }).flush(null, { status: 204, statusText: 'No Content' });
    await settle();
    httpMock.expectOne({ method: 'GET', url: '/api/auth/me' }).flush({ user: null });
    await settle();
    expect(done).toHaveBeenCalled();
    expect(auth.user()).toBeNull();
  });

  it('fetches a new security token and tries once more when the old one is refused', async () => {
    const signedIn = jasmine.createSpy('signedIn');
    auth.signIn('maker@studio.test', 'correct horse battery').subscribe(signedIn);
    httpMock
      .expectOne('/api/auth/sign-in')
      .flush({ error: { code: 'csrf', message: 'Missing token' } }, { status: 403, statusText: 'Forbidden' });
    httpMock.expectOne('/api/auth/me').flush({ user: null });
    await settle();
    const retry = httpMock.expectOne('/api/auth/sign-in');
    expect(retry.request.body).toEqual({ email: 'maker@studio.test', password: 'correct horse battery' });
    retry.flush({ user: testUsers.owner });
    expect(signedIn).toHaveBeenCalledWith(testUsers.owner);
    expect(auth.user()).toEqual(testUsers.owner);
  });
});
