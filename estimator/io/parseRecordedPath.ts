// A recorded carrier path: CSV rows t,x,y,z (s, m ENU), optional header line, '#' comments.
// Browser-safe; loadScenario reads the file.
import { ScenarioError } from './ScenarioError.js';

/**
 * Parse recorded-path CSV text into [t, x, y, z] rows with strictly increasing t.
 * @throws ScenarioError naming the file and line of each bad row (at most 10 reported).
 * @example parseRecordedPath('t,x,y,z\n0,0,0,0\n1,2,0,0\n', 'road.csv') // [[0,0,0,0],[1,2,0,0]]
 */
export function parseRecordedPath(text: string, fileName: string): number[][] {
  const rows: number[][] = [];
  const problems: string[] = [];
  const lines = text.split(/\r?\n/);
  lines.forEach((line, index) => {
    const trimmed = line.trim();
    if (trimmed === '' || trimmed.startsWith('#')) return;
    const cells = trimmed.split(',').map((c) => c.trim());
    const values = cells.map(Number);
    const numeric = cells.every((c) => c !== '') && values.every(Number.isFinite);
    if (!numeric && rows.length === 0 && problems.length === 0 && /[a-zA-Z]/.test(trimmed)) return; // header
    if (!numeric || values.length !== 4) {
      problems.push(`${fileName}:${index + 1}: expected 4 numbers t,x,y,z, got "${trimmed.slice(0, 40)}"`);
      return;
    }
    const previous = rows[rows.length - 1];
    if (previous && !(values[0]! > previous[0]!)) {
      problems.push(`${fileName}:${index + 1}: t must increase, got ${values[0]} after ${previous[0]}`);
      return;
    }
    rows.push(values);
  });
  if (problems.length === 0 && rows.length < 2) problems.push(`${fileName}: a recorded path needs at least 2 rows, got ${rows.length}`);
  if (problems.length > 0) throw new ScenarioError(fileName, problems.slice(0, 10));
  return rows;
}
