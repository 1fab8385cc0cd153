"use client";

import dynamic from "next/dynamic";
import type { SphereViewProps } from "./sphere-view";

/** The 3D view, fetched and started in the browser only (it needs WebGL), with a placeholder meanwhile. */
const SphereView = dynamic(() => import("./sphere-view"), {
  ssr: false,
  loading: () => (
    <div className="card p-5" aria-busy="true">
      <div className="h-[420px] animate-pulse rounded-lg bg-chart-paper" />
      <p className="mt-2 text-xs text-chart-muted">Loading the 3D view…</p>
    </div>
  ),
});

export function SphereViewLoader(props: SphereViewProps) {
  return <SphereView {...props} />;
}
