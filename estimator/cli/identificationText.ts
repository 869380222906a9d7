// Text of a noise identification for `alight tune`: the identified terms with their intervals
// and warnings, then the recommended setting against the current one. Presentation only: every
// figure comes from identifyNoise / settingCheck.
import type { SettingCheck, StatisticCheck } from '../io/log/settingCheck.js';
import type { NoiseIdentification } from '../study/identifyNoise.js';
import { roundTo, termValueText } from '../study/termValueText.js';

function pad(text: string, width: number): string {
  return text.length >= width ? text + ' ' : text + ' '.repeat(width - text.length);
}

export function identificationText(id: NoiseIdentification, what: string): string {
  const lines = [`noise identified from ${what}: ${id.evaluations} replays, -2 ln L ${id.startMinus2LogL.toFixed(1)} at the start -> ${id.minus2LogL.toFixed(1)}`];
  lines.push(`  ${pad('term', 20)}${pad('identified', 40)}${pad('current', 12)}recommended`);
  for (const t of id.terms) lines.push(`  ${pad(t.name, 20)}${pad(termValueText(t), 40)}${pad(String(roundTo(t.start, 4)), 12)}${t.recommended}${t.status === 'identified' ? '' : ' (kept)'}`);
  lines.push(`  method: ${id.method}`);
  return lines.join('\n') + '\n';
}

function statText(s: StatisticCheck | null): string {
  if (!s) return '-';
  return `${s.mean.toPrecision(3)} [${s.low.toPrecision(3)}, ${s.high.toPrecision(3)}] ${s.verdict}`;
}

function rmse(v: number | null, unit: string): string {
  return v === null ? '-' : `${v.toPrecision(2)} ${unit}`;
}

/** Current against recommended, one row per check. */
export function comparisonText(current: SettingCheck, recommended: SettingCheck): string {
  const rows: [string, string, string][] = [
    ['box NIS (dim 3)', statText(current.boxes), statText(recommended.boxes)],
    ['odometry NIS (dim 3)', statText(current.odometry), statText(recommended.odometry)],
    ['NEES vs truth (dim 6)', statText(current.nees), statText(recommended.nees)],
    ['position RMSE vs truth', rmse(current.positionRmse, 'm'), rmse(recommended.positionRmse, 'm')],
    ['velocity RMSE vs truth', rmse(current.velocityRmse, 'm/s'), rmse(recommended.velocityRmse, 'm/s')],
    ['gated updates', `${(100 * current.gatedFraction).toFixed(1)} %`, `${(100 * recommended.gatedFraction).toFixed(1)} %`],
    ['whiteness (tests passed)', `${current.whitenessPassed} of ${current.whitenessTests}`, `${recommended.whitenessPassed} of ${recommended.whitenessTests}`],
    ['-2 ln L (gated replay)', current.minus2LogL.toFixed(1), recommended.minus2LogL.toFixed(1)],
  ];
  const lines = [`  ${pad('', 26)}${pad('current', 40)}recommended`];
  for (const [name, a, b] of rows) lines.push(`  ${pad(name, 26)}${pad(a, 40)}${b}`);
  return lines.join('\n') + '\n';
}
