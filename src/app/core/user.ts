import * as z from 'zod/mini';

/** The three kinds of sign-in. The server decides what each may do; the client only mirrors it. */
export const roles = ['owner', 'workroom', 'client'] as const;
export type Role = (typeof roles)[number];

export const userSchema = z.object({
  id: z.number(),
  email: z.string(),
  name: z.string(),
  role: z.enum(roles),
  clientId: z.nullable(z.number()),
});

export type User = z.infer<typeof userSchema>;

/** The page a role lands on after signing in. */
export function homeFor(role: Role): string {
  return role === 'client' ? '/portal' : '/commissions';
}

export const roleLabels: Record<Role, string> = {
  owner: 'Owner',
  workroom: 'Workroom',
  client: 'Client',
};
