#!/usr/bin/env node
/*
 * `npm start` / `npm run start:web` / `npm stop`: runs office-addin-debugging, which is an optional
 * dependency because it pulls a native keychain module that needs a compiler and the libsecret
 * development files to install. When it is missing, say how to add it instead of failing with
 * "command not found".
 */
"use strict";
const { spawnSync } = require("child_process");
const path = require("path");

let cli;
try {
  cli = require.resolve("office-addin-debugging/cli.js", { paths: [path.join(__dirname, "..")] });
} catch {
  process.stderr.write(
    [
      "loadpath: the sideloading tools (office-addin-debugging) are not installed.",
      "They are optional because they build a native keychain module. To install them:",
      "  sudo apt-get install build-essential libsecret-1-dev pkg-config   (Debian/Ubuntu; Windows and macOS need nothing)",
      "  npm install --no-save office-addin-debugging",
      "Then run the command again. Without them you can still upload manifest.xml by hand (see README, Using it in Excel).",
      "",
    ].join("\n"),
  );
  process.exit(2);
}
const result = spawnSync(process.execPath, [cli, ...process.argv.slice(2)], { stdio: "inherit" });
process.exit(result.status === null ? 1 : result.status);
