// Noise identification on flight logs: the named noise terms of the filter are free, the others
// held; every evaluation replays every log and sums their innovation likelihoods (box and
// odometry together), and identifyNoise maximises it. Truth, when a log has it, is never the
// objective: NEES and RMSE are reported beside the likelihood as checks.
// Browser-safe (any LogSource whose streams can be opened again for every replay).
import type { FilterSpec } from '../../sim/Scenario.js';
import { identifyNoise, type IdentifyOptions, type NoiseIdentification } from '../../study/identifyNoise.js';
import { DEFAULT_FREE_TERMS, noiseTerm, type NoiseTermName } from '../../study/noiseTerms.js';
import type { LogSource } from './LogSource.js';
import { replayFilterSpec, replayLog, type ReplayReport, type ReplaySettings } from './replayLog.js';
import { recommendationWarnings, settingCheck, type SettingCheck } from './settingCheck.js';

export interface IdentifyLogOptions extends Pick<IdentifyOptions, 'maxEvaluations' | 'profilePoints' | 'onEvaluation'> {
  /** Terms to identify (default DEFAULT_FREE_TERMS); every other setting is held. */
  free?: readonly NoiseTermName[];
  /** Settings over the first log's filter.json, as for replay: the current setting and the start. */
  filter?: ReplaySettings['filter'];
  filterSource?: string;
  filterLines?: ReplaySettings['filterLines'];
  /** Whiteness lags (default 20). */
  lags?: number;
}

export interface LogNoiseIdentification {
  identification: NoiseIdentification;
  /** The setting the search started from (the logs' own, with `filter` over it) and the recommended one. */
  current: FilterSpec;
  recommended: FilterSpec;
  /** Both settings replayed on every log, and the replay reports of the recommended one. */
  checks: { current: SettingCheck; recommended: SettingCheck };
  currentReports: ReplayReport[];
  recommendedReports: ReplayReport[];
  /** Sentences the user must read before using the recommendation (accuracy lost, terms not identified). */
  warnings: string[];
  logs: string[];
}

export class IdentifyLogError extends Error {
  constructor(message: string) {
    super(message);
    this.name = 'IdentifyLogError';
  }
}

export async function identifyLogNoise(sources: readonly LogSource[], options: IdentifyLogOptions = {}): Promise<LogNoiseIdentification> {
  if (sources.length === 0) throw new IdentifyLogError('no log to identify from');
  const base: ReplaySettings = { filter: options.filter, filterSource: options.filterSource, filterLines: options.filterLines, lags: options.lags };
  const current: FilterSpec = replayFilterSpec(sources[0]!, base);
  const names = options.free ?? DEFAULT_FREE_TERMS;
  const free = names.map((name) => {
    const term = noiseTerm(name);
    if (!term) throw new IdentifyLogError(`unknown noise term "${name}"`);
    return { name, unit: term.unit, start: current[name], lower: term.lower, upper: term.upper };
  });
  if (new Set(names).size !== names.length) throw new IdentifyLogError(`a noise term is named twice: ${names.join(', ')}`);
  const replayAll = (spec: FilterSpec) => Promise.all(sources.map((s) => replayLog(s, { lags: options.lags, filter: spec, filterSource: 'identification' })));
  // The search replays with the filter's own gate: a false box is refused as in flight (with the
  // gate opened it would pull the state away and make the noise look larger), and its term,
  // like every term beyond the gate, counts log-weighted (InnovationLikelihood).
  const identification = await identifyNoise(
    async (values) => {
      const reports = await replayAll({ ...current, ...values });
      // A diverged replay stops adding terms, which would make it look likely: refuse it.
      if (reports.some((r) => r.divergences.length > 0)) return Infinity;
      return reports.reduce((a, r) => a + r.likelihood.minus2LogL, 0);
    },
    free,
    { maxEvaluations: options.maxEvaluations, profilePoints: options.profilePoints, onEvaluation: options.onEvaluation },
  );
  const recommended: FilterSpec = { ...current, ...Object.fromEntries(identification.terms.map((t) => [t.name, t.recommended])) };
  const currentReports = await replayAll(current);
  const recommendedReports = await replayAll(recommended);
  const checks = { current: settingCheck(currentReports), recommended: settingCheck(recommendedReports) };
  const warnings = [...identification.terms.flatMap((t) => (t.warning ? [t.warning] : [])), ...recommendationWarnings(checks.current, checks.recommended)];
  return { identification, current, recommended, checks, currentReports, recommendedReports, warnings, logs: sources.map((s) => s.name) };
}
