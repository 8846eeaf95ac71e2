#!/usr/bin/env bash
# The end-to-end tests drive Debian's Chromium (never a browser download). Install it when it is missing.
set -euo pipefail
if command -v "${CHROMIUM_PATH:-/usr/bin/chromium}" >/dev/null 2>&1; then exit 0; fi
if [ "$(id -u)" != "0" ]; then
  echo "Chromium is not installed. Install it with: sudo apt-get install -y chromium" >&2
  exit 1
fi
echo "Installing Debian's Chromium for the end-to-end tests…"
export DEBIAN_FRONTEND=noninteractive
apt-get update -qq
apt-get install -y -qq chromium >/dev/null
