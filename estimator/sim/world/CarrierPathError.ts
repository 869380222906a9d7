// A carrier path that cannot be built: names the scenario field and what was expected.
export class CarrierPathError extends Error {
  readonly field: string;
  constructor(field: string, problem: string) {
    super(`${field}: ${problem}`);
    this.name = 'CarrierPathError';
    this.field = field;
  }
}
