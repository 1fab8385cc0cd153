/**
 * Where the camera looks from, shared by every canvas of one sphere view so that side-by-side
 * views turn together. Plain data and listeners: no three, no React, so it can be tested and
 * a pointer drag, a key or a button all change it the same way.
 *
 * The pose is an azimuth and an elevation about the body's up direction (−z, since body z
 * points down) and a distance in scene units (the fitted sphere has radius 1).
 */

export interface OrbitPose {
  /** Azimuth of the camera about the up axis, from straight behind the tail, positive towards the right side, degrees. */
  yawDeg: number;
  /** Elevation of the camera above the body's horizontal plane, degrees. */
  pitchDeg: number;
  /** Distance from the target, scene units. */
  distance: number;
}

/** Behind, a little to the left of and above the vehicle: the nose points into the screen, the right side to the right. */
export const DEFAULT_POSE: OrbitPose = { yawDeg: -35, pitchDeg: 28, distance: 4.4 };

const PITCH_LIMIT_DEG = 85;
export const ROTATE_STEP_DEG = 10;
export const ZOOM_STEP = 1.2;

/**
 * The camera's position relative to the target, body frame, for a pose: behind the vehicle
 * (−x) at yaw 0, moving round to the right side (+y) as yaw grows, rising towards −z with pitch.
 */
export function cameraOffset(pose: OrbitPose): [number, number, number] {
  const yaw = (pose.yawDeg * Math.PI) / 180;
  const pitch = (pose.pitchDeg * Math.PI) / 180;
  const horizontal = pose.distance * Math.cos(pitch);
  return [-horizontal * Math.cos(yaw), horizontal * Math.sin(yaw), -pose.distance * Math.sin(pitch)];
}

export class OrbitStore {
  private current: OrbitPose;
  private readonly listeners = new Set<() => void>();

  constructor(
    private readonly home: OrbitPose = DEFAULT_POSE,
    readonly minDistance = 1.3,
    readonly maxDistance = 14,
  ) {
    this.current = { ...home };
  }

  get pose(): OrbitPose {
    return this.current;
  }

  /** Listen for changes; returns the function that stops listening. */
  subscribe(listener: () => void): () => void {
    this.listeners.add(listener);
    return () => this.listeners.delete(listener);
  }

  /** Turn by the given angles, degrees; elevation stops short of straight up or down so "up" stays defined. */
  rotate(yawDeg: number, pitchDeg: number): void {
    const yaw = ((((this.current.yawDeg + yawDeg + 180) % 360) + 360) % 360) - 180;
    const pitch = Math.max(-PITCH_LIMIT_DEG, Math.min(PITCH_LIMIT_DEG, this.current.pitchDeg + pitchDeg));
    this.set({ ...this.current, yawDeg: yaw, pitchDeg: pitch });
  }

  /** Move closer (factor < 1) or further (factor > 1), within the distance limits. */
  zoom(factor: number): void {
    if (!(factor > 0)) return;
    const distance = Math.max(this.minDistance, Math.min(this.maxDistance, this.current.distance * factor));
    this.set({ ...this.current, distance });
  }

  reset(): void {
    this.set({ ...this.home });
  }

  private set(pose: OrbitPose): void {
    this.current = pose;
    for (const listener of this.listeners) listener();
  }
}

export type OrbitAction = { kind: "rotate"; yawDeg: number; pitchDeg: number } | { kind: "zoom"; factor: number } | { kind: "reset" };

/**
 * What a key does to the view, or null for other keys: the arrows turn the sphere that way,
 * as a drag would (the camera goes round the other way: left of it for right, below it for
 * up), + and − zoom, 0 resets.
 */
export function orbitActionForKey(key: string): OrbitAction | null {
  switch (key) {
    case "ArrowLeft":
      return { kind: "rotate", yawDeg: ROTATE_STEP_DEG, pitchDeg: 0 };
    case "ArrowRight":
      return { kind: "rotate", yawDeg: -ROTATE_STEP_DEG, pitchDeg: 0 };
    case "ArrowUp":
      return { kind: "rotate", yawDeg: 0, pitchDeg: -ROTATE_STEP_DEG };
    case "ArrowDown":
      return { kind: "rotate", yawDeg: 0, pitchDeg: ROTATE_STEP_DEG };
    case "+":
    case "=":
      return { kind: "zoom", factor: 1 / ZOOM_STEP };
    case "-":
    case "_":
      return { kind: "zoom", factor: ZOOM_STEP };
    case "0":
      return { kind: "reset" };
    default:
      return null;
  }
}

export function applyOrbitAction(store: OrbitStore, action: OrbitAction): void {
  if (action.kind === "rotate") store.rotate(action.yawDeg, action.pitchDeg);
  else if (action.kind === "zoom") store.zoom(action.factor);
  else store.reset();
}
