#!/usr/bin/env bash
# Starts Chromium full-screen on a Linux tablet as a Gaugewalk kiosk.
# Usage: kiosk/launch-kiosk.sh https://gaugewalk.hangar.example   (the server's address)
set -euo pipefail
url="${1:?give the Gaugewalk server address, e.g. https://gaugewalk.hangar.example}"
browser="$(command -v chromium || command -v chromium-browser || command -v google-chrome || true)"
[ -n "$browser" ] || { echo "Chromium is not installed: sudo apt-get install -y chromium" >&2; exit 1; }
profile="${XDG_STATE_HOME:-$HOME/.local/state}/gaugewalk-kiosk"
mkdir -p "$profile"
# Keep the screen on while the kiosk runs (X11); harmless where xset is missing.
command -v xset >/dev/null && { xset s off; xset -dpms; xset s noblank; } || true
extra=()
# Cameras only work on HTTPS or localhost. For a trial on plain HTTP inside the hangar network only:
#   GAUGEWALK_INSECURE_ORIGIN=http://10.0.0.5:8080 kiosk/launch-kiosk.sh http://10.0.0.5:8080
if [ -n "${GAUGEWALK_INSECURE_ORIGIN:-}" ]; then
  extra+=("--unsafely-treat-insecure-origin-as-secure=${GAUGEWALK_INSECURE_ORIGIN}")
fi
exec "$browser" \
  --user-data-dir="$profile" \
  --kiosk --app="${url%/}/kiosk" \
  --noerrdialogs --disable-infobars --no-first-run \
  --disable-pinch --overscroll-history-navigation=0 \
  --disable-translate --disable-features=TranslateUI \
  --check-for-update-interval=31536000 \
  "${extra[@]}"
