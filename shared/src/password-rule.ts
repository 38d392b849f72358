/** The length every Keepstitch password must have; the server and every form use this one rule. */
export const PASSWORD_LENGTH = { min: 10, max: 200 } as const;
