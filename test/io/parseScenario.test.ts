import { describe, expect, it } from 'vitest';
import { parseScenario } from '../../estimator/io/parseScenario.js';
import { ScenarioError } from '../../estimator/io/ScenarioError.js';

function problems(text: string, file = 'rover.scenario.json'): readonly string[] {
  try {
    parseScenario(text, file);
  } catch (error) {
    expect(error).toBeInstanceOf(ScenarioError);
    return (error as ScenarioError).problems;
  }
  return expect.fail('expected a ScenarioError');
}

describe('parseScenario', () => {
  it('fills omitted sections and fields from the defaults', () => {
    const s = parseScenario('{"version": 1, "detector": {"pixelNoise": 4}}', 'a.json');
    expect(s.detector.pixelNoise).toBe(4);
    expect(s.detector.rate).toBe(30);
    expect(s.guidance.law).toBe('pid');
    expect(Object.isFrozen(s.detector)).toBe(true);
  });

  it('reports one line per problem with file, line, column, field path and what was expected', () => {
    // columns counted by hand: the value at fault, or the enclosing object when the field is missing
    const text = [
      '{',
      '  "version": 1,',
      '  "detector": { "pixelNoise": -1, "rate": "fast", "colour": 3 },',
      '  "carrier": { "kind": "bus", "path": { "shape": "recorded" } },',
      '  "lander": { "startOffset": [0, 0] },',
      '  "envelope": { "maxTiltDeg": 95 }',
      '}',
    ].join('\n');
    expect(problems(text)).toEqual([
      'rover.scenario.json:3:61: detector.colour: unknown key (expected one of: rate, pixelNoise, sizeNoise, latency, latencyJitter, dropout, burst, falseBoxRate, edgeMargin, script)',
      'rover.scenario.json:3:43: detector.rate: must be number, got "fast"',
      'rover.scenario.json:3:31: detector.pixelNoise: must be >= 0, got -1',
      'rover.scenario.json:4:24: carrier.kind: must be one of "ground", "boat", "aircraft", got "bus"',
      'rover.scenario.json:4:39: carrier.path.file: a recorded path needs a file (CSV of t,x,y,z) or inline points',
      'rover.scenario.json:5:30: lander.startOffset: must NOT have fewer than 3 items, got [0,0]',
      'rover.scenario.json:6:31: envelope.maxTiltDeg: must be < 90, got 95',
    ]);
  });

  it('gives file, line and column for bad JSON', () => {
    expect(problems('{\n  "version": 1,\n  "seed": 1,,\n}', 'boat.scenario.json')).toEqual([
      "boat.scenario.json:3:13: not valid JSON: expected a string, found ','",
    ]);
  });

  it('requires the version and refuses unknown top-level keys', () => {
    expect(problems('{"seeds": 3}', 'x.json')).toEqual([
      'x.json:1:1: version: is required here but missing',
      'x.json:1:11: seeds: unknown key (expected one of: $schema, version, name, description, seed, duration, carrier, lander, camera, detector, localization, filter, guidance, envelope)',
    ]);
    expect(problems('[1]', 'x.json')).toEqual(['x.json:1:1: (top level): must be object, got [1]']);
  });

  it('needs exactly one of camera.intrinsics and camera.lens', () => {
    expect(problems('{"version": 1, "camera": {"width": 640, "height": 480}}', 'c.json')).toEqual([
      'c.json:1:26: camera: give exactly one of camera.intrinsics or camera.lens, got neither',
    ]);
    const both = '{"version": 1, "camera": {"intrinsics": {"fx": 500, "fy": 500, "cx": 320, "cy": 240}, "lens": {"focalLength": 0.004, "sensorWidth": 0.006, "sensorHeight": 0.0045}}}';
    expect(problems(both, 'c.json')).toEqual(['c.json:1:26: camera: give exactly one of camera.intrinsics or camera.lens, got both']);
    const lens = parseScenario('{"version": 1, "camera": {"lens": {"focalLength": 0.004, "sensorWidth": 0.006, "sensorHeight": 0.0045}, "width": 1280, "height": 960}}', 'c.json');
    expect(lens.camera.intrinsics).toBeUndefined();
    expect(lens.camera.lens?.focalLength).toBe(0.004);
    expect(lens.camera.distortion.k1).toBe(0);
  });

  it('checks fields against each other', () => {
    const text = '{"version": 1, "detector": {"rate": 200}, "guidance": {"flareHeight": 7}, "carrier": {"speed": 2, "profile": {"variation": 3}, "path": {"shape": "rectangle", "length": 40, "width": 10, "cornerRadius": 6}}, "camera": {"intrinsics": {"fx": 1, "fy": 1, "cx": 700, "cy": 240}}}';
    expect(problems(text, 'x.json')).toEqual([
      'x.json:1:257: camera.intrinsics.cx: must lie inside the image (0..640 px), got 700',
      'x.json:1:202: carrier.path.cornerRadius: must be <= min(length, width) / 2 = 5 m for a rectangle, got 6',
      'x.json:1:124: carrier.profile.variation: must be <= carrier.speed (2 m/s), got 3',
      'x.json:1:37: detector.rate: must be <= filter.rate (100 Hz), got 200',
      'x.json:1:71: guidance.flareHeight: must be < guidance.trailHeight (6 m), got 7',
    ]);
  });

  it('accepts burst loss as null or as an object with both probabilities', () => {
    expect(parseScenario('{"version": 1, "detector": {"burst": {"enter": 0.05, "exit": 0.5}}}', 'b.json').detector.burst).toEqual({ enter: 0.05, exit: 0.5 });
    expect(problems('{"version": 1, "detector": {"burst": {"enter": 0.05}}}', 'b.json')).toEqual(['b.json:1:38: detector.burst.exit: is required here but missing']);
  });

  it('accepts inline recorded points with increasing times and refuses others', () => {
    const ok = parseScenario('{"version": 1, "carrier": {"path": {"shape": "recorded", "points": [[0, 0, 0, 0], [1, 1, 0, 0]]}}}', 'r.json');
    expect(ok.carrier.path.points).toEqual([[0, 0, 0, 0], [1, 1, 0, 0]]);
    expect(problems('{"version": 1, "carrier": {"path": {"shape": "recorded", "points": [[0, 0, 0, 0], [0, 1, 0, 0]]}}}', 'r.json')).toEqual([
      'r.json:1:84: carrier.path.points.1.0: times must increase, got 0 after 0',
    ]);
  });
});
