import { applyOrbitAction, orbitActionForKey, type OrbitStore } from "./orbit-state";

/** Degrees the sphere turns per pixel dragged. */
const DEG_PER_PX = 0.4;
/** Zoom per wheel pixel (a notch is about 100 px): e^(0.0015·100) ≈ 1.16 a notch. */
const ZOOM_PER_WHEEL_PX = 0.0015;

/**
 * Pointer, wheel and key handling for one canvas: drag to turn, wheel or two-finger pinch to
 * zoom, arrows / + − / 0 when it has focus. Returns the function that removes the listeners.
 */
export function bindOrbitInput(element: HTMLElement, store: OrbitStore): () => void {
  const pointers = new Map<number, { x: number; y: number }>();
  let pinchSpread = 0;
  const spread = () => {
    const [a, b] = [...pointers.values()];
    return a && b ? Math.hypot(a.x - b.x, a.y - b.y) : 0;
  };

  const down = (event: PointerEvent) => {
    if (event.button !== 0 && event.pointerType === "mouse") return;
    element.setPointerCapture(event.pointerId);
    element.focus({ preventScroll: true });
    pointers.set(event.pointerId, { x: event.clientX, y: event.clientY });
    pinchSpread = pointers.size === 2 ? spread() : 0;
  };
  const move = (event: PointerEvent) => {
    const last = pointers.get(event.pointerId);
    if (!last) return;
    const dx = event.clientX - last.x;
    const dy = event.clientY - last.y;
    last.x = event.clientX;
    last.y = event.clientY;
    if (pointers.size === 1) {
      // Dragging right turns the sphere right, so the camera goes left (smaller yaw); up likewise.
      store.rotate(-dx * DEG_PER_PX, dy * DEG_PER_PX);
    } else if (pointers.size === 2) {
      const now = spread();
      if (pinchSpread > 0 && now > 0) store.zoom(pinchSpread / now);
      pinchSpread = now;
    }
  };
  const up = (event: PointerEvent) => {
    pointers.delete(event.pointerId);
    pinchSpread = pointers.size === 2 ? spread() : 0;
  };
  const wheel = (event: WheelEvent) => {
    event.preventDefault();
    const pixels = event.deltaMode === 1 ? event.deltaY * 33 : event.deltaY;
    store.zoom(Math.exp(pixels * ZOOM_PER_WHEEL_PX));
  };
  const key = (event: KeyboardEvent) => {
    if (event.altKey || event.ctrlKey || event.metaKey) return;
    const action = orbitActionForKey(event.key);
    if (!action) return;
    event.preventDefault();
    applyOrbitAction(store, action);
  };

  element.addEventListener("pointerdown", down);
  element.addEventListener("pointermove", move);
  element.addEventListener("pointerup", up);
  element.addEventListener("pointercancel", up);
  element.addEventListener("wheel", wheel, { passive: false });
  element.addEventListener("keydown", key);
  return () => {
    element.removeEventListener("pointerdown", down);
    element.removeEventListener("pointermove", move);
    element.removeEventListener("pointerup", up);
    element.removeEventListener("pointercancel", up);
    element.removeEventListener("wheel", wheel);
    element.removeEventListener("keydown", key);
  };
}
