#!/usr/bin/env node
import { main } from '../dist/cli/main.js';

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
