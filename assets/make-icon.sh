#!/usr/bin/env bash
# Renders icon.svg (our own vector art) to icon.png, the 1024x1024 icon electron-builder packs and
# scales down per platform (macOS wants 1024; needs chromium). Usage: assets/make-icon.sh [SIZE]
set -euo pipefail
cd "$(dirname "$0")"
size="${1:-1024}"
page=$(mktemp --suffix=.html)
printf '<html><body style="margin:0;background:transparent"><img src="file://%s/icon.svg" width="%s" height="%s"></body></html>' "$PWD" "$size" "$size" > "$page"
chromium --headless --no-sandbox --disable-gpu --hide-scrollbars --default-background-color=00000000 \
  --window-size="$size,$size" --screenshot="$PWD/icon.png" "file://$page" 2>/dev/null
rm -f "$page"
