// The mapped topics of a recording and the roles they play (camera, boxes, imu, ...): which
// message types each role accepts, the checks a channel must pass before any message is read
// (recorded at all, CDR, a ros2msg definition, an accepted type), and its decoder, built from
// the definition the recording carries.
import { parse } from '@foxglove/rosmsg';
import { MessageReader } from '@foxglove/rosmsg2-serialization';
import type { IngestRole } from './IngestReport.js';
import type { RecordedChannel, Recording } from './openRecording.node.js';
import type { RosMap } from './parseRosMap.js';
import { RecordingError } from './RecordingError.js';
import { ROLE_TYPES, shortTypeName } from './rosMessages.js';

export interface Route {
  role: IngestRole;
  topic: string;
}

export function routesOf(map: RosMap): Route[] {
  const routes: Route[] = [
    { role: 'camera', topic: map.camera.topic },
    { role: 'boxes', topic: map.boxes.topic },
    { role: 'imu', topic: map.imu.topic },
    { role: 'attitude', topic: map.attitude.topic },
  ];
  if (map.odometry) routes.push({ role: 'odometry', topic: map.odometry.topic });
  if (map.truth) routes.push({ role: 'truthLander', topic: map.truth.lander }, { role: 'truthCarrier', topic: map.truth.carrier });
  if (map.resets) routes.push({ role: 'resets', topic: map.resets.topic });
  return routes;
}

export const ROLE_WORDS: Record<IngestRole, string> = { camera: 'camera', boxes: 'boxes', imu: 'imu', attitude: 'attitude', odometry: 'odometry', truthLander: 'truth.lander', truthCarrier: 'truth.carrier', resets: 'resets' };

function acceptedTypes(role: IngestRole, map: RosMap): readonly string[] | null {
  switch (role) {
    case 'boxes':
      return map.boxes.corners ? null : ROLE_TYPES.boxes;
    case 'truthLander':
    case 'truthCarrier':
      return ROLE_TYPES.truth;
    case 'resets':
      return null;
    default:
      return ROLE_TYPES[role];
  }
}

/** Check that a mapped topic is recorded in a form its role can read. */
export function checkRoute(name: string, route: Route, channel: RecordedChannel | undefined, recording: Recording, map: RosMap): asserts channel is RecordedChannel {
  const at = `${name}: topic ${route.topic} (${ROLE_WORDS[route.role]})`;
  if (channel === undefined) {
    const topics = [...recording.channels.values()].map((c) => `${c.topic} (${c.schemaName})`).sort();
    throw new RecordingError(`${at} is not in the recording; it has ${topics.length === 0 ? 'no topics' : `these topics: ${topics.join(', ')}`}`);
  }
  if (channel.messageEncoding !== 'cdr') throw new RecordingError(`${at}: messages are encoded as "${channel.messageEncoding}"; alight reads ROS 2 CDR ("cdr")`);
  if (channel.schemaEncoding !== 'ros2msg') throw new RecordingError(`${at}: its definition is "${channel.schemaEncoding || 'missing'}"; alight reads ROS 2 .msg definitions ("ros2msg")`);
  const type = shortTypeName(channel.schemaName);
  const accepted = acceptedTypes(route.role, map);
  if (accepted !== null && !accepted.includes(type)) {
    const hint = route.role === 'boxes' ? '; for a message of your own, give boxes.corners in the map' : '';
    throw new RecordingError(`${at}: message type ${channel.schemaName} cannot give ${ROLE_WORDS[route.role]} (accepted: ${accepted.join(', ')}${hint})`);
  }
}

/** A decoder from the definition the recording carries. */
export function decoderFor(name: string, route: Route, channel: RecordedChannel): MessageReader {
  const at = `${name}: topic ${route.topic} (${ROLE_WORDS[route.role]})`;
  try {
    return new MessageReader(parse(new TextDecoder().decode(channel.schemaData), { ros2: true }));
  } catch (error) {
    throw new RecordingError(`${at}: its message definition ${channel.schemaName} cannot be parsed (${(error as Error).message})`);
  }
}
