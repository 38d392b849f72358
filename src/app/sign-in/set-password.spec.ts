import { HarnessLoader } from '@angular/cdk/testing';
import { TestbedHarnessEnvironment } from '@angular/cdk/testing/testbed';
import { provideHttpClient } from '@angular/common/http';
import { HttpTestingController, provideHttpClientTesting } from '@angular/common/http/testing';
import { ComponentFixture, TestBed } from '@angular/core/testing';
import { MatButtonHarness } from '@angular/material/button/testing';
import { MatFormFieldHarness } from '@angular/material/form-field/testing';
import { MatInputHarness } from '@angular/material/input/testing';
import { Router, provideRouter } from '@angular/router';

import { testUsers } from '../../testing/signed-in-as';
import { SetPassword } from './set-password';

describe('SetPassword', () => {
  let fixture: ComponentFixture<SetPassword>;
  let loader: HarnessLoader;
  let httpMock: HttpTestingController;
  let navigateByUrl: jasmine.Spy<Router['navigateByUrl']>;

  async function setUp(token?: string): Promise<void> {
    TestBed.configureTestingModule({ imports: [SetPassword], providers: [provideRouter([]), provideHttpClient(), provideHttpClientTesting()] });
    const router = TestBed.inject(Router);
    // Reach the page the way the e-mail's link does: /set-password?token=...
    if (token !== undefined) await router.navigate([], { queryParams: { token } });
    navigateByUrl = spyOn(router, 'navigateByUrl').and.resolveTo(true);
    httpMock = TestBed.inject(HttpTestingController);
    fixture = TestBed.createComponent(SetPassword);
    loader = TestbedHarnessEnvironment.loader(fixture);
    await fixture.whenStable();
  }

  afterEach(() => httpMock?.verify());

  const field = (label: string) => loader.getHarness(MatFormFieldHarness.with({ floatingLabelText: label }));
  async function type(label: string, value: string): Promise<void> {
    const control = (await (await field(label)).getControl()) as MatInputHarness;
    await control.setValue(value);
    await control.blur();
  }
  async function submit(): Promise<void> {
    await (await loader.getHarness(MatButtonHarness.with({ text: 'Save password and sign in' }))).click();
    await fixture.whenStable();
  }
  const text = (testId: string) => (fixture.nativeElement.querySelector(`[data-testid=${testId}]`)?.textContent ?? '').replace(/\s+/g, ' ').trim();

  it('asks for a long enough password typed twice alike before sending anything', async () => {
    await setUp('tok-123');
    await submit();
    expect(await (await field('New password')).getTextErrors()).toEqual(['Enter a new password']);
    await type('New password', 'short');
    expect(await (await field('New password')).getTextErrors()).toEqual(['Use at least 10 characters']);
    await type('New password', 'a long new password');
    await type('New password again', 'a long new passwort');
    expect(await (await field('New password again')).getTextErrors()).toEqual(['This is not the same as the new password']);
    httpMock.expectNone('/api/auth/set-password');
  });

  it("sends the link's token with the password, then lands the client on their own page", async () => {
    await setUp('tok-123');
    await type('New password', 'a long new password');
    await type('New password again', 'a long new password');
    await submit();
    const req = httpMock.expectOne('/api/auth/set-password');
    expect(req.request.body).toEqual({ token: 'tok-123', password: 'a long new password' });
    req.flush({ user: testUsers.client });
    // The page reads who is signed in again (and the new security token) before moving on.
    httpMock.expectOne('/api/auth/me').flush({ user: testUsers.client });
    await new Promise((resolve) => setTimeout(resolve));
    expect(navigateByUrl).toHaveBeenCalledWith('/portal');
  });

  it('says what to do when the link is used or old, keeping what was typed', async () => {
    await setUp('tok-old');
    await type('New password', 'a long new password');
    await type('New password again', 'a long new password');
    await submit();
    const message = 'This link has expired or has already been used. Ask for a new one with "Forgot your password?" on the sign-in page, or ask the studio to invite you again.';
    httpMock.expectOne('/api/auth/set-password').flush({ error: { code: 'bad_link', message, fields: { token: message } } }, { status: 400, statusText: 'Bad Request' });
    await fixture.whenStable();
    expect(text('set-password-error')).toBe(message);
    expect(await ((await (await field('New password')).getControl()) as MatInputHarness).getValue()).toBe('a long new password');
    expect(navigateByUrl).not.toHaveBeenCalled();
  });

  it('explains a link without its token instead of showing a form that cannot work', async () => {
    await setUp();
    expect(text('set-password-error')).toMatch(/^This link is not complete/);
    expect(await loader.getAllHarnesses(MatButtonHarness.with({ text: 'Save password and sign in' }))).toHaveSize(0);
  });
});
