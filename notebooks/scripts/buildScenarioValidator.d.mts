/** Pattern of the module path the page's bundles replace with the generated check. */
export const SCENARIO_CHECK_MODULE: RegExp;
/** ES module source exporting `validateSchema`, before bundling. */
export function scenarioValidatorSource(): string;
/** Write the self-contained validator module (ESM, no imports) to `outfile`. */
export function writeScenarioValidator(outfile: string): Promise<void>;
