import { TestbedHarnessEnvironment } from '@angular/cdk/testing/testbed';
import { provideHttpClient } from '@angular/common/http';
import { HttpTestingController, provideHttpClientTesting } from '@angular/common/http/testing';
import { ApplicationRef, Component } from '@angular/core';
import { TestBed } from '@angular/core/testing';
import { MatButtonHarness } from '@angular/material/button/testing';
import { MATERIAL_ANIMATIONS } from '@angular/material/core';
import { MatDialog, MatDialogRef, MatDialogState } from '@angular/material/dialog';
import { MatDialogHarness } from '@angular/material/dialog/testing';
import { MatFormFieldHarness } from '@angular/material/form-field/testing';
import { MatInputHarness } from '@angular/material/input/testing';

import { ResetPasswordDialog, ResetPasswordDialogData } from './reset-password-dialog';

/** Only gives the harness environment a fixture; the dialog lives in the overlay. */
@Component({ template: '' })
class EmptyHost {}

describe('ResetPasswordDialog', () => {
  let httpMock: HttpTestingController;
  let dialogRef: MatDialogRef<ResetPasswordDialog, boolean>;

  beforeEach(() => {
    TestBed.configureTestingModule({
      providers: [
        provideHttpClient(),
        provideHttpClientTesting(),
        { provide: MATERIAL_ANIMATIONS, useValue: { animationsDisabled: true } },
      ],
    });
    httpMock = TestBed.inject(HttpTestingController);
    dialogRef = TestBed.inject(MatDialog).open<ResetPasswordDialog, ResetPasswordDialogData, boolean>(
      ResetPasswordDialog,
      { data: { id: 5, name: 'Tansy Welt' } },
    );
  });

  afterEach(() => httpMock?.verify());

  async function dialog(): Promise<MatDialogHarness> {
    await TestBed.inject(ApplicationRef).whenStable();
    return TestbedHarnessEnvironment.documentRootLoader(TestBed.createComponent(EmptyHost)).getHarness(
      MatDialogHarness,
    );
  }

  it('asks for at least 10 characters, then sends the new password and closes', async () => {
    const closed = jasmine.createSpy('closed');
    dialogRef.afterClosed().subscribe(closed);
    const harness = await dialog();
    expect(await harness.getTitleText()).toBe('Reset password for Tansy Welt');

    const input = await harness.getHarness(MatInputHarness);
    await input.setValue('too short');
    await (await harness.getHarness(MatButtonHarness.with({ text: 'Save new password' }))).click();
    const field = await harness.getHarness(MatFormFieldHarness);
    expect(await field.getTextErrors()).toEqual(['Use at least 10 characters']);
    httpMock.expectNone('/api/users/5/password');

    await input.setValue('long enough now');
    await (await harness.getHarness(MatButtonHarness.with({ text: 'Save new password' }))).click();
    const request = httpMock.expectOne('/api/users/5/password');
    expect(request.request.method).toBe('POST');
    expect(request.request.body).toEqual({ password: 'long enough now' });
    request.flush(null, { status: 204, statusText: 'No Content' });
    await TestBed.inject(ApplicationRef).whenStable();
    expect(closed).toHaveBeenCalledWith(true);
  });

  it("stays open with the server's message when the password is refused", async () => {
    const harness = await dialog();
    const input = await harness.getHarness(MatInputHarness);
    await input.setValue('long enough now');
    await (await harness.getHarness(MatButtonHarness.with({ text: 'Save new password' }))).click();
    httpMock.expectOne('/api/users/5/password').flush(
      { error: { code: 'validation', message: 'Check the password.', fields: { password: 'Too common a password' } } },
      { status: 400, statusText: 'Bad Request' },
    );
    await TestBed.inject(ApplicationRef).whenStable();

    expect(await (await harness.getHarness(MatFormFieldHarness)).getTextErrors()).toEqual(['Too common a password']);
    expect(await input.getValue()).toBe('long enough now');
    expect(dialogRef.getState()).toBe(MatDialogState.OPEN);
  });
});
