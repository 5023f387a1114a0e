import type { SizingBasis } from "./sizing-basis";

/**
 * A stage's answers kept for the life of one sizing basis (one request): the refinement asks for the
 * same stage's value and gradient in turn. Cleared whole when it grows past `limit` entries.
 */
export function basisMemo<T>(limit: number): (basis: SizingBasis, key: string, compute: () => T) => T {
  const memo = new WeakMap<SizingBasis, Map<string, T>>();
  return (basis, key, compute) => {
    let cache = memo.get(basis);
    if (!cache) {
      cache = new Map();
      memo.set(basis, cache);
    }
    const hit = cache.get(key);
    if (hit !== undefined) return hit;
    const value = compute();
    if (cache.size > limit) cache.clear();
    cache.set(key, value);
    return value;
  };
}
