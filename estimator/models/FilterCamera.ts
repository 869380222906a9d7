// The camera as the filter believes it to be (Seam 1): intrinsics, distortion and mount.
// The simulator gives the filter a believed camera that may differ from the true one.
import type { PinholeCamera } from '../camera/PinholeCamera.js';
import type { CameraMount } from '../camera/CameraMount.js';

export interface FilterCamera extends PinholeCamera {
  /** Offset (FLU, m) and roll/pitch/yaw (deg) from the nominal nadir mount. */
  mount: CameraMount;
}
