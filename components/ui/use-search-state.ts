"use client";

import { useCallback, useMemo } from "react";
import { useSearchParams } from "next/navigation";

/**
 * A list's filters, sort and page kept in the address bar, so a reload or a shared link shows
 * the same rows. Values equal to their default are left out of the address. Writing uses the
 * history API, which Next.js folds into `useSearchParams` without a round trip to the server.
 * Pass `defaults` as a module-level constant so its identity stays put between renders.
 */
export function useSearchState<K extends string>(defaults: Record<K, string>) {
  const params = useSearchParams();
  const values = useMemo(() => {
    const out = { ...defaults };
    for (const key of Object.keys(defaults) as K[]) out[key] = params.get(key) ?? defaults[key];
    return out;
  }, [params, defaults]);

  const update = useCallback(
    (patch: Partial<Record<K, string>>) => {
      const next = new URLSearchParams(window.location.search);
      for (const [key, value] of Object.entries(patch) as [K, string | undefined][]) {
        if (value === undefined || value === "" || value === defaults[key]) next.delete(key);
        else next.set(key, value);
      }
      // A new filter or sort starts again from the first page.
      if (!("page" in patch)) next.delete("page");
      const query = next.toString();
      window.history.replaceState(null, "", query ? `?${query}` : window.location.pathname);
    },
    [defaults],
  );

  return [values, update] as const;
}

/** A positive page number from the address bar, 1 when missing or nonsense. */
export function pageFrom(text: string): number {
  const page = Number.parseInt(text, 10);
  return Number.isFinite(page) && page > 0 ? page : 1;
}
