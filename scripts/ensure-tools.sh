#!/usr/bin/env bash
# The tests drive Debian's Chromium (never a browser download) and read PDFs and ZIPs with poppler and unzip.
# Install whatever of those is missing (as root), or say how.
set -euo pipefail
missing=()
command -v "${CHROMIUM_PATH:-/usr/bin/chromium}" >/dev/null 2>&1 || missing+=(chromium)
command -v pdftotext >/dev/null 2>&1 || missing+=(poppler-utils)
command -v unzip >/dev/null 2>&1 || missing+=(unzip)
[ ${#missing[@]} -eq 0 ] && exit 0
if [ "$(id -u)" != "0" ]; then
  echo "The tests need: ${missing[*]}. Install them with: sudo apt-get install -y ${missing[*]}" >&2
  exit 1
fi
echo "Installing ${missing[*]} for the tests…"
export DEBIAN_FRONTEND=noninteractive
apt-get update -qq
apt-get install -y -qq "${missing[@]}" >/dev/null
