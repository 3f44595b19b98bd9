#!/usr/bin/env bash
# Installs what the tests need and runs the whole suite: unit, integration (real PostgreSQL +
# PostGIS, SMTP capture, payments fake) and browser journeys (headless Chromium).
set -euo pipefail
cd "$(dirname "$0")/.."

if [ ! -d node_modules ] || [ package-lock.json -nt node_modules/.package-lock.json ]; then
  echo "▸ Installing npm packages"
  npm ci --no-audit --no-fund
fi

need=()
[ -x /usr/bin/chromium ] || need+=(chromium)
command -v pdftotext >/dev/null || need+=(poppler-utils)
[ -x /usr/lib/postgresql/15/bin/postgres ] || need+=(postgresql-15)
[ -f /usr/share/postgresql/15/extension/postgis.control ] || need+=(postgresql-15-postgis-3)
if [ ${#need[@]} -gt 0 ]; then
  echo "▸ Installing from Debian: ${need[*]}"
  apt-get update -qq >/dev/null
  DEBIAN_FRONTEND=noninteractive apt-get install -y -qq --no-install-recommends "${need[@]}" >/dev/null
fi

echo "▸ Starting the test PostgreSQL"
bash server/scripts/db.sh start test

echo "▸ Building the web client for the browser journeys"
node_modules/.bin/vite build --logLevel warn

results=$(mktemp -d)
status=0
echo "▸ Unit and integration tests"
node_modules/.bin/vitest run --project unit --project integration --reporter=default --reporter=json --outputFile.json="$results/server.json" "$@" || status=$?

echo "▸ Browser journeys"
node_modules/.bin/vitest run --project e2e --reporter=default --reporter=json --outputFile.json="$results/e2e.json" "$@" || status=$?

# One closing line for the whole suite.
node -e '
  const fs = require("fs");
  let passed = 0, failed = 0, skipped = 0;
  for (const f of process.argv.slice(1)) {
    if (!fs.existsSync(f)) { failed++; continue; }
    const r = JSON.parse(fs.readFileSync(f, "utf8"));
    passed += r.numPassedTests; failed += r.numFailedTests; skipped += r.numPendingTests + (r.numTodoTests || 0);
  }
  console.log(`\nTests: ${passed} passed, ${failed} failed, ${skipped} skipped`);
' "$results/server.json" "$results/e2e.json"
rm -rf "$results"
exit "$status"
