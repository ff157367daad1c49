#!/usr/bin/env bash
# The load balancer of `npm run bench -- --servers 2` and the two-server browser test: Debian's nginx.
set -euo pipefail
if [ -x /usr/sbin/nginx ]; then exit 0; fi
if [ "$(id -u)" -ne 0 ]; then echo "[nginx] /usr/sbin/nginx missing and not root: install Debian's nginx package" >&2; exit 1; fi
echo "[nginx] installing Debian's nginx package" >&2
export DEBIAN_FRONTEND=noninteractive
apt-get update -qq >/dev/null
apt-get install -y -qq nginx >/dev/null
# The package's own service is not used (the scripts start nginx with their own config).
if command -v systemctl >/dev/null 2>&1; then systemctl disable --now nginx >/dev/null 2>&1 || true; fi
