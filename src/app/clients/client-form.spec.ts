import { HarnessLoader } from '@angular/cdk/testing';
import { TestbedHarnessEnvironment } from '@angular/cdk/testing/testbed';
import { provideHttpClient } from '@angular/common/http';
import { HttpTestingController, provideHttpClientTesting } from '@angular/common/http/testing';
import { ComponentFixture, TestBed } from '@angular/core/testing';
import { MatButtonHarness } from '@angular/material/button/testing';
import { MATERIAL_ANIMATIONS } from '@angular/material/core';
import { MatDialogHarness } from '@angular/material/dialog/testing';
import { MatFormFieldHarness } from '@angular/material/form-field/testing';
import { MatInputHarness } from '@angular/material/input/testing';
import { MatSlideToggleHarness } from '@angular/material/slide-toggle/testing';
import { Router, provideRouter } from '@angular/router';

import { signedInAs } from '../../testing/signed-in-as';
import { Client } from './client';
import { ClientForm } from './client-form';

const stored: Client = {
  id: 7,
  name: 'Marigold Fenn',
  email: 'marigold@example.test',
  phone: '01632 960 777',
  address: '3 Loom Row\nTestford',
  notes: 'Shirts from her late father',
  portfolioConsent: false,
  createdAt: '2026-02-01T12:00:00Z',
  updatedAt: '2026-02-01T12:00:00Z',
};

