#!/usr/bin/env bash
# Renders the demo board's HTML report in headless Chromium (Debian package `chromium`) to
# docs/demo-report.png, the picture the README shows. Needs `npm run build` first.
set -euo pipefail
cd "$(dirname "$0")/.."
tmp=$(mktemp -d)
trap 'rm -rf "$tmp"' EXIT
node dist/cli.js check fixtures/demo/demo-preamp.kicad_sch --html "$tmp/report.html" --fail-on never >/dev/null
# The flags keep Chromium off the network (this machine has none) and out of any user profile.
chromium --headless --no-sandbox --disable-gpu --disable-quic --no-first-run \
  --disable-background-networking --disable-component-update --disable-sync \
  --user-data-dir="$tmp/profile" --hide-scrollbars --window-size=1100,1900 \
  --screenshot="$PWD/docs/demo-report.png" "file://$tmp/report.html" 2>/dev/null
echo "docs/demo-report.png written"
