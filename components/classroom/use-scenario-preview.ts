"use client";

import { useEffect, useRef, useState } from "react";
import type { ScenarioSpec } from "@/geometry/scenario";
import type { ScenarioPreview } from "./scenario-preview-compute";
import type { PreviewReply } from "./scenario-preview.worker";

/** Quiet time after the last keystroke before a new preview is asked for. */
export const PREVIEW_DEBOUNCE_MS = 250;

export interface PreviewState {
  preview: ScenarioPreview | null;
  /** A newer spec is waiting or being computed; the preview shown is of an earlier one. */
  busy: boolean;
  error: string | null;
  /** How long the last preview took in the worker. */
  ms: number | null;
}

interface Done {
  key: string | null;
  preview: ScenarioPreview | null;
  error: string | null;
  ms: number | null;
}

/**
 * The preview of the latest valid spec, made in one long-lived Web Worker. Requests are
 * debounced, and while the worker is busy only the newest spec waits (older ones are dropped),
 * so the preview catches up with the form instead of replaying every keystroke.
 */
export function useScenarioPreview(spec: ScenarioSpec | null): PreviewState {
  const [done, setDone] = useState<Done>({ key: null, preview: null, error: null, ms: null });
  const send = useRef<((key: string) => void) | null>(null);
  const inFlight = useRef<{ id: number; key: string } | null>(null);
  const waiting = useRef<string | null>(null);
  const nextId = useRef(1);
  const key = spec ? JSON.stringify(spec) : null;

  useEffect(() => {
    const worker = new Worker(new URL("./scenario-preview.worker.ts", import.meta.url));
    const post = (specKey: string) => {
      const id = nextId.current++;
      inFlight.current = { id, key: specKey };
      worker.postMessage({ id, spec: JSON.parse(specKey) as ScenarioSpec });
    };
    send.current = post;
    worker.onmessage = (event: MessageEvent<PreviewReply>) => {
      const reply = event.data;
      const asked = inFlight.current;
      if (!asked || reply.id !== asked.id) return;
      inFlight.current = null;
      const queued = waiting.current;
      waiting.current = null;
      if (queued) post(queued);
      setDone((previous) =>
        reply.ok
          ? { key: asked.key, preview: reply.preview, error: null, ms: reply.ms }
          : { ...previous, key: asked.key, error: reply.message },
      );
    };
    worker.onerror = (event) => {
      const asked = inFlight.current;
      inFlight.current = null;
      setDone((previous) => ({
        ...previous,
        key: asked?.key ?? previous.key,
        error: `The preview stopped: ${event.message || "the browser ended the worker"}.`,
      }));
    };
    return () => {
      worker.terminate();
      send.current = null;
      inFlight.current = null;
      waiting.current = null;
    };
  }, []);

  useEffect(() => {
    if (!key) return;
    const timer = setTimeout(() => {
      if (inFlight.current) waiting.current = key;
      else send.current?.(key);
    }, PREVIEW_DEBOUNCE_MS);
    return () => clearTimeout(timer);
  }, [key]);

  return { preview: done.preview, busy: key !== null && key !== done.key, error: done.error, ms: done.ms };
}
