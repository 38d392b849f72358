import { Provider, computed, signal } from '@angular/core';

import { Auth } from '../app/core/auth';
import { Role, User, homeFor } from '../app/core/user';

export const testUsers: Record<Role, User> = {
  owner: { id: 1, email: 'owner@studio.test', name: 'Ottilie Marsh', role: 'owner', clientId: null },
  workroom: { id: 2, email: 'helper@studio.test', name: 'Wren Ashby', role: 'workroom', clientId: null },
  client: { id: 3, email: 'client@studio.test', name: 'Cass Penrose', role: 'client', clientId: 11 },
};

/** Replaces the Auth service with one that already holds the given user. */
export function signedInAs(role: Role | null): Provider {
  const user = signal<User | null>(role ? testUsers[role] : null);
  const fake: Pick<Auth, 'user' | 'role' | 'homeUrl' | 'forget'> = {
    user: user.asReadonly(),
    role: computed(() => user()?.role ?? null),
    homeUrl: computed(() => {
      const current = user();
      return current ? homeFor(current.role) : '/sign-in';
    }),
    forget: () => user.set(null),
  };
  return { provide: Auth, useValue: fake };
}
