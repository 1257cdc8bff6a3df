#!/usr/bin/env node
/* The `loadpath` command: runs the built CLI bundle (dist/cli.js). */
"use strict";
const fs = require("fs");
const path = require("path");

const cli = path.join(__dirname, "..", "dist", "cli.js");
if (!fs.existsSync(cli)) {
  process.stderr.write('loadpath: dist/cli.js is missing; run "npm run build" first.\n');
  process.exit(2);
}
require(cli)
  .main(process.argv.slice(2))
  .then(
    (code) => {
      process.exitCode = code;
    },
    (error) => {
      process.stderr.write(`loadpath: ${error && error.stack ? error.stack : String(error)}\n`);
      process.exitCode = 2;
    },
  );
