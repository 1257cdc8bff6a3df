#!/usr/bin/env bash
# Hand-off workbooks in LibreOffice Calc, on their own: recalculates the native formula batches
# and the exported sample workbooks (after a zone live load and a span change) in LibreOffice
# Calc headless and compares them with the exact solver and the headless engine.
# CI runs these checks with the rest (.ci/run installs libreoffice-calc); this script is for a
# machine where you want only them. Usage: scripts/check-libreoffice.sh
set -euo pipefail
cd "$(dirname "$0")/.."

if ! command -v soffice >/dev/null 2>&1; then
  echo "LibreOffice Calc is not installed. On Debian: sudo apt-get install --no-install-recommends libreoffice-calc" >&2
  exit 2
fi
soffice --version
if [ ! -f dist/functions.js ] || [ ! -f dist/functions.json ]; then
  npm run build
fi
npx vitest run test/engine/native test/handoff -t "LibreOffice"
