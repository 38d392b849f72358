import { HarnessLoader } from '@angular/cdk/testing';
import { TestbedHarnessEnvironment } from '@angular/cdk/testing/testbed';
import { provideHttpClient } from '@angular/common/http';
import { HttpTestingController, provideHttpClientTesting } from '@angular/common/http/testing';
import { ComponentFixture, TestBed } from '@angular/core/testing';
import { MatButtonHarness } from '@angular/material/button/testing';
import { MatFormFieldHarness } from '@angular/material/form-field/testing';
import { MatInputHarness } from '@angular/material/input/testing';
import { MatProgressBarHarness } from '@angular/material/progress-bar/testing';
import { Router, provideRouter } from '@angular/router';

import { Auth } from '../core/auth';
import { testUsers } from '../../testing/signed-in-as';
import { SignIn } from './sign-in';

describe('SignIn', () => {
  let fixture: ComponentFixture<SignIn>;
  let loader: HarnessLoader;
  let httpMock: HttpTestingController;
  let navigateByUrl: jasmine.Spy<Router['navigateByUrl']>;

  async function setUp(returnUrl?: string): Promise<void> {
    TestBed.configureTestingModule({
      imports: [SignIn],
      providers: [provideRouter([]), provideHttpClient(), provideHttpClientTesting()],
    });
    const router = TestBed.inject(Router);
    if (returnUrl) {
      // Reach the component the way the guard sends people: with ?returnUrl=...
      await router.navigate([], { queryParams: { returnUrl } });
    }
    navigateByUrl = spyOn(router, 'navigateByUrl').and.resolveTo(true);
    httpMock = TestBed.inject(HttpTestingController);
    fixture = TestBed.createComponent(SignIn);
    loader = TestbedHarnessEnvironment.loader(fixture);
    await fixture.whenStable();
  }

  async function field(label: string): Promise<MatFormFieldHarness> {
    return loader.getHarness(MatFormFieldHarness.with({ floatingLabelText: label }));
  }

  async function fillIn(email: string, password: string): Promise<void> {
    await (await loader.getHarness(MatInputHarness.with({ selector: '[formControlName=email]' }))).setValue(email);
    await (await loader.getHarness(MatInputHarness.with({ selector: '[formControlName=password]' }))).setValue(password);
  }

  async function submit(): Promise<void> {
    await (await loader.getHarness(MatButtonHarness.with({ text: 'Sign in' }))).click();
    await fixture.whenStable();
  }

  function errorText(): string {
    const element: HTMLElement | null = fixture.nativeElement.querySelector('[data-testid=sign-in-error]');
    return element?.textContent?.trim() ?? '';
  }

  afterEach(() => httpMock?.verify());

  it('labels both fields and asks for them before sending anything', async () => {
    await setUp();
    expect(await (await field('E-mail')).getLabel()).toBe('E-mail');
    expect(await (await field('Password')).getLabel()).toBe('Password');

    await submit();

    expect(await (await field('E-mail')).getTextErrors()).toEqual(['Enter your e-mail address']);
    expect(await (await field('Password')).getTextErrors()).toEqual(['Enter your password']);
    httpMock.expectNone('/api/auth/sign-in');
  });

  it('explains an e-mail address that is not one', async () => {
    await setUp();
    await fillIn('not-an-address', 'long enough password');
    await submit();

    expect(await (await field('E-mail')).getTextErrors()).toEqual([
      'Enter an e-mail address like name@example.com',
    ]);
    httpMock.expectNone('/api/auth/sign-in');
  });

  it('sends the credentials, disables the button while waiting, and opens the owner home', async () => {
    await setUp();
    await fillIn('  maker@studio.test ', 'correct horse battery');
    await submit();

    const request = httpMock.expectOne('/api/auth/sign-in');
    expect(request.request.method).toBe('POST');
    expect(request.request.body).toEqual({ email: 'maker@studio.test', password: 'correct horse battery' });

    const button = await loader.getHarness(MatButtonHarness.with({ text: 'Sign in' }));
    expect(await button.isDisabled()).toBeTrue();
    expect(await loader.getAllHarnesses(MatProgressBarHarness)).toHaveSize(1);

    request.flush({ user: testUsers.owner });
    await fixture.whenStable();

    expect(TestBed.inject(Auth).user()).toEqual(testUsers.owner);
    expect(navigateByUrl).toHaveBeenCalledWith('/overview');
  });

  it('sends a client to their own commissions', async () => {
    await setUp();
    await fillIn('client@studio.test', 'correct horse battery');
    await submit();
    httpMock.expectOne('/api/auth/sign-in').flush({ user: testUsers.client });
    await fixture.whenStable();

    expect(navigateByUrl).toHaveBeenCalledWith('/portal');
  });

  it('returns to the page that was wanted before signing in', async () => {
    await setUp('/clients/7');
    await fillIn('maker@studio.test', 'correct horse battery');
    await submit();
    httpMock.expectOne('/api/auth/sign-in').flush({ user: testUsers.owner });
    await fixture.whenStable();

    expect(navigateByUrl).toHaveBeenCalledWith('/clients/7');
  });

  it('ignores a wanted address that leaves the app', async () => {
    await setUp('//elsewhere.test/page');
    await fillIn('maker@studio.test', 'correct horse battery');
    await submit();
    httpMock.expectOne('/api/auth/sign-in').flush({ user: testUsers.owner });
    await fixture.whenStable();

    expect(navigateByUrl).toHaveBeenCalledWith('/overview');
  });

  it('says plainly when the e-mail or password is wrong, and lets the person try again', async () => {
    await setUp();
    await fillIn('maker@studio.test', 'wrong password!');
    await submit();
    httpMock
      .expectOne('/api/auth/sign-in')
      .flush(
        { error: { code: 'bad_credentials', message: 'Invalid credentials' } },
        { status: 401, statusText: 'Unauthorized' },
      );
    await fixture.whenStable();

    expect(errorText()).toBe('E-mail or password is not right');
    expect(await (await loader.getHarness(MatButtonHarness.with({ text: 'Sign in' }))).isDisabled()).toBeFalse();
    expect(await loader.getAllHarnesses(MatProgressBarHarness)).toHaveSize(0);
    const email = await loader.getHarness(MatInputHarness.with({ selector: '[formControlName=email]' }));
    expect(await email.getValue()).toBe('maker@studio.test');
    expect(navigateByUrl).not.toHaveBeenCalled();
  });

  it("shows the server's message about waiting after too many attempts", async () => {
    await setUp();
    await fillIn('maker@studio.test', 'wrong password!');
    await submit();
    httpMock.expectOne('/api/auth/sign-in').flush(
      { error: { code: 'rate_limited', message: 'Too many sign-in attempts. Please wait 15 minutes.' } },
      { status: 429, statusText: 'Too Many Requests' },
    );
    await fixture.whenStable();

    expect(errorText()).toBe('Too many sign-in attempts. Please wait 15 minutes.');
  });
});
