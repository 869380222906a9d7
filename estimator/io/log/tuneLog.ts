// Node-only adapter: tune the filter on a flight-log folder (see tuneLogSource.ts). `alight tune
// <log-folder>` (STUDY's tuneCommand) dispatches here.
import { logSourceFromFolder } from './logSourceFromFolder.node.js';
import { tuneLogSource, type TuneLogOptions, type TuneLogResult } from './tuneLogSource.js';

export type { TuneLogOptions, TuneLogResult, TuneSample, TuneCriterion } from './tuneLogSource.js';
export { tuneCost } from './tuneLogSource.js';

export function tuneLog(folder: string, options: TuneLogOptions = {}): Promise<TuneLogResult> {
  return tuneLogSource(logSourceFromFolder(folder), options);
}
