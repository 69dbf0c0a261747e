#!/usr/bin/env node
/** fropa command line: parses arguments and dispatches to commands; all work happens in src/. */
import yargs from 'yargs';
import { hideBin } from 'yargs/helpers';

await yargs(hideBin(process.argv))
  .scriptName('fropa')
  .usage('$0 <command> [options]\n\nFind frontal passages in surface weather-station observations.')
  .demandCommand(1, 'Name a command: inspect or detect.')
  .strict()
  .help()
  .parseAsync();
