import { HarnessLoader } from '@angular/cdk/testing';
import { TestbedHarnessEnvironment } from '@angular/cdk/testing/testbed';
import { provideHttpClient } from '@angular/common/http';
import { HttpTestingController, provideHttpClientTesting } from '@angular/common/http/testing';
import { ComponentFixture, TestBed } from '@angular/core/testing';
import { MatButtonHarness } from '@angular/material/button/testing';
import { MatFormFieldHarness } from '@angular/material/form-field/testing';
import { MatInputHarness } from '@angular/material/input/testing';

import { ChangePassword } from './change-password';

describe('ChangePassword', () => {
  let fixture: ComponentFixture<ChangePassword>;
  let loader: HarnessLoader;
  let httpMock: HttpTestingController;

  beforeEach(async () => {
    TestBed.configureTestingModule({ imports: [ChangePassword], providers: [provideHttpClient(), provideHttpClientTesting()] });
    httpMock = TestBed.inject(HttpTestingController);
    fixture = TestBed.createComponent(ChangePassword);
    loader = TestbedHarnessEnvironment.loader(fixture);
    await fixture.whenStable();
  });

  afterEach(() => httpMock?.verify());

  const field = (label: string) => loader.getHarness(MatFormFieldHarness.with({ floatingLabelText: label }));
  async function type(label: string, value: string): Promise<void> {
    const control = (await (await field(label)).getControl()) as MatInputHarness;
    await control.setValue(value);
    await control.blur();
  }
  async function submit(): Promise<void> {
    await (await loader.getHarness(MatButtonHarness.with({ text: 'Change password' }))).click();
    await fixture.whenStable();
  }
  const text = (testId: string) => (fixture.nativeElement.querySelector(`[data-testid=${testId}]`)?.textContent ?? '').trim();

  it('asks for every field, a long enough password and the same one twice, before sending anything', async () => {
    await submit();
    expect(await (await field('Current password')).getTextErrors()).toEqual(['Enter your current password']);
    expect(await (await field('New password')).getTextErrors()).toEqual(['Enter a new password']);
    await type('New password', 'short');
    expect(await (await field('New password')).getTextErrors()).toEqual(['Use at least 10 characters']);
    await type('New password', 'a long new password');
    await type('New password again', 'a long new passwort');
    expect(await (await field('New password again')).getTextErrors()).toEqual(['This is not the same as the new password']);
    // Fixing the first field re-checks the repeat.
    await type('New password', 'a long new passwort');
    expect(await (await field('New password again')).getTextErrors()).toEqual([]);
    httpMock.expectNone('/api/auth/password');
  });

  it('sends the change, then says it is done and empties the form', async () => {
    await type('Current password', 'old password 1');
    await type('New password', 'a long new password');
    await type('New password again', 'a long new password');
    await submit();
    const req = httpMock.expectOne('/api/auth/password');
    expect(req.request.method).toBe('POST');
    expect(req.request.body).toEqual({ currentPassword: 'old password 1', newPassword: 'a long new password' });
    req.flush({ user: { id: 1 } });
    await fixture.whenStable();
    expect(text('password-changed')).toContain('Your password is changed');
    expect(await ((await (await field('Current password')).getControl()) as MatInputHarness).getValue()).toBe('');
    expect(await (await field('New password')).isControlValid()).toBeFalse();
    expect(await (await field('New password')).getTextErrors()).toEqual([]);
  });

  it('shows the server saying the current password is wrong under that field, keeping what was typed', async () => {
    await type('Current password', 'wrong one here');
    await type('New password', 'a long new password');
    await type('New password again', 'a long new password');
    await submit();
    httpMock
      .expectOne('/api/auth/password')
      .flush(
        { error: { code: 'validation', message: 'The current password is not right.', fields: { currentPassword: 'This is not your current password.' } } },
        { status: 400, statusText: 'Bad Request' },
      );
    await fixture.whenStable();
    expect(await (await field('Current password')).getTextErrors()).toEqual(['This is not your current password.']);
    expect(await ((await (await field('New password')).getControl()) as MatInputHarness).getValue()).toBe('a long new password');
    expect(text('password-changed')).toBe('');
  });

  it('tells the person to wait when too many attempts were made', async () => {
    await type('Current password', 'guess number 9');
    await type('New password', 'a long new password');
    await type('New password again', 'a long new password');
    await submit();
    httpMock
      .expectOne('/api/auth/password')
      .flush({ error: { code: 'rate_limited', message: 'Too many sign-in attempts from here. Please wait 15 minutes and try again.' } }, { status: 429, statusText: 'Too Many Requests' });
    await fixture.whenStable();
    expect(text('password-error')).toMatch(/wait 15 minutes/);
  });
});
