#!/usr/bin/env bash
# Renders icon.svg to the 512x512 icon.png that electron-builder packs (needs chromium).
set -euo pipefail
cd "$(dirname "$0")"
page=$(mktemp --suffix=.html)
printf '<html><body style="margin:0;background:transparent"><img src="file://%s/icon.svg" width="512" height="512"></body></html>' "$PWD" > "$page"
chromium --headless --no-sandbox --disable-gpu --default-background-color=00000000 \
  --window-size=512,512 --screenshot="$PWD/icon.png" "file://$page" 2>/dev/null
rm -f "$page"