describe('ClientForm', () => {
  let fixture: ComponentFixture<ClientForm>;
  let loader: HarnessLoader;
  let httpMock: HttpTestingController;
  let navigateByUrl: jasmine.Spy<Router['navigateByUrl']>;

  async function setUp(id?: string): Promise<void> {
    TestBed.configureTestingModule({
      imports: [ClientForm],
      providers: [
        provideRouter([]),
        provideHttpClient(),
        provideHttpClientTesting(),
        signedInAs('owner'),
        { provide: MATERIAL_ANIMATIONS, useValue: { animationsDisabled: true } },
      ],
    });
    httpMock = TestBed.inject(HttpTestingController);
    navigateByUrl = spyOn(TestBed.inject(Router), 'navigateByUrl').and.resolveTo(true);
    fixture = TestBed.createComponent(ClientForm);
    if (id !== undefined) {
      fixture.componentRef.setInput('id', id);
    }
    loader = TestbedHarnessEnvironment.loader(fixture);
    await fixture.whenStable();
  }

  const field = (label: string) => loader.getHarness(MatFormFieldHarness.with({ floatingLabelText: label }));
  const input = (name: string) =>
    loader.getHarness(MatInputHarness.with({ selector: `[formControlName=${name}]` }));
  const button = (text: string | RegExp) => loader.getHarness(MatButtonHarness.with({ text }));

  async function save(): Promise<void> {
    await (await button('Save')).click();
    await fixture.whenStable();
  }

  afterEach(() => httpMock?.verify());

  it('labels every field and explains what is missing or wrong before sending', async () => {
    await setUp();
    for (const label of ['Name', 'E-mail', 'Phone', 'Postal address', 'Notes']) {
      expect(await (await field(label)).getLabel()).toBe(label);
    }
    await (await input('email')).setValue('marigold-at-example');
    await (await input('phone')).setValue('0'.repeat(41));
    await save();

    expect(await (await field('Name')).getTextErrors()).toEqual(['Name is required']);
    expect(await (await field('E-mail')).getTextErrors()).toEqual([
      'Enter an e-mail address like name@example.com',
    ]);
    expect(await (await field('Phone')).getTextErrors()).toEqual([
      'Keep the phone number to 40 characters or fewer',
    ]);
    httpMock.expectNone('/api/clients');
  });

  it('limits the name to 200 characters', async () => {
    await setUp();
    await (await input('name')).setValue('a'.repeat(201));
    await save();
    expect(await (await field('Name')).getTextErrors()).toEqual([
      'Keep the name to 200 characters or fewer',
    ]);
    httpMock.expectNone('/api/clients');
  });

  it('adds a client, sending empty optional text as null, with consent off by default', async () => {
    await setUp();
    const consent = await loader.getHarness(MatSlideToggleHarness);
    expect(await consent.getLabelText()).toBe('Consent to portfolio photos');
    expect(await consent.isChecked()).toBeFalse();

    await (await input('name')).setValue('  Hazel Brook ');
    await (await input('phone')).setValue('+44 1632 960000');
    await consent.toggle();
    await save();

    const request = httpMock.expectOne('/api/clients');
    expect(request.request.method).toBe('POST');
    expect(request.request.body).toEqual({
      name: 'Hazel Brook',
      email: null,
      phone: '+44 1632 960000',
      address: null,
      notes: null,
      portfolioConsent: true,
    });
    expect(await (await button('Save')).isDisabled()).toBeTrue();

    request.flush({ ...stored, id: 8, name: 'Hazel Brook', portfolioConsent: true });
    await fixture.whenStable();
    expect(navigateByUrl).toHaveBeenCalledWith('/clients');
  });

  it("puts the server's field messages under the fields and keeps what was typed", async () => {
    await setUp();
    await (await input('name')).setValue('Hazel Brook');
    await (await input('email')).setValue('hazel@example.test');
    await (await input('address')).setValue('9 Selvedge Lane');
    await save();

    httpMock.expectOne('/api/clients').flush(
      {
        error: {
          code: 'validation',
          message: 'Some details need another look.',
          fields: { email: 'Another client already uses this e-mail', address: 'Add a postcode' },
        },
      },
      { status: 400, statusText: 'Bad Request' },
    );
    await fixture.whenStable();

    expect(await (await field('E-mail')).getTextErrors()).toEqual(['Another client already uses this e-mail']);
    expect(await (await field('Postal address')).getTextErrors()).toEqual(['Add a postcode']);
    expect(fixture.nativeElement.querySelector('[data-testid=form-error]').textContent).toContain(
      'Some details need another look.',
    );
    expect(await (await input('name')).getValue()).toBe('Hazel Brook');
    expect(await (await input('email')).getValue()).toBe('hazel@example.test');
    expect(await (await button('Save')).isDisabled()).toBeFalse();
    expect(navigateByUrl).not.toHaveBeenCalled();

    // Editing the field clears the server's message for it.
    await (await input('email')).setValue('hazel.brook@example.test');
    expect(await (await field('E-mail')).getTextErrors()).toEqual([]);
  });

  it('loads a stored client into the form and saves the changes', async () => {
    await setUp('7');
    httpMock.expectOne('/api/clients/7').flush(stored);
    await fixture.whenStable();
    // The client's commissions, quotes and payments load below the form.
    httpMock.expectOne('/api/clients/7/record').flush({ commissions: [], quotes: [], payments: [] });

    expect(await (await input('name')).getValue()).toBe('Marigold Fenn');
    expect(await (await input('address')).getValue()).toBe('3 Loom Row\nTestford');
    await (await input('notes')).setValue('');
    await save();

    const request = httpMock.expectOne('/api/clients/7');
    expect(request.request.method).toBe('PATCH');
    expect(request.request.body).toEqual({
      name: 'Marigold Fenn',
      email: 'marigold@example.test',
      phone: '01632 960 777',
      address: '3 Loom Row\nTestford',
      notes: null,
      portfolioConsent: false,
    });
    request.flush({ ...stored, notes: null });
    await fixture.whenStable();
    expect(navigateByUrl).toHaveBeenCalledWith('/clients');
  });

  it('deletes a client only after the dialog is confirmed', async () => {
    await setUp('7');
    httpMock.expectOne('/api/clients/7').flush(stored);
    await fixture.whenStable();
    // The client's commissions, quotes and payments load below the form.
    httpMock.expectOne('/api/clients/7/record').flush({ commissions: [], quotes: [], payments: [] });
    const root = TestbedHarnessEnvironment.documentRootLoader(fixture);

    await (await button(/Delete$/)).click();
    let dialog = await root.getHarness(MatDialogHarness);
    expect(await dialog.getTitleText()).toBe('Delete this client?');
    await (await dialog.getHarness(MatButtonHarness.with({ text: 'Keep client' }))).click();
    await fixture.whenStable();
    expect(await root.getAllHarnesses(MatDialogHarness)).toHaveSize(0);
    httpMock.expectNone({ method: 'DELETE' });

    await (await button(/Delete$/)).click();
    dialog = await root.getHarness(MatDialogHarness);
    expect(await dialog.getContentText()).toContain('Marigold Fenn');
    await (await dialog.getHarness(MatButtonHarness.with({ text: 'Delete client' }))).click();
    await fixture.whenStable();

    const request = httpMock.expectOne({ method: 'DELETE', url: '/api/clients/7' });
    request.flush(null, { status: 204, statusText: 'No Content' });
    await fixture.whenStable();
    expect(navigateByUrl).toHaveBeenCalledWith('/clients');
  });

  const text = (testId: string) => (fixture.nativeElement.querySelector(`[data-testid=${testId}]`)?.textContent ?? '').replace(/\s+/g, ' ').trim();
  /** The client's record loads below the form; these cases are about the invitation. */
  const recordLoaded = () => httpMock.match('/api/clients/7/record').forEach((r) => r.flush({ commissions: [], quotes: [], payments: [] }));

  it('invites a stored client to their page, then shows the invitation as sent and offers to send it again', async () => {
    await setUp('7');
    httpMock.expectOne('/api/clients/7').flush({ ...stored, invitationState: 'not_sent', invitationSentAt: null });
    await fixture.whenStable();
    recordLoaded();
    expect(text('invitation-state')).toMatch(/^Not invited yet/);

    await (await button(/Invite to their page$/)).click();
    const request = httpMock.expectOne({ method: 'POST', url: '/api/clients/7/invitation' });
    request.flush({ ...stored, invitationState: 'sent', invitationSentAt: '2026-12-04T20:00:00Z' });
    await fixture.whenStable();

    expect(text('invitation-state')).toBe('Invitation sent on 4 Dec 2026, not used yet. The link works for 7 days.');
    expect(await (await button(/Send the invitation again$/)).isDisabled()).toBeFalse();
  });

  it('cannot invite a client without a saved e-mail address, and says what to do', async () => {
    await setUp('7');
    httpMock.expectOne('/api/clients/7').flush({ ...stored, email: null, invitationState: 'not_sent', invitationSentAt: null });
    await fixture.whenStable();
    recordLoaded();
    expect(await (await button(/Invite to their page$/)).isDisabled()).toBeTrue();
    expect(fixture.nativeElement.textContent).toContain('Add an e-mail address and save before inviting them.');
  });

  it("shows the server's reason when an invitation is refused, and no button once the client can sign in", async () => {
    await setUp('7');
    httpMock.expectOne('/api/clients/7').flush({ ...stored, invitationState: 'sent', invitationSentAt: '2026-12-01T09:00:00Z' });
    await fixture.whenStable();
    recordLoaded();
    await (await button(/Send the invitation again$/)).click();
    httpMock
      .expectOne('/api/clients/7/invitation')
      .flush({ error: { code: 'conflict', message: 'marigold@example.test is already the sign-in of someone else.' } }, { status: 409, statusText: 'Conflict' });
    await fixture.whenStable();
    expect(text('invite-error')).toBe('marigold@example.test is already the sign-in of someone else.');

    TestBed.resetTestingModule();
    await setUp('7');
    httpMock.expectOne('/api/clients/7').flush({ ...stored, invitationState: 'accepted', invitationSentAt: '2026-12-01T09:00:00Z' });
    await fixture.whenStable();
    recordLoaded();
    expect(text('invitation-state')).toBe('Can sign in to their page.');
    expect(await loader.getAllHarnesses(MatButtonHarness.with({ text: /invitation|Invite/ }))).toHaveSize(0);
  });

  it('shows nothing about invitations to someone the server sends no invitation state (the workroom)', async () => {
    await setUp('7');
    httpMock.expectOne('/api/clients/7').flush(stored);
    await fixture.whenStable();
    recordLoaded();
    expect(fixture.nativeElement.querySelector('[data-testid=invitation-state]')).toBeNull();
  });
});
