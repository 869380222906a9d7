export { boxFromXywh, boxFromCentreSize, boxCentreU, boxCentreV, boxSize, boxProblem } from './Box.js';
export type { Box, BoxProblem } from './Box.js';
export { CameraError, NO_DISTORTION, validateCamera } from './PinholeCamera.js';
export type { PinholeCamera } from './PinholeCamera.js';
export { distortNormalized, distortionJacobian, undistortNormalized, UndistortionError } from './distortion.js';
export { project, projectJacobian, normalizedFromPixel, undistortPixel, backProject, BehindCameraError } from './project.js';
export { boxSizeAtDepth, boxMeasurement, boxMeasurementJacobian, boxFromRelativePosition, relativePositionFromMeasurement, relativePositionFromBox, relativePositionJacobian } from './boxGeometry.js';
export type { Distortion } from './distortion.js';
export type { CameraMount } from './CameraMount.js';
