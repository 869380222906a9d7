import { describe, expect, it } from 'vitest';
import { defaultScenario } from '../../../estimator/io/defaultScenario.js';
import { VERSION } from '../../../estimator/version.js';
import type { Analysis } from '../../../notebooks/analysis/Analysis.js';
import { InlineJobRunner } from '../../../notebooks/jobs/InlineJobRunner.js';
import { mountStudy, settleFigures } from '../../../notebooks/runtime/mountStudy.js';
import { detectionStudy } from '../../../notebooks/studies/detectionStudy.js';
import type { FigureOutput } from '../../../notebooks/studies/Study.js';

const analysis: Analysis = { study: 'detection', scenario: defaultScenario(), parameters: { impairment: 'rate', trials: 1, confidence: '0.95' }, seed: 2, toolVersion: VERSION };

function until(check: () => boolean, ms = 20_000): Promise<void> {
  const started = Date.now();
  return new Promise((resolve, reject) => {
    const poll = (): void => {
      if (check()) resolve();
      else if (Date.now() - started > ms) reject(new Error('timed out'));
      else setTimeout(poll, 10);
    };
    poll();
  });
}

describe('mountStudy', () => {
  it('redraws only the figures that depend on a changed control and reruns no job for it', async () => {
    const runner = new InlineJobRunner();
    const renders: Record<string, number> = {};
    const latest = new Map<string, FigureOutput>();
    const mounted = mountStudy(detectionStudy, analysis, runner, {
      figure: (name, output) => {
        renders[name] = (renders[name] ?? 0) + 1;
        latest.set(name, output);
      },
      failed: (name, message) => {
        throw new Error(`${name}: ${message}`);
      },
    });
    await until(() => ['success', 'miss', 'outcomes'].every((n) => latest.get(n)?.final));
    const before = { ...renders };
    const lowBefore = latest.get('success')!.numbers.find((n) => n.key === 'wilsonLow0')!.value!;
    mounted.set('confidence', '0.99');
    await until(() => renders.success! > before.success!);
    await new Promise((resolve) => setTimeout(resolve, 50));
    expect(renders.miss).toBe(before.miss);
    expect(renders.outcomes).toBe(before.outcomes);
    expect(runner.started.get('sweep')).toBe(1);
    expect(mounted.graph.computeCounts.get('sweep')).toBe(1);
    // A wider interval: the lower bound can only move down.
    expect(latest.get('success')!.numbers.find((n) => n.key === 'wilsonLow0')!.value!).toBeLessThanOrEqual(lowBefore);
    mounted.set('trials', 2);
    await until(() => runner.started.get('sweep') === 2 && latest.get('miss')!.final && renders.miss! > before.miss!);
    mounted.dispose();
  });

  it('settles to the same figures every time for the same analysis', async () => {
    const a = await settleFigures(detectionStudy, analysis, new InlineJobRunner());
    const b = await settleFigures(detectionStudy, analysis, new InlineJobRunner());
    for (const f of detectionStudy.figures) expect(a.get(f.name)!.markup, f.name).toBe(b.get(f.name)!.markup);
    expect(a.get('outcomes')!.attachment!.text.split('\n').length).toBe(1 + 4 + 1);
  });
});
