import "server-only";
import type { RunView } from "@/geometry/run-view";
import { mayHoldLegacyNames, upgradeLegacyNames } from "@/lib/legacy-names";
import { readObject } from "@/lib/storage";

/** The downsampled drawing data stored beside a version's samples, or null when there is none. */
export async function getRunView(results: Record<string, unknown>): Promise<RunView | null> {
  const key = (results.view as { key?: string } | undefined)?.key;
  if (!key) return null;
  try {
    const text = (await readObject(key)).toString("utf8");
    // Drawing data kept before sensors were named in our own words is read in the new names.
    const view = JSON.parse(text) as unknown;
    return (mayHoldLegacyNames(text) ? upgradeLegacyNames(view) : view) as RunView;
  } catch {
    return null;
  }
}
