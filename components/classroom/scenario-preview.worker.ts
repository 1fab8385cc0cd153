/**
 * Web Worker: simulates and analyses a scenario off the main thread, so typing in the builder
 * never stutters while the preview (a few hundred milliseconds of fitting) is made.
 */
import type { ScenarioSpec } from "@/geometry/scenario";
import { computeScenarioPreview, type ScenarioPreview } from "./scenario-preview-compute";

export interface PreviewRequest {
  id: number;
  spec: ScenarioSpec;
}

export type PreviewReply = { id: number; ok: true; preview: ScenarioPreview; ms: number } | { id: number; ok: false; message: string };

const scope = self as unknown as {
  onmessage: ((event: MessageEvent<PreviewRequest>) => void) | null;
  postMessage(reply: PreviewReply): void;
};

scope.onmessage = ({ data }) => {
  const started = performance.now();
  try {
    const preview = computeScenarioPreview(data.spec);
    scope.postMessage({ id: data.id, ok: true, preview, ms: performance.now() - started });
  } catch (error) {
    scope.postMessage({ id: data.id, ok: false, message: error instanceof Error ? error.message : String(error) });
  }
};
