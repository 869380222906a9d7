// A scenario that cannot be used: one message per problem, each naming the file, the line
// when known, the field path and what was expected. The CLI prints `problems` and exits 2.

export class ScenarioError extends Error {
  /** One line per problem, e.g. `rover.scenario.json:12: detector.pixelNoise: must be >= 0, got -1`. */
  readonly problems: readonly string[];
  readonly fileName: string;

  constructor(fileName: string, problems: readonly string[]) {
    super(problems.join('\n'));
    this.name = 'ScenarioError';
    this.fileName = fileName;
    this.problems = problems;
  }
}
