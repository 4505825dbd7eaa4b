/** A JSON body with `value` at `path` (nested objects created on the way). */
export function bodyWith(path: string[], value: unknown): Record<string, unknown> {
  const body: Record<string, unknown> = {};
  let node = body;
  path.forEach((key, index) => {
    if (index === path.length - 1) node[key] = value;
    else node = (node[key] = {}) as Record<string, unknown>;
  });
  return body;
}
