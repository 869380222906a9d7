// The ensemble NEES verdict of a descent: each trial's mean NEES per true-height bin
// (TrialResult.neesByHeight, bins of DESCENT_HEIGHT_EDGES) judged bin by bin with
// ensembleConsistency. One function for summarize, simulate, replay, the page and the report.
import { descentHeightLabels } from '../../sim/descentHeightBins.js';
import { ensembleConsistency, type EnsembleConsistency } from './ensembleConsistency.js';

/** The ensemble NEES verdict over trials' per-height descent NEES (null without any value). */
export function descentConsistency(perTrial: readonly ((number | null)[] | undefined)[], dim: number): EnsembleConsistency | null {
  const labels = descentHeightLabels();
  const bins = labels.map((label) => ({ label, values: [] as number[] }));
  for (const values of perTrial) {
    if (!values) continue;
    // JSON has no Infinity: a diverged trial's bin comes back null and counts as absent
    values.forEach((v, i) => {
      if (typeof v === 'number' && i < bins.length) bins[i]!.values.push(v);
    });
  }
  const used = bins.filter((b) => b.values.length > 0);
  return used.length > 0 && dim > 0 ? ensembleConsistency(used, dim) : null;
}
