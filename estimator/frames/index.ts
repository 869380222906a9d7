export { quatMultiply, quatConjugate, quatNormalize, quatRotate, quatFromAxisAngle } from './quaternion.js';
export type { Quaternion } from './quaternion.js';
export { quatFromEulerDeg, eulerDegFromQuat } from './quatFromEulerDeg.js';
export { rotationMatrixFromQuat, quatFromRotationMatrix, mat3Multiply, mat3Transpose, mat3MultiplyVector, mat3TransposeMultiplyVector } from './rotationMatrixFromQuat.js';
export { cameraFromBody, NOMINAL_CAMERA_FROM_BODY, cameraPointFromWorldVector, worldVectorFromCameraPoint } from './cameraFromBody.js';
