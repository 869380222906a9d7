import { join } from 'node:path';
import { describe, expect, it } from 'vitest';
import { main } from '../../estimator/cli/main.js';

const ROOT = join(import.meta.dirname, '..', '..');

async function run(argv: string[]): Promise<{ code: number; stdout: string; stderr: string }> {
  let stdout = '', stderr = '';
  const code = await main(argv, { stdout: (t) => void (stdout += t), stderr: (t) => void (stderr += t), interactive: false, cwd: ROOT, env: {} });
  return { code, stdout, stderr };
}

describe('alight camera', () => {
  it('reports field of view and pixels per metre from a lens spec', async () => {
    const { code, stdout } = await run(['camera', 'data-demo/delivery-van.scenario.json', '--height', '5', '--json']);
    expect(code).toBe(0);
    const r = JSON.parse(stdout) as Record<string, number>;
    // fx = f W / sensorWidth = 1.8 mm * 640 / 3.76 mm; fy = 1.8 * 480 / 2.74 (lens model, common practice)
    expect(r.fx).toBeCloseTo((1.8 * 640) / 3.76, 9);
    expect(r.horizontalFovDeg).toBeCloseTo((2 * Math.atan(3.76 / 2 / 1.8) * 180) / Math.PI, 9);
    expect(r.pixelsPerMetre).toBeCloseTo(Math.sqrt(r.fx! * r.fy!) / 5, 9);
    const text = await run(['camera', 'data-demo/delivery-van.scenario.json']);
    expect(text.stdout).toContain('lens 1.80 mm on a 3.76 x 2.74 mm sensor');
    expect(text.stdout).toMatch(/at 6 m {6}[\d.]+ px\/m/);
  });

  it('refuses a bad height and shows its help', async () => {
    const bad = await run(['camera', 'data-demo/delivery-van.scenario.json', '--height', '0']);
    expect(bad.code).toBe(2);
    expect(bad.stderr).toBe('alight camera: --height expects a positive height in metres, got "0"\n');
    const help = await run(['camera', '--help']);
    expect(help.stdout).toMatch(/^usage: alight camera <scenario\.json> \[--height H\] \[--json\]/);
  });
});
