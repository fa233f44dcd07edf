/**
 * Do two results say the same thing? Numbers match within a relative tolerance (the server may
 * serialise floats differently), everything else exactly. Returns the paths that differ.
 */
export function resultDifferences(a: unknown, b: unknown, path = '', tolerance = 1e-6): string[] {
  if (typeof a === 'number' && typeof b === 'number') {
    const scale = Math.max(1, Math.abs(a), Math.abs(b));
    return Math.abs(a - b) <= tolerance * scale ? [] : [path || '(root)'];
  }
  if (Array.isArray(a) && Array.isArray(b)) {
    if (a.length !== b.length) return [`${path}.length`];
    return a.flatMap((item, i) => resultDifferences(item, b[i], `${path}[${i}]`, tolerance));
  }
  if (
    a &&
    b &&
    typeof a === 'object' &&
    typeof b === 'object' &&
    !Array.isArray(a) &&
    !Array.isArray(b)
  ) {
    const left = a as Record<string, unknown>;
    const right = b as Record<string, unknown>;
    const keys = new Set([...Object.keys(left), ...Object.keys(right)]);
    return [...keys].flatMap((key) =>
      resultDifferences(left[key], right[key], path ? `${path}.${key}` : key, tolerance),
    );
  }
  return Object.is(a, b) ? [] : [path || '(root)'];
}
