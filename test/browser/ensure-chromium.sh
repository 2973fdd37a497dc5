#!/usr/bin/env bash
# Installs Debian's Chromium for the browser tests when it is missing (npm cannot download
# browsers here). Needs root or sudo; prints what it does.
set -euo pipefail
if command -v chromium >/dev/null 2>&1 || [ -x /usr/bin/chromium ]; then
  exit 0
fi
echo "chromium not found: installing Debian's chromium package for the browser tests" >&2
SUDO=""
if [ "$(id -u)" -ne 0 ]; then SUDO="sudo"; fi
$SUDO apt-get update -qq
DEBIAN_FRONTEND=noninteractive $SUDO apt-get install -y -qq chromium >/dev/null
command -v chromium >/dev/null
