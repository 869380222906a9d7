import { describe, expect, it } from 'vitest';
import { pinholeCamera } from '../../estimator/camera/PinholeCamera.js';
import { FORECAST_MARGIN, OutlineForecast } from '../../estimator/sim/OutlineForecast.js';

const camera = pinholeCamera({ fx: 300, fy: 300, cx: 320, cy: 240, width: 640, height: 480, distortion: { k1: 0, k2: 0, k3: 0, p1: 0, p2: 0 } }, { offset: [0, 0, 0], rollDeg: 0, pitchDeg: 0, yawDeg: 0 });
const level = [1, 0, 0, 0];

describe('OutlineForecast', () => {
  it('leaving() turns true where a level, centred square deck reaches the margin (pinhole similar triangles)', () => {
    const margin = 4 + FORECAST_MARGIN * 480;
    // a flat 2 m square: its side spans 2 fx / h px, the image's shorter side leaves 480 - 2 margin
    const forecast = new OutlineForecast(camera, { deckLength: 2, deckWidth: 2, bodyHeight: 0 }, 4);
    const h = (2 * 300) / (480 - 2 * margin);
    expect(forecast.leaving([0, 0, -h * 1.001], level, 1, 0)).toBe(false);
    expect(forecast.leaving([0, 0, -h * 0.999], level, 1, 0)).toBe(true);
  });

  it('leaving() sees an offset deck leave earlier, and a deck behind the camera as gone', () => {
    const forecast = new OutlineForecast(camera, { deckLength: 2, deckWidth: 2, bodyHeight: 0.5 }, 4);
    expect(forecast.leaving([0, 0, -6], level, 1, 0)).toBe(false);
    expect(forecast.leaving([4, 0, -6], level, 1, 0)).toBe(true); // 4 m aside at 6 m: 200 px off centre plus half the deck
    expect(forecast.leaving([0, 0, 3], level, 1, 0)).toBe(true); // above the lander
  });

  it('leaving() turns the deck with the heading: a long deck across the short image side leaves higher', () => {
    const forecast = new OutlineForecast(camera, { deckLength: 3, deckWidth: 1, bodyHeight: 0 }, 4);
    // at 1.8 m a 3 m side spans 500 px: inside 640 - 2 x 18.4 px, outside 480 - 2 x 18.4 px
    const along = forecast.leaving([0, 0, -1.8], level, 1, 0);
    const across = forecast.leaving([0, 0, -1.8], level, 0, 1);
    expect(along).not.toBe(across);
  });
});
