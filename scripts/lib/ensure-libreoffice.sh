#!/usr/bin/env bash
# The calculation-package tests recalculate the live-formula sheet with LibreOffice
# headless, so that Excel formulas are checked by a real spreadsheet engine, and print the
# workbook to PDF with it; poppler-utils (pdfinfo, pdftotext) read the pages back.
set -euo pipefail
missing=()
command -v soffice >/dev/null 2>&1 || missing+=(libreoffice-calc)
command -v pdftotext >/dev/null 2>&1 || missing+=(poppler-utils)
if [ ${#missing[@]} -eq 0 ]; then exit 0; fi
if [ "$(id -u)" -ne 0 ]; then echo "[libreoffice] missing and not root: install Debian's ${missing[*]}" >&2; exit 1; fi
echo "[libreoffice] installing Debian's ${missing[*]}" >&2
export DEBIAN_FRONTEND=noninteractive
apt-get update -qq >/dev/null
apt-get install -y -qq --no-install-recommends "${missing[@]}" >/dev/null
