// Node-only adapter: tune the filter on flight-log folders (see tuneLogSource.ts). `alight tune
// <log-folder>...` (tuneCommand) dispatches here.
import { logSourceFromFolder } from './logSourceFromFolder.node.js';
import { tuneLogSources, type TuneLogOptions, type TuneLogResult } from './tuneLogSource.js';

export type { TuneLogOptions, TuneLogResult } from './tuneLogSource.js';

export function tuneLog(folders: string | readonly string[], options: TuneLogOptions = {}): Promise<TuneLogResult> {
  const list = typeof folders === 'string' ? [folders] : folders;
  return tuneLogSources(list.map((f) => logSourceFromFolder(f)), options);
}
