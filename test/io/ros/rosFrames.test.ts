import { describe, expect, it } from 'vitest';
import { quatRotate } from '../../../estimator/frames/quaternion.js';
import { eulerDegFromQuat } from '../../../estimator/frames/quatFromEulerDeg.js';
import { cameraFromBody } from '../../../estimator/frames/cameraFromBody.js';
import { mat3Transpose, quatFromRotationMatrix } from '../../../estimator/frames/rotationMatrixFromQuat.js';
import { bodyConventionOf, enuVector, fluVector, mountFromOpticalTransform, rosAttitude, worldConventionOf } from '../../../estimator/io/ros/rosFrames.js';
import { expectAllClose } from '../../helpers/expectClose.js';

// Conventions from ROS REP 103 ("Standard Units of Measure and Coordinate Conventions"):
// ENU world, FLU body, optical frame z forward / x right / y down, "_ned" suffix for NED.
describe('rosFrames', () => {
  it('reads the convention from the frame id suffix', () => {
    expect(worldConventionOf('odom_ned')).toBe('ned');
    expect(worldConventionOf('odom')).toBe('enu');
    expect(bodyConventionOf('base_link_frd')).toBe('frd');
    expect(bodyConventionOf('base_link')).toBe('flu');
  });

  it('swaps and negates components exactly: NED north (1,0,0) is ENU (0,1,0), FRD right (0,1,0) is FLU (0,-1,0)', () => {
    expect(Array.from(enuVector('ned', 1, 2, 3, [0, 0, 0]))).toEqual([2, 1, -3]);
    expect(Array.from(fluVector('frd', 1, 2, 3, [0, 0, 0]))).toEqual([1, -2, -3]);
    expect(Array.from(enuVector('enu', 1, 2, 3, [0, 0, 0]))).toEqual([1, 2, 3]);
  });

  // Tolerance 1e-15: one or two quaternion products of unit-size numbers.
  it('turns a NED/FRD attitude into ENU/FLU: nose north, level is yaw +90°', () => {
    expectAllClose(eulerDegFromQuat(rosAttitude('ned', 'frd', 0, 0, 0, 1)), [0, 0, 90], { abs: 1e-12 }, 'nose north');
    // Yaw 90° in NED (nose east) is yaw 0 in ENU; roll 30° right wing down is FLU roll +30°.
    const s = Math.sin(Math.PI / 4), c = Math.cos(Math.PI / 4);
    expectAllClose(eulerDegFromQuat(rosAttitude('ned', 'frd', 0, 0, s, c)), [0, 0, 0], { abs: 1e-12 }, 'nose east');
    const r = Math.PI / 12;
    expectAllClose(eulerDegFromQuat(rosAttitude('ned', 'frd', Math.sin(r), 0, 0, Math.cos(r))), [30, 0, 90], { abs: 1e-12 }, 'roll right');
  });

  it('keeps the physical rotation: a body vector reaches the same world direction either way', () => {
    // FRD body x (forward) of a NED attitude yawed 90° (nose east) points east: ENU (1, 0, 0).
    const s = Math.sin(Math.PI / 4), c = Math.cos(Math.PI / 4);
    const q = rosAttitude('ned', 'frd', 0, 0, s, c);
    expectAllClose(quatRotate(q, [1, 0, 0]), [1, 0, 0], { abs: 1e-15 }, 'forward');
    expectAllClose(quatRotate(q, [0, 1, 0]), [0, 1, 0], { abs: 1e-15 }, 'FLU left = north');
  });

  it('reads the nominal nadir mount from its optical transform as zeros, and a forward tilt as pitch', () => {
    // Nominal: optical x = -body y, y = -body x, z = -body z (R_bc symmetric), 180° about (1,-1,0)/√2.
    const h = Math.SQRT1_2;
    expect(mountFromOpticalTransform([0.1, 0, -0.05], [h, -h, 0, 0])).toEqual({ offset: [0.1, 0, -0.05], rollDeg: 0, pitchDeg: 0, yawDeg: 0 });
    // Round trip through alight's own mount: R_cb from cameraFromBody for a 20° pitch.
    const Rcb = cameraFromBody({ rollDeg: 0, pitchDeg: 20, yawDeg: 0 });
    const [w, x, y, z] = quatFromRotationMatrix(mat3Transpose(Rcb)) as number[]; // q_bc
    const q = [x!, y!, z!, w!];
    const m = mountFromOpticalTransform([0, 0, 0], q);
    expectAllClose([m.rollDeg, m.pitchDeg, m.yawDeg], [0, 20, 0], { abs: 1e-9 }, 'tilted mount'); // 12 significant digits kept
  });
});
