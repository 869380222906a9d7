// The command list: one import and one entry per command, in the order --help shows them.
import type { Command } from './Command.js';
import { simulateCommand } from './simulateCommand.js';
import { cameraCommand } from './cameraCommand.js';
import { mergeCommand } from './mergeCommand.js';
import { summarizeCommand } from './summarizeCommand.js';
import { trialsCommand } from './trialsCommand.js';
import { testCardCommand } from './testCardCommand.js';
import { sweepCommand } from './sweepCommand.js';
import { requireCommand } from './requireCommand.js';
import { sensitivityCommand } from './sensitivityCommand.js';
import { tuneCommand } from './tuneCommand.js';
import { replayCommand } from './replayCommand.js';
import { recordCommand } from './recordCommand.js';
import { ingestCommand } from './ingestCommand.js';
import { reportCommand } from './reportCommand.js';

export const commands: Command[] = [
  simulateCommand,
  cameraCommand,
  mergeCommand,
  summarizeCommand,
  sweepCommand,
  trialsCommand,
  testCardCommand,
  requireCommand,
  sensitivityCommand,
  tuneCommand,
  replayCommand,
  recordCommand,
  ingestCommand,
  reportCommand,
];
