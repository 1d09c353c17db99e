#!/usr/bin/env node
import { main } from '../dist/cli/main.js';
import { removeTemporariesOnSignals } from '../dist/io/own-temporaries.js';

// Ctrl-C, SIGTERM or SIGHUP: remove this run's temporary files and its output-folder lock first.
removeTemporariesOnSignals();

// A closed pipe (e.g. `lexichron lexicons | head`) is not an error.
for (const stream of [process.stdout, process.stderr]) {
  stream.on('error', (error) => {
    if (error.code === 'EPIPE') process.exit(0);
    throw error;
  });
}

main(process.argv).then((code) => {
  process.exitCode = code;
});
