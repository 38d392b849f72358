/** The three kinds of sign-in. The server decides what each may do; the client only mirrors it. */
export const roles = ['owner', 'workroom', 'client'] as const;
export type Role = (typeof roles)[number];

export interface User {
  id: number;
  email: string;
  name: string;
  role: Role;
  clientId: number | null;
}

/**
 * Reads a user out of a server reply, or throws. A hand check rather than a
 * schema: it runs at start, before any feature code (and its zod) is loaded.
 */
export function readUser(value: unknown): User {
  if (typeof value === 'object' && value !== null) {
    const { id, email, name, role, clientId } = value as Record<string, unknown>;
    if (
      typeof id === 'number' &&
      typeof email === 'string' &&
      typeof name === 'string' &&
      roles.includes(role as Role) &&
      (clientId === null || typeof clientId === 'number')
    ) {
      return { id, email, name, role: role as Role, clientId };
    }
  }
  throw new TypeError('The server sent something that is not a user.');
}

/** The page a role lands on after signing in: the owner's is what is due. */
export function homeFor(role: Role): string {
  return role === 'owner' ? '/overview' : role === 'client' ? '/portal' : '/commissions';
}

export const roleLabels: Record<Role, string> = {
  owner: 'Owner',
  workroom: 'Workroom',
  client: 'Client',
};
