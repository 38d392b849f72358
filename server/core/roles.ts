/** Who may be signed in. */
export const ROLES = ['owner', 'workroom', 'client'] as const;
export type Role = (typeof ROLES)[number];

/** A caller: a signed-in role, or nobody. */
export type Caller = Role | 'anonymous';
export const CALLERS: readonly Caller[] = ['anonymous', ...ROLES];
