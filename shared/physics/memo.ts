/**
 * `build(key)` computed once per key and kept: for tables and scratch buffers that depend only
 * on a size (dimension, photon number), of which a process sees a handful.
 */
export function memoByKey<K, V>(build: (key: K) => V): (key: K) => V {
  const kept = new Map<K, V>();
  return (key) => {
    let value = kept.get(key);
    if (value === undefined) {
      value = build(key);
      kept.set(key, value);
    }
    return value;
  };
}
