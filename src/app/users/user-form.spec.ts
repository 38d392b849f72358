import { HarnessLoader } from '@angular/cdk/testing';
import { TestbedHarnessEnvironment } from '@angular/cdk/testing/testbed';
import { provideHttpClient } from '@angular/common/http';
import { HttpTestingController, provideHttpClientTesting } from '@angular/common/http/testing';
import { ComponentFixture, TestBed } from '@angular/core/testing';
import { MatButtonHarness } from '@angular/material/button/testing';
import { MATERIAL_ANIMATIONS } from '@angular/material/core';
import { MatFormFieldHarness } from '@angular/material/form-field/testing';
import { MatInputHarness } from '@angular/material/input/testing';
import { MatSelectHarness } from '@angular/material/select/testing';
import { Router, provideRouter } from '@angular/router';

import { signedInAs } from '../../testing/signed-in-as';
import { UserForm } from './user-form';

describe('UserForm', () => {
  let fixture: ComponentFixture<UserForm>;
  let loader: HarnessLoader;
  let httpMock: HttpTestingController;
  let navigateByUrl: jasmine.Spy<Router['navigateByUrl']>;

  beforeEach(async () => {
    TestBed.configureTestingModule({
      imports: [UserForm],
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
    fixture = TestBed.createComponent(UserForm);
    loader = TestbedHarnessEnvironment.loader(fixture);
    await fixture.whenStable();
    const clients = httpMock.expectOne((req) => req.url === '/api/clients');
    expect(clients.request.params.get('pageSize')).toBe('100');
    clients.flush({ items: [{ id: 11, name: 'Rowan Tweed' }, { id: 12, name: 'Sorrel Hythe' }], total: 2 });
    await fixture.whenStable();
  });

  afterEach(() => httpMock?.verify());

  const input = (name: string) =>
    loader.getHarness(MatInputHarness.with({ selector: `[formControlName=${name}]` }));
  const field = (label: string) => loader.getHarness(MatFormFieldHarness.with({ floatingLabelText: label }));

  async function create(): Promise<void> {
    await (await loader.getHarness(MatButtonHarness.with({ text: 'Create user' }))).click();
    await fixture.whenStable();
  }

  it('asks a client sign-in for its client record and sends the link', async () => {
    expect(await loader.getAllHarnesses(MatFormFieldHarness.with({ floatingLabelText: 'Client record' }))).toHaveSize(0);
    await (await loader.getHarness(MatSelectHarness.with({ selector: '[formControlName=role]' }))).clickOptions({
      text: /^Client/,
    });
    await fixture.whenStable();

    await (await input('name')).setValue('Rowan Tweed');
    await (await input('email')).setValue('rowan@example.test');
    await (await input('password')).setValue('short');
    await create();
    expect(await (await field('Client record')).getTextErrors()).toEqual(['Choose the client this sign-in belongs to']);
    expect(await (await field('Password')).getTextErrors()).toEqual(['Use at least 10 characters']);
    httpMock.expectNone('/api/users');

    const clientSelect = await loader.getHarness(MatSelectHarness.with({ selector: '[formControlName=clientId]' }));
    await clientSelect.open();
    expect(await Promise.all((await clientSelect.getOptions()).map((option) => option.getText()))).toEqual([
      'Rowan Tweed',
      'Sorrel Hythe',
    ]);
    await clientSelect.clickOptions({ text: 'Rowan Tweed' });
    await (await input('password')).setValue('a long enough one');
    await create();

    const request = httpMock.expectOne('/api/users');
    expect(request.request.body).toEqual({
      name: 'Rowan Tweed',
      email: 'rowan@example.test',
      role: 'client',
      clientId: 11,
      password: 'a long enough one',
    });
    request.flush({ id: 9, name: 'Rowan Tweed', email: 'rowan@example.test', role: 'client', clientId: 11 });
    await fixture.whenStable();
    expect(navigateByUrl).toHaveBeenCalledWith('/users');
  });

  it('creates a workroom sign-in without a client record, and shows a taken e-mail on the field', async () => {
    await (await input('name')).setValue('Tansy Welt');
    await (await input('email')).setValue('tansy@example.test');
    await (await input('password')).setValue('a long enough one');
    await create();

    const request = httpMock.expectOne('/api/users');
    expect(request.request.body).toEqual({
      name: 'Tansy Welt',
      email: 'tansy@example.test',
      role: 'workroom',
      password: 'a long enough one',
    });
    request.flush(
      { error: { code: 'conflict', message: 'That e-mail already has a sign-in.' } },
      { status: 409, statusText: 'Conflict' },
    );
    await fixture.whenStable();
    expect(await (await field('E-mail')).getTextErrors()).toEqual(['That e-mail already has a sign-in.']);
    expect(await (await input('name')).getValue()).toBe('Tansy Welt');
    expect(navigateByUrl).not.toHaveBeenCalled();
  });
});
