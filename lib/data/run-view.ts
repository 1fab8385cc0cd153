import "server-only";
import type { RunView } from "@/geometry/run-view";
import { readObject } from "@/lib/storage";

/** The downsampled drawing data stored beside a version's samples, or null when there is none. */
export async function getRunView(results: Record<string, unknown>): Promise<RunView | null> {
  const key = (results.view as { key?: string } | undefined)?.key;
  if (!key) return null;
  try {
    return JSON.parse((await readObject(key)).toString("utf8")) as RunView;
  } catch {
    return null;
  }
}
