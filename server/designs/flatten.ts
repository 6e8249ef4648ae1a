/** Nested JSON as dotted paths to leaf values; arrays are compared whole (as JSON text). */
export function flatten(value: unknown, prefix = '', out = new Map<string, unknown>()): Map<string, unknown> {
  if (value !== null && typeof value === 'object' && !Array.isArray(value)) {
    for (const [key, child] of Object.entries(value as Record<string, unknown>)) {
      flatten(child, prefix ? `${prefix}.${key}` : key, out);
    }
  } else if (prefix) {
    out.set(prefix, Array.isArray(value) ? JSON.stringify(value) : value);
  }
  return out;
}

/** Every path whose value differs between a and b, in a stable order. */
export function diffObjects(a: unknown, b: unknown): { path: string; from: unknown; to: unknown }[] {
  const left = flatten(a);
  const right = flatten(b);
  const paths = [...new Set([...left.keys(), ...right.keys()])].sort();
  return paths
    .filter((p) => !Object.is(left.get(p), right.get(p)))
    .map((path) => ({ path, from: left.get(path) ?? null, to: right.get(path) ?? null }));
}
