// Code a page needs moments after it draws, not before: fetched once, on first use; again only after
// a failure (the network dropped while the chunk was on its way).
import { useEffect, useState } from 'react';

export function once<T>(load: () => Promise<T>): () => Promise<T> {
  let loading: Promise<T> | null = null;
  return () =>
    (loading ??= load().catch((error: unknown) => {
      loading = null;
      throw error;
    }));
}

/** What `load` gives once it has arrived (fetched at mount), null until then. */
export function useLoaded<T>(load: () => Promise<T>): T | null {
  const [loaded, setLoaded] = useState<{ value: T } | null>(null);
  useEffect(() => {
    let current = true;
    load().then(
      (value) => current && setLoaded({ value }),
      () => undefined,
    );
    return () => {
      current = false;
    };
  }, [load]);
  return loaded ? loaded.value : null;
}
