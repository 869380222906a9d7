// `alight camera <scenario.json> [--height H]`: what the scenario's camera sees: intrinsics,
// field of view, ground footprint and pixels per metre at a height, and the deck's box size.
import { fieldOfViewDeg, intrinsicsFromSpec, pixelsPerMetre } from '../sim/world/cameraFromSpec.js';
import type { Scenario } from '../sim/Scenario.js';
import type { Command } from './Command.js';
import { formatHelp, HELP_OPTION, numberOption, parseArgs, type OptionSpec } from './parseArgs.js';
import { CliError } from './CliError.js';
import { loadScenarioForCli } from './loadScenarioForCli.js';

const OPTIONS: OptionSpec[] = [
  { name: 'height', kind: 'value', valueName: 'H', help: "camera height above the deck (m; default: the scenario's trailing height)" },
  { name: 'json', kind: 'flag', help: 'print one JSON object instead of text' },
  HELP_OPTION,
];
const USAGE = 'alight camera <scenario.json> [--height H] [--json]';
const PURPOSE = "report a scenario camera's field of view and pixels per metre at a height";

export interface CameraReport {
  fx: number;
  fy: number;
  cx: number;
  cy: number;
  width: number;
  height: number;
  horizontalFovDeg: number;
  verticalFovDeg: number;
  /** Height above the deck (m) the next figures are for. */
  atHeight: number;
  pixelsPerMetre: number;
  /** Ground footprint of the image at that height (m), nadir view, undistorted. */
  footprintWidth: number;
  footprintHeight: number;
  /** Size of the deck's box, sqrt(area) of its outline (px), seen from straight above. */
  deckBoxSize: number;
}

export function cameraReport(scenario: Scenario, heightM: number): CameraReport {
  const camera = scenario.camera;
  const k = intrinsicsFromSpec(camera);
  const fov = fieldOfViewDeg(k, camera.width, camera.height);
  const ppm = pixelsPerMetre(k, heightM);
  const deck = Math.sqrt(scenario.carrier.deckLength * scenario.carrier.deckWidth);
  return {
    ...k,
    width: camera.width,
    height: camera.height,
    horizontalFovDeg: fov.horizontal,
    verticalFovDeg: fov.vertical,
    atHeight: heightM,
    pixelsPerMetre: ppm,
    footprintWidth: (camera.width * heightM) / k.fx,
    footprintHeight: (camera.height * heightM) / k.fy,
    deckBoxSize: deck * ppm,
  };
}

/** One line for the simulate summary. */
export function cameraSummary(scenario: Scenario, heightM: number): string {
  const r = cameraReport(scenario, heightM);
  return `field of view ${r.horizontalFovDeg.toFixed(1)} x ${r.verticalFovDeg.toFixed(1)} deg; ${r.pixelsPerMetre.toFixed(1)} px/m and a ${r.deckBoxSize.toFixed(0)} px deck at ${heightM} m`;
}

export const cameraCommand: Command = {
  name: 'camera',
  purpose: PURPOSE,
  async run(argv, io) {
    const parsed = parseArgs('camera', argv, OPTIONS);
    if (parsed.flags.has('help')) {
      io.stdout(formatHelp(USAGE, `${PURPOSE}.\nThe camera is the scenario's: intrinsics as given, or from lens focal length, sensor size and\nresolution (fx = f width / sensorWidth). Figures are for a nadir view of flat ground, no distortion.`, OPTIONS));
      return 0;
    }
    if (parsed.positional.length > 1) throw new CliError(`alight camera: one scenario file please (${USAGE})`);
    const scenario = loadScenarioForCli('camera', parsed.positional[0], io.cwd);
    const h = numberOption('camera', parsed, 'height', scenario.guidance.trailHeight, (v) => v > 0, 'a positive height in metres');
    const r = cameraReport(scenario, h);
    if (parsed.flags.has('json')) {
      io.stdout(JSON.stringify(r) + '\n');
      return 0;
    }
    const source = scenario.camera.lens
      ? `lens ${(scenario.camera.lens.focalLength * 1000).toFixed(2)} mm on a ${(scenario.camera.lens.sensorWidth * 1000).toFixed(2)} x ${(scenario.camera.lens.sensorHeight * 1000).toFixed(2)} mm sensor`
      : 'intrinsics as given';
    io.stdout(
      [
        `alight camera: ${scenario.name}`,
        `  image        ${r.width} x ${r.height} px, ${source}`,
        `  intrinsics   fx ${r.fx.toFixed(1)}, fy ${r.fy.toFixed(1)}, cx ${r.cx.toFixed(1)}, cy ${r.cy.toFixed(1)} px`,
        `  field of view ${r.horizontalFovDeg.toFixed(1)} deg horizontal, ${r.verticalFovDeg.toFixed(1)} deg vertical`,
        `  at ${h} m      ${r.pixelsPerMetre.toFixed(1)} px/m; footprint ${r.footprintWidth.toFixed(1)} x ${r.footprintHeight.toFixed(1)} m; deck box ~${r.deckBoxSize.toFixed(0)} px`,
      ].join('\n') + '\n',
    );
    return 0;
  },
};
