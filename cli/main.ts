#!/usr/bin/env node
/** fropa executable: run the command line on this process's arguments and streams, set the exit code. */
import { processIo, runCli } from './run.js';

// A closed pipe (`fropa detect … | head`) ends output quietly instead of failing with EPIPE.
process.stdout.on('error', (e: NodeJS.ErrnoException) => {
  if (e.code === 'EPIPE') process.exit(process.exitCode ?? 0);
  throw e;
});

process.exitCode = await runCli(process.argv.slice(2), processIo());
