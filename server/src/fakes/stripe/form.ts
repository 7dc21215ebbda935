/**
 * Decodes an application/x-www-form-urlencoded body the way Stripe's API reads it: bracketed
 * keys make nested objects (`metadata[jobId]=…`), numbered ones arrays
 * (`line_items[0][quantity]=1`). Every leaf stays a string, as it arrives.
 */
export type FormValue = string | FormValue[] | { [key: string]: FormValue };
export type FormObject = { [key: string]: FormValue };

export function decodeForm(body: string): FormObject {
  const root: FormObject = {};
  if (!body) return root;
  for (const pair of body.split('&')) {
    if (!pair) continue;
    const eq = pair.indexOf('=');
    const rawKey = eq < 0 ? pair : pair.slice(0, eq);
    const rawValue = eq < 0 ? '' : pair.slice(eq + 1);
    const key = decodeURIComponent(rawKey.replace(/\+/g, ' '));
    const value = decodeURIComponent(rawValue.replace(/\+/g, ' '));
    const path = keyPath(key);
    let node: { [key: string]: FormValue } = root;
    path.forEach((part, i) => {
      if (i === path.length - 1) {
        node[part] = value;
        return;
      }
      const next = node[part];
      if (typeof next !== 'object' || next === null) node[part] = {};
      node = node[part] as { [key: string]: FormValue };
    });
  }
  return arraysOf(root) as FormObject;
}

/** `a[b][0]` → ['a', 'b', '0']. */
function keyPath(key: string): string[] {
  const first = key.indexOf('[');
  if (first < 0) return [key];
  const parts = [key.slice(0, first)];
  const re = /\[([^\]]*)\]/g;
  let m: RegExpExecArray | null;
  while ((m = re.exec(key.slice(first))) !== null) parts.push(m[1] ?? '');
  return parts;
}

/** Objects whose keys are 0, 1, 2… become arrays. */
function arraysOf(v: FormValue): FormValue {
  if (typeof v === 'string' || Array.isArray(v)) return v;
  const keys = Object.keys(v);
  const out: { [key: string]: FormValue } = {};
  for (const k of keys) out[k] = arraysOf(v[k]!);
  if (keys.length && keys.every((k) => /^\d+$/.test(k))) {
    return keys
      .map(Number)
      .sort((a, b) => a - b)
      .map((i) => out[String(i)]!);
  }
  return out;
}

/** A string leaf at a path, or undefined. */
export function str(o: FormValue | undefined, ...path: (string | number)[]): string | undefined {
  let node: FormValue | undefined = o;
  for (const p of path) {
    if (node === undefined || typeof node === 'string') return undefined;
    node = Array.isArray(node) ? node[Number(p)] : node[String(p)];
  }
  return typeof node === 'string' ? node : undefined;
}

/** An object of string leaves (metadata), or {}. */
export function strings(o: FormValue | undefined): Record<string, string> {
  if (!o || typeof o === 'string' || Array.isArray(o)) return {};
  const out: Record<string, string> = {};
  for (const [k, v] of Object.entries(o)) if (typeof v === 'string') out[k] = v;
  return out;
}
