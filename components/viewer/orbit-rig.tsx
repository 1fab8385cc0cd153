"use client";

import { useThree } from "@react-three/fiber";
import { useEffect, useLayoutEffect } from "react";
import type { Vec3 } from "@/geometry/types";
import { bindOrbitInput } from "./orbit-input";
import { cameraOffset, type OrbitStore } from "./orbit-state";

/** Vertical field of view of the sphere view's camera, degrees. */
export const FOV_DEG = 40;

/**
 * Puts the canvas's camera where the shared orbit store says, looking at `target` with the
 * body's up (−z) up the screen, and wires the canvas's pointer and keys to the store. The
 * scene renders on demand: only when the store or the data change.
 */
export function OrbitRig({ store, target }: { store: OrbitStore; target: Vec3 }) {
  const camera = useThree((state) => state.camera);
  const invalidate = useThree((state) => state.invalidate);
  const element = useThree((state) => state.gl.domElement);
  const aspect = useThree((state) => state.size.width / Math.max(1, state.size.height));
  // A canvas narrower than tall would cut the sides off: step back until the width fits as the height does.
  const stepBack = Math.max(1, 0.95 / aspect);
  const [tx, ty, tz] = target;

  useLayoutEffect(() => {
    const apply = () => {
      const [x, y, z] = cameraOffset({ ...store.pose, distance: store.pose.distance * stepBack });
      camera.position.set(tx + x, ty + y, tz + z);
      camera.up.set(0, 0, -1);
      camera.lookAt(tx, ty, tz);
      camera.updateMatrixWorld();
      invalidate();
    };
    apply();
    return store.subscribe(apply);
  }, [camera, invalidate, store, stepBack, tx, ty, tz]);

  useEffect(() => bindOrbitInput(element, store), [element, store]);
  return null;
}
