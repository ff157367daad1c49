#!/usr/bin/env bash
# The browser suite drives Debian's chromium through playwright-core.
set -euo pipefail
if [ -x /usr/bin/chromium ]; then exit 0; fi
if [ "$(id -u)" -ne 0 ]; then echo "[chromium] /usr/bin/chromium missing and not root: install Debian's chromium package" >&2; exit 1; fi
echo "[chromium] installing Debian's chromium package" >&2
export DEBIAN_FRONTEND=noninteractive
apt-get update -qq >/dev/null
apt-get install -y -qq chromium >/dev/null
