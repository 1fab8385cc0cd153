import { useSyncExternalStore } from "react";

let known: boolean | null = null;

/** Whether this browser can create a WebGL context at all; asked once, the test context released at once. */
export function webglAvailable(): boolean {
  if (known !== null) return known;
  try {
    const canvas = document.createElement("canvas");
    const context = (canvas.getContext("webgl2") ?? canvas.getContext("webgl")) as WebGLRenderingContext | null;
    known = context !== null;
    context?.getExtension("WEBGL_lose_context")?.loseContext();
  } catch {
    known = false;
  }
  return known;
}

const never = () => () => {};

/** WebGL availability: null while rendering on the server or before the first client render. */
export function useWebglAvailable(): boolean | null {
  return useSyncExternalStore(never, webglAvailable, () => null);
}
