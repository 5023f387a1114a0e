/**
 * Reading and replacing one number of a spec by its dotted path, arrays included
 * ("reactions.1.rate.k", "feed.concentrations.A"): a network's reactions are a list, and a sampled
 * value must land in the list's own element rather than turn the list into an object. Pure; the
 * spec given is never changed (a copy is made along the path).
 */

type Node = Record<string, unknown> | unknown[];

const isIndex = (key: string) => /^\d+$/.test(key);

/** The value at `path`, or undefined when any step is missing. */
export function valueAtPath(spec: unknown, path: string): unknown {
  return path.split(".").reduce<unknown>((node, key) => {
    if (Array.isArray(node)) return isIndex(key) ? node[Number(key)] : undefined;
    return node && typeof node === "object" ? (node as Record<string, unknown>)[key] : undefined;
  }, spec);
}

function setStep(node: unknown, keys: string[], value: number): unknown {
  const [head, ...rest] = keys;
  if (Array.isArray(node) && isIndex(head)) {
    const copy = [...node];
    copy[Number(head)] = rest.length === 0 ? value : setStep(copy[Number(head)], rest, value);
    return copy;
  }
  const o = node !== null && typeof node === "object" && !Array.isArray(node) ? (node as Record<string, unknown>) : {};
  return { ...o, [head]: rest.length === 0 ? value : setStep(o[head], rest, value) };
}

/** A copy of `spec` with each path set to its number. */
export function withNumbers<T>(spec: T, values: Record<string, number>): T {
  let out: unknown = spec;
  for (const [path, v] of Object.entries(values)) out = setStep(out as Node, path.split("."), v);
  return out as T;
}
