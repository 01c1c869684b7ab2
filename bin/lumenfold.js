#!/usr/bin/env node
import { main } from '../dist/cli/main.js';

main(process.argv).then(
  (code) => { process.exitCode = code; },
  (err) => { process.stderr.write(`lumenfold: ${err && err.message ? err.message : String(err)}\n`); process.exitCode = 1; },
);
