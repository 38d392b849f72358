/** The same fields without those left empty (null): the server reads a missing field as "not given". */
export function withoutNulls<T extends object>(draft: T): Partial<T> {
  return Object.fromEntries(Object.entries(draft).filter(([, value]) => value !== null && value !== undefined)) as Partial<T>;
}
