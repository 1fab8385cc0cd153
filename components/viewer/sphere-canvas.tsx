"use client";

import { Canvas, useThree } from "@react-three/fiber";
import { Component, useEffect, useRef, type ReactNode } from "react";
import { FOV_DEG } from "./orbit-rig";
import { SphereScene, type SphereSceneProps } from "./sphere-scene";

/** Catches a renderer that cannot start (or a scene that throws) and shows the fallback instead of a blank box. */
class CanvasGuard extends Component<{ fallback: ReactNode; onFail: () => void; children: ReactNode }, { failed: boolean }> {
  state = { failed: false };
  static getDerivedStateFromError() {
    return { failed: true };
  }
  componentDidCatch() {
    this.props.onFail();
  }
  render() {
    return this.state.failed ? this.props.fallback : this.props.children;
  }
}

/**
 * Draws again whenever the canvas's size or pixel ratio settles: a canvas that draws only on
 * demand would otherwise keep the frame it drew before layout (empty, at the wrong size) until
 * the first pointer move.
 */
function RedrawOnResize() {
  const invalidate = useThree((state) => state.invalidate);
  const width = useThree((state) => state.size.width);
  const height = useThree((state) => state.size.height);
  const dpr = useThree((state) => state.viewport.dpr);
  useEffect(() => {
    invalidate();
    // And once more on the next frame, after the browser has laid the canvas out.
    const frame = requestAnimationFrame(() => invalidate());
    return () => cancelAnimationFrame(frame);
  }, [invalidate, width, height, dpr]);
  return null;
}

export interface SphereCanvasProps extends SphereSceneProps {
  testId: string;
  label: string;
  hintId: string;
  onFail: () => void;
}

/**
 * One WebGL canvas of the sphere view. The canvas itself takes focus and keys (tabIndex 0),
 * draws only when something changes, and keeps its drawing buffer so a test can read pixels.
 */
export function SphereCanvas({ testId, label, hintId, onFail, ...scene }: SphereCanvasProps) {
  const canvasRef = useRef<HTMLCanvasElement>(null);

  useEffect(() => {
    const canvas = canvasRef.current;
    if (!canvas) return;
    canvas.tabIndex = 0;
    canvas.setAttribute("role", "application");
    canvas.setAttribute("aria-roledescription", "3D view");
    canvas.setAttribute("aria-label", label);
    canvas.setAttribute("aria-describedby", hintId);
    canvas.dataset.testid = testId;
    canvas.style.touchAction = "none";
    const lost = (event: Event) => {
      event.preventDefault();
      onFail();
    };
    canvas.addEventListener("webglcontextlost", lost);
    return () => canvas.removeEventListener("webglcontextlost", lost);
  }, [label, hintId, testId, onFail]);

  return (
    <CanvasGuard fallback={null} onFail={onFail}>
      <Canvas
        ref={canvasRef}
        frameloop="demand"
        dpr={[1, 2]}
        camera={{ fov: FOV_DEG, near: 0.01, far: 200 }}
        gl={{ antialias: true, alpha: true, preserveDrawingBuffer: true }}
        onCreated={({ gl }) => gl.setClearColor(0x000000, 0)}
        // The focus ring goes inside the canvas: the wrapper clips anything drawn outside it.
        className="rounded-lg [&_canvas:focus-visible]:ring-inset [&_canvas:focus-visible]:ring-offset-0"
      >
        <RedrawOnResize />
        <SphereScene {...scene} />
      </Canvas>
    </CanvasGuard>
  );
}
