import { HttpClient, HttpContext, provideHttpClient, withInterceptors } from '@angular/common/http';
import { HttpTestingController, provideHttpClientTesting } from '@angular/common/http/testing';
import { TestBed } from '@angular/core/testing';
import { Router, provideRouter } from '@angular/router';

import { signedInAs } from '../../testing/signed-in-as';
import { REPORT_API_ERRORS } from './api-error';
import { apiErrorInterceptor } from './api-error-interceptor';
import { Auth } from './auth';
import { Notices } from './notices';

describe('apiErrorInterceptor', () => {
  let http: HttpClient;
  let httpMock: HttpTestingController;
  let shown: jasmine.Spy<Notices['error']>;
  let navigate: jasmine.Spy<Router['navigate']>;

  beforeEach(() => {
    TestBed.configureTestingModule({
      providers: [
        provideRouter([]),
        provideHttpClient(withInterceptors([apiErrorInterceptor])),
        provideHttpClientTesting(),
        signedInAs('owner'),
        { provide: Notices, useValue: jasmine.createSpyObj<Notices>('Notices', ['error', 'info']) },
      ],
    });
    http = TestBed.inject(HttpClient);
    httpMock = TestBed.inject(HttpTestingController);
    shown = TestBed.inject(Notices).error as jasmine.Spy<Notices['error']>;
    navigate = spyOn(TestBed.inject(Router), 'navigate').and.resolveTo(true);
  });

  afterEach(() => httpMock?.verify());

  function fail(url: string, status: number, body: object, context?: HttpContext): jasmine.Spy {
    const failed = jasmine.createSpy('error');
    http.get(url, { context }).subscribe({ error: failed });
    httpMock.expectOne(url).flush(body, { status, statusText: 'Error' });
    return failed;
  }

  it("shows the server's message and still hands the error to the caller", () => {
    const failed = fail('/api/clients/9', 409, {
      error: { code: 'conflict', message: 'This client still has garments in the studio.' },
    });
    expect(shown).toHaveBeenCalledOnceWith('This client still has garments in the studio.');
    expect(failed).toHaveBeenCalled();
  });

  it('explains a server that cannot be reached', () => {
    const failed = jasmine.createSpy('error');
    http.get('/api/clients').subscribe({ error: failed });
    httpMock.expectOne('/api/clients').error(new ProgressEvent('error'), { status: 0 });
    expect(shown).toHaveBeenCalledOnceWith(
      'Keepstitch cannot reach its server. Check the connection and try again.',
    );
  });

  it('stays quiet for requests whose page shows the error itself', () => {
    fail('/api/clients', 400, { error: { code: 'validation', message: 'Check the fields' } },
      new HttpContext().set(REPORT_API_ERRORS, false));
    expect(shown).not.toHaveBeenCalled();
  });

  it('sends the person to sign in when the session has ended, keeping the page', () => {
    fail('/api/clients', 401, { error: { code: 'unauthenticated', message: 'Please sign in again.' } });
    expect(TestBed.inject(Auth).user()).toBeNull();
    expect(navigate).toHaveBeenCalledOnceWith(['/sign-in'], { queryParams: { returnUrl: '/' } });
    expect(shown).toHaveBeenCalledOnceWith('Please sign in again.');
  });

  it('leaves a refused sign-in to the sign-in form', () => {
    const failed = jasmine.createSpy('error');
    http
      .post('/api/auth/sign-in', {}, { context: new HttpContext().set(REPORT_API_ERRORS, false) })
      .subscribe({ error: failed });
    httpMock
      .expectOne('/api/auth/sign-in')
      .flush({ error: { code: 'bad_credentials', message: 'No' } }, { status: 401, statusText: 'Unauthorized' });
    expect(navigate).not.toHaveBeenCalled();
    expect(shown).not.toHaveBeenCalled();
    expect(failed).toHaveBeenCalled();
  });
});
