/**
 * The demo fleet's runs as data: which vehicle and site, when, and the simulator's spec of each
 * capture. Pure (no database or storage), so the seed (demo-fleet.ts) and the benchmarks read
 * the same list.
 */
import type { CaptureSpec } from "@/geometry/magnetometer-types";
import { IDENTITY_MOUNTING_ID, mountingRotationById } from "@/geometry/mounting-rotations";
import type { Mat3 } from "@/geometry/types";

const SIX = ["+z", "-z", "+x", "-x", "+y", "-y"] as const;
const rotation = (id: string): Mat3 => mountingRotationById(id)!.matrix;

export interface DemoRun {
  vehicle: string;
  site: string;
  capturedOn: string;
  title: string;
  slots: Record<string, string>;
  spec: CaptureSpec;
  powersMotors?: boolean;
  sharedWithStudents?: boolean;
}

export const DEMO_RUNS: readonly DemoRun[] = [
  {
    vehicle: "Pellowin 1",
    site: "Quillmere strip",
    capturedOn: "2026-09-14",
    title: "Annual check: both compasses",
    slots: {
      compass_a: "magnetometer:board",
      compass_b: "magnetometer:mast module",
      accel_a: "accelerometer:board IMU",
      gyro_a: "gyroscope:board IMU",
    },
    spec: {
      seed: 101,
      holds: { faces: [...SIX] },
      magnetometers: [{ hardIronOffset: [14, -6, 22], softIron: "mild" }, { hardIronOffset: [-3, 5, 2] }],
    },
    sharedWithStudents: true,
  },
  {
    vehicle: "Pellowin 2",
    site: "Quillmere strip",
    capturedOn: "2026-10-02",
    title: "Rushed turn: never turned over",
    slots: { compass_a: "magnetometer:board", accel_a: "accelerometer:board IMU", gyro_a: "gyroscope:board IMU" },
    spec: { seed: 102, path: "upper-half", magnetometers: [{ hardIronOffset: [8, 11, -15], softIron: "mild" }] },
    sharedWithStudents: true,
  },
  {
    vehicle: "Orrinbeck",
    site: "Quillmere strip",
    capturedOn: "2026-10-19",
    title: "After mast refit",
    slots: {
      compass_a: "magnetometer:board",
      compass_b: "magnetometer:mast module",
      accel_a: "accelerometer:board IMU",
      gyro_a: "gyroscope:board IMU",
    },
    // The refitted module sits a quarter turn clockwise (seen from above); it is still declared aligned with the vehicle.
    spec: {
      seed: 103,
      magnetometers: [
        { hardIronOffset: [5, -9, 12] },
        { mountingRotation: rotation("x-right.z-down"), declaredRotation: rotation(IDENTITY_MOUNTING_ID) },
      ],
    },
    sharedWithStudents: true,
  },
  {
    vehicle: "Clodhaver",
    site: "Saltmarsh depot",
    capturedOn: "2026-10-23",
    title: "In the yard, beside the container",
    slots: { compass_a: "magnetometer:board", accel_a: "accelerometer:board IMU", gyro_a: "gyroscope:board IMU" },
    spec: { seed: 104, steel: { distanceM: 0.7, strength: 6 }, magnetometers: [{ hardIronOffset: [-20, 4, 9] }] },
  },
  {
    vehicle: "Pellowin 1",
    site: "Quillmere strip",
    capturedOn: "2026-10-30",
    title: "Motor current test (props off, restrained)",
    slots: { compass_a: "magnetometer:board", accel_a: "accelerometer:board IMU", gyro_a: "gyroscope:board IMU" },
    spec: {
      seed: 105,
      holds: { faces: ["+z"] },
      pathSeconds: 50,
      magnetometers: [{ hardIronOffset: [14, -6, 22], currentCoupling: [0.32, 0.12, -0.26] }],
      currentTest: { maxAmps: 38 },
    },
    powersMotors: true,
  },
  {
    vehicle: "Pellowin 2",
    site: "Quillmere strip",
    capturedOn: "2026-11-06",
    title: "Six-face hold, shaky hands",
    slots: { compass_a: "magnetometer:board", accel_a: "accelerometer:board IMU", gyro_a: "gyroscope:board IMU" },
    spec: {
      seed: 106,
      holds: { faces: [...SIX], wobbleDeg: 0.8, holdSeconds: 5 },
      pathSeconds: 40,
      accelerometer: { offset: [0.12, -0.08, 0.2], scale: [1.01, 0.99, 1.02] },
    },
  },
  {
    vehicle: "Tidmarrow",
    site: "Tarn jetty",
    capturedOn: "2026-11-20",
    title: "Season start",
    slots: { compass_a: "magnetometer:mast module", accel_a: "accelerometer:board IMU", gyro_a: "gyroscope:board IMU" },
    spec: { seed: 107, holds: { faces: [...SIX] }, magnetometers: [{ hardIronOffset: [2, -4, 6], softIron: "mild" }] },
  },
];
