/** JSON with object keys in one order, so values read back from jsonb compare equal to what was sent. */
export function canonicalJson(value: unknown): string {
  return JSON.stringify(value, (_key, v: unknown) =>
    v && typeof v === 'object' && !Array.isArray(v)
      ? Object.fromEntries(Object.entries(v as Record<string, unknown>).sort(([a], [b]) => (a < b ? -1 : a > b ? 1 : 0)))
      : v,
  );
}

/** The keys of `after` whose values differ from those in `before` (compared as canonical JSON), for history entries. */
export function changedKeys<T extends object>(before: Partial<T>, after: T): (keyof T & string)[] {
  const b = before as Record<string, unknown>;
  const a = after as Record<string, unknown>;
  return (Object.keys(a) as (keyof T & string)[]).filter((k) => canonicalJson(b[k]) !== canonicalJson(a[k]));
}
