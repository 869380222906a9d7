// Where the camera sits on the lander and how it is turned from the nominal nadir mount.

export interface CameraMount {
  /** Camera position in the body frame FLU (m). */
  offset: [number, number, number];
  /** Optical-frame orientation relative to the nominal nadir mount (deg): roll, pitch, yaw. */
  rollDeg: number;
  pitchDeg: number;
  yawDeg: number;
}
