// FixedLayoutReader against the reference it replaces on the hot path: @foxglove/rosmsg2-serialization's
// MessageReader, on every standard ROS 2 message type (@foxglove/rosmsg-msgs-common, Humble, and
// vision_msgs) the fixed-layout reader accepts, with seeded random contents written by the same
// library's MessageWriter. The decoded values must be identical (toStrictEqual: same fields,
// classes, typed-array kinds, -0 and NaN), message after message through the one reused object.
import { describe, expect, it } from 'vitest';
import { parse } from '@foxglove/rosmsg';
import { ros2humble } from '@foxglove/rosmsg-msgs-common';
import { MessageReader, MessageWriter } from '@foxglove/rosmsg2-serialization';
import { FixedLayoutReader } from '../../../estimator/io/ros/FixedLayoutReader.js';
import { RandomStream } from '../../../estimator/random/RandomStream.js';
import { ros2SchemaText } from './RosRecordingWriter.js';

type Definition = ReturnType<typeof parse>[number];
type Field = Definition['definitions'][number];

// Repeats (the decoded string is reused), changes, multi-byte text, and one longer than the reader's first buffer (it grows).
const STRINGS = ['', 'base_link', 'odom', 'base_link', 'camera_optical_frame', 'ü-frame 🛬', 'base_link', 'frame_'.repeat(1000)];
const INTEGER_RANGE: Record<string, [number, number]> = { int8: [-128, 127], uint8: [0, 255], int16: [-32768, 32767], uint16: [0, 65535], int32: [-(2 ** 31), 2 ** 31 - 1], uint32: [0, 2 ** 32 - 1] };

function randomNumber(type: string, rng: RandomStream): number | boolean {
  if (type === 'bool') return rng.bernoulli(0.5);
  if (type === 'float64' || type === 'float32') {
    const pick = rng.integer(8);
    const x = pick === 0 ? -0 : pick === 1 ? Number.NaN : pick === 2 ? 5e-324 : (rng.uniform() - 0.5) * 10 ** (rng.integer(40) - 20);
    return type === 'float32' ? Math.fround(x) : x;
  }
  const [lo, hi] = INTEGER_RANGE[type]!;
  return lo + Math.floor(rng.uniform() * (hi - lo + 1));
}

/** A random message of `definition`, in the plain shape MessageWriter takes. */
function randomMessage(definition: Definition, byName: Map<string, Definition>, rng: RandomStream): Record<string, unknown> {
  const msg: Record<string, unknown> = {};
  for (const field of definition.definitions.filter((f: Field) => f.isConstant !== true)) {
    if (field.isComplex === true) msg[field.name] = randomMessage(byName.get(field.type)!, byName, rng);
    else if (field.type === 'time' || field.type === 'duration') msg[field.name] = { sec: randomNumber('int32', rng), nanosec: randomNumber('uint32', rng) };
    else if (field.type === 'string') msg[field.name] = STRINGS[rng.integer(STRINGS.length)];
    else if (field.isArray === true) msg[field.name] = Array.from({ length: field.arrayLength! }, () => randomNumber(field.type, rng));
    else msg[field.name] = randomNumber(field.type, rng);
  }
  return msg;
}

const standardTypes = [...Object.keys(ros2humble), 'vision_msgs/Detection2DArray', 'vision_msgs/BoundingBox2D', 'vision_msgs/ObjectHypothesis'];

describe('FixedLayoutReader', () => {
  const covered: string[] = [];

  it.each(standardTypes)('reads %s as MessageReader does, or declines it', (type) => {
    const definitions = parse(ros2SchemaText(type), { ros2: true });
    const fast = FixedLayoutReader.of(definitions);
    if (fast === null) return; // a sequence, a 64-bit integer or an empty type: the library decodes it
    covered.push(type);
    const byName = new Map(definitions.map((d) => [d.name ?? '', d]));
    const reference = new MessageReader(definitions);
    const writer = new MessageWriter(definitions);
    const rng = RandomStream.fromKey([16, standardTypes.indexOf(type)]);
    for (let n = 0; n < 40; n++) {
      const bytes = writer.writeMessage(randomMessage(definitions[0]!, byName, rng));
      expect(fast.read(bytes)).toStrictEqual(reference.readMessage(bytes));
    }
  });

  it('covers the IMU, odometry and stamped pose, twist and quaternion types the map names, and declines types with sequences', () => {
    expect(covered).toEqual(expect.arrayContaining(['sensor_msgs/Imu', 'nav_msgs/Odometry', 'geometry_msgs/PoseStamped', 'geometry_msgs/PoseWithCovarianceStamped', 'geometry_msgs/QuaternionStamped', 'geometry_msgs/TwistStamped', 'geometry_msgs/TwistWithCovarianceStamped']));
    for (const type of ['sensor_msgs/CameraInfo', 'vision_msgs/Detection2DArray', 'std_msgs/Empty', 'sensor_msgs/PointCloud2']) expect(covered).not.toContain(type);
  });

  it('hands a message it cannot read as planned back (null): cut short, another encapsulation', () => {
    const definitions = parse(ros2SchemaText('sensor_msgs/Imu'), { ros2: true });
    const fast = FixedLayoutReader.of(definitions)!;
    const bytes = new MessageWriter(definitions).writeMessage(randomMessage(definitions[0]!, new Map(definitions.map((d) => [d.name ?? '', d])), RandomStream.fromKey([16, 1])));
    expect(fast.read(bytes)).not.toBeNull();
    expect(fast.read(bytes.subarray(0, bytes.length - 8))).toBeNull(); // the last covariance cut off
    expect(fast.read(bytes.subarray(0, 10))).toBeNull(); // inside the frame id
    const bigEndian = bytes.slice();
    bigEndian[1] = 0x00;
    expect(fast.read(bigEndian)).toBeNull();
  });
});
