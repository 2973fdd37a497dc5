#!/usr/bin/env bash
# Makes sure the browser the browser tests drive is there; `npm test` runs this first, so a fresh
# clone needs only `npm install` and `npm test`. npm cannot download browsers here: Debian's
# `chromium` package is used. Present already ($CHROMIUM_PATH, /usr/bin/chromium or
# chromium-browser): nothing to do. Missing: installed with apt-get when running as root or with
# password-less sudo; otherwise one line saying what to run, and the tests do not start.
set -euo pipefail
for candidate in "${CHROMIUM_PATH:-}" /usr/bin/chromium /usr/bin/chromium-browser; do
  if [ -n "$candidate" ] && [ -x "$candidate" ]; then exit 0; fi
done
if ! command -v apt-get >/dev/null 2>&1; then
  echo "barwright tests: Chromium not found and apt-get is not available: install Chromium, set CHROMIUM_PATH to its binary, then run npm test again" >&2
  exit 1
fi
if [ "$(id -u)" -eq 0 ]; then
  SUDO=()
elif command -v sudo >/dev/null 2>&1 && sudo -n true 2>/dev/null; then
  SUDO=(sudo -n)
else
  echo "barwright tests: Chromium not found: run 'sudo apt-get install chromium' (or set CHROMIUM_PATH to a Chromium binary), then npm test again" >&2
  exit 1
fi
echo "barwright tests: Chromium not found: installing Debian's chromium package (about a minute)" >&2
"${SUDO[@]}" apt-get update -qq
DEBIAN_FRONTEND=noninteractive "${SUDO[@]}" apt-get install -y -qq chromium >/dev/null
if [ ! -x /usr/bin/chromium ]; then
  echo "barwright tests: apt-get finished but /usr/bin/chromium is not there: install Chromium by hand or set CHROMIUM_PATH" >&2
  exit 1
fi
