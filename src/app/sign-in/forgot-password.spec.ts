import { HarnessLoader } from '@angular/cdk/testing';
import { TestbedHarnessEnvironment } from '@angular/cdk/testing/testbed';
import { provideHttpClient } from '@angular/common/http';
import { HttpTestingController, provideHttpClientTesting } from '@angular/common/http/testing';
import { ComponentFixture, TestBed } from '@angular/core/testing';
import { MatButtonHarness } from '@angular/material/button/testing';
import { MatFormFieldHarness } from '@angular/material/form-field/testing';
import { MatInputHarness } from '@angular/material/input/testing';
import { provideRouter } from '@angular/router';

import { ForgotPassword } from './forgot-password';

describe('ForgotPassword', () => {
  let fixture: ComponentFixture<ForgotPassword>;
  let loader: HarnessLoader;
  let httpMock: HttpTestingController;

  beforeEach(async () => {
    TestBed.configureTestingModule({ imports: [ForgotPassword], providers: [provideRouter([]), provideHttpClient(), provideHttpClientTesting()] });
    httpMock = TestBed.inject(HttpTestingController);
    fixture = TestBed.createComponent(ForgotPassword);
    loader = TestbedHarnessEnvironment.loader(fixture);
    await fixture.whenStable();
  });
  afterEach(() => httpMock?.verify());

  const field = () => loader.getHarness(MatFormFieldHarness.with({ floatingLabelText: 'E-mail' }));
  const submit = async () => {
    await (await loader.getHarness(MatButtonHarness.with({ text: 'E-mail me a link' }))).click();
    await fixture.whenStable();
  };
  const text = (testId: string) => (fixture.nativeElement.querySelector(`[data-testid=${testId}]`)?.textContent ?? '').trim();

  it('asks for an e-mail address before sending', async () => {
    await submit();
    expect(await (await field()).getTextErrors()).toEqual(['Enter your e-mail address']);
    httpMock.expectNone('/api/auth/forgot-password');
  });

  it("sends the address and shows the server's answer, which is the same for any address", async () => {
    await ((await (await field()).getControl()) as MatInputHarness).setValue(' hazel@example.test ');
    await submit();
    const req = httpMock.expectOne('/api/auth/forgot-password');
    expect(req.request.body).toEqual({ email: 'hazel@example.test' });
    req.flush({ message: 'If that e-mail address has a sign-in, a link to choose a new password is on its way.' }, { status: 202, statusText: 'Accepted' });
    await fixture.whenStable();
    expect(text('reset-requested')).toBe('If that e-mail address has a sign-in, a link to choose a new password is on its way.');
  });

  it('shows a refusal for too many requests with what to do', async () => {
    await ((await (await field()).getControl()) as MatInputHarness).setValue('hazel@example.test');
    await submit();
    httpMock
      .expectOne('/api/auth/forgot-password')
      .flush({ error: { code: 'rate_limited', message: 'Too many requests for a new password from here. Please wait 15 minutes and try again.' } }, { status: 429, statusText: 'Too Many Requests' });
    await fixture.whenStable();
    expect(text('forgot-error')).toBe('Too many requests for a new password from here. Please wait 15 minutes and try again.');
  });
});
