// A recording that cannot be turned into a flight log (a mapped topic missing, a message type
// alight cannot read, frames that disagree, a damaged file): the message names the file and topic.
export class RecordingError extends Error {
  constructor(message: string) {
    super(message);
    this.name = 'RecordingError';
  }
}
