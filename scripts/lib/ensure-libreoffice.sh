#!/usr/bin/env bash
# The calculation-package test recalculates the live-formula sheet with LibreOffice
# headless, so that Excel formulas are checked by a real spreadsheet engine.
set -euo pipefail
if command -v soffice >/dev/null 2>&1; then exit 0; fi
if [ "$(id -u)" -ne 0 ]; then echo "[libreoffice] soffice missing and not root: install Debian's libreoffice-calc package" >&2; exit 1; fi
echo "[libreoffice] installing Debian's libreoffice-calc package" >&2
export DEBIAN_FRONTEND=noninteractive
apt-get update -qq >/dev/null
apt-get install -y -qq --no-install-recommends libreoffice-calc >/dev/null
