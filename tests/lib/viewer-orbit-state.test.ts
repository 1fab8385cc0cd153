import { describe, expect, test, vi } from "vitest";
import { DEFAULT_POSE, OrbitStore, applyOrbitAction, cameraOffset, orbitActionForKey } from "@/components/viewer/orbit-state";

describe("cameraOffset", () => {
  test.each([
    { label: "behind the tail, level", pose: { yawDeg: 0, pitchDeg: 0, distance: 2 }, expected: [-2, 0, 0] },
    { label: "off the right side", pose: { yawDeg: 90, pitchDeg: 0, distance: 3 }, expected: [0, 3, 0] },
    // Body z points down, so above the vehicle is −z.
    { label: "straight above", pose: { yawDeg: 30, pitchDeg: 90, distance: 1 }, expected: [0, 0, -1] },
    { label: "behind, 45° up", pose: { yawDeg: 0, pitchDeg: 45, distance: Math.SQRT2 }, expected: [-1, 0, -1] },
  ])("$label (by hand)", ({ pose, expected }) => {
    const offset = cameraOffset(pose);
    for (let k = 0; k < 3; k++) expect(offset[k]).toBeCloseTo(expected[k], 12);
  });

  test("the offset's length is the distance", () => {
    const [x, y, z] = cameraOffset({ yawDeg: 123, pitchDeg: -40, distance: 5.5 });
    expect(Math.hypot(x, y, z)).toBeCloseTo(5.5, 12);
  });
});

describe("OrbitStore", () => {
  test("rotate wraps the azimuth and stops the elevation short of the poles", () => {
    const store = new OrbitStore({ yawDeg: 170, pitchDeg: 80, distance: 4 });
    store.rotate(20, 20);
    expect(store.pose.yawDeg).toBeCloseTo(-170, 12);
    expect(store.pose.pitchDeg).toBe(85);
    store.rotate(0, -200);
    expect(store.pose.pitchDeg).toBe(-85);
  });

  test.each([
    { label: "closer, within limits", factor: 0.5, expected: 2 },
    { label: "not closer than the minimum", factor: 0.01, expected: 1.3 },
    { label: "not further than the maximum", factor: 100, expected: 14 },
    { label: "a nonsense factor is ignored", factor: Number.NaN, expected: 4 },
  ])("zoom: $label", ({ factor, expected }) => {
    const store = new OrbitStore({ yawDeg: 0, pitchDeg: 0, distance: 4 });
    store.zoom(factor);
    expect(store.pose.distance).toBeCloseTo(expected, 12);
  });

  test("reset returns home and every listener hears each change until it stops listening", () => {
    const store = new OrbitStore();
    const heard = vi.fn();
    const stop = store.subscribe(heard);
    store.rotate(30, 10);
    store.zoom(2);
    store.reset();
    expect(store.pose).toEqual(DEFAULT_POSE);
    expect(heard).toHaveBeenCalledTimes(3);
    stop();
    store.rotate(5, 0);
    expect(heard).toHaveBeenCalledTimes(3);
  });
});

describe("orbitActionForKey", () => {
  test.each([
    { key: "ArrowLeft", yaw: 10, pitch: 0 },
    { key: "ArrowRight", yaw: -10, pitch: 0 },
    { key: "ArrowUp", yaw: 0, pitch: -10 },
    { key: "ArrowDown", yaw: 0, pitch: 10 },
  ])("$key turns the sphere that way (the camera the other)", ({ key, yaw, pitch }) => {
    const store = new OrbitStore({ yawDeg: 0, pitchDeg: 0, distance: 4 });
    applyOrbitAction(store, orbitActionForKey(key)!);
    expect(store.pose.yawDeg).toBeCloseTo(yaw, 12);
    expect(store.pose.pitchDeg).toBeCloseTo(pitch, 12);
  });

  test.each([
    { key: "+", closer: true },
    { key: "=", closer: true },
    { key: "-", closer: false },
    { key: "_", closer: false },
  ])("$key zooms", ({ key, closer }) => {
    const store = new OrbitStore({ yawDeg: 0, pitchDeg: 0, distance: 4 });
    applyOrbitAction(store, orbitActionForKey(key)!);
    expect(store.pose.distance < 4).toBe(closer);
  });

  test("0 resets", () => {
    const store = new OrbitStore();
    store.rotate(45, 20);
    applyOrbitAction(store, orbitActionForKey("0")!);
    expect(store.pose).toEqual(DEFAULT_POSE);
  });

  test.each(["a", "Enter", " ", "Tab"])("%j does nothing to the view", (key) => expect(orbitActionForKey(key)).toBeNull());
});
