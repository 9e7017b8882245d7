#!/usr/bin/env bash
# Installs what pmchart needs on a fresh machine, skipping whatever is already there:
#   1. Debian packages for node-canvas (built from source), poppler-utils (PDF checks in tests),
#      chromium (the live page's browser tests, driven by playwright-core) and python3-numpy +
#      python3-matplotlib (the plain plotting script `npm run bench` measures pmchart against)
#   2. npm dependencies (canvas's install script is allowed by name in package.json/.npmrc)
#   3. the TypeScript build in dist/
set -euo pipefail
cd "$(dirname "$0")/.."

APT_PACKAGES=(libcairo2-dev libpango1.0-dev libjpeg-dev libgif-dev librsvg2-dev pkg-config poppler-utils chromium python3-numpy python3-matplotlib)

missing=()
for p in "${APT_PACKAGES[@]}"; do
  dpkg-query -W -f='${Status}' "$p" 2>/dev/null | grep -q "install ok installed" || missing+=("$p")
done
if [ ${#missing[@]} -gt 0 ]; then
  if command -v apt-get >/dev/null 2>&1 && [ "$(id -u)" = "0" ]; then
    echo "setup: installing system packages: ${missing[*]}" >&2
    export DEBIAN_FRONTEND=noninteractive
    apt-get update -qq >&2
    apt-get install -y -qq "${missing[@]}" >&2
  else
    echo "setup: missing system packages: ${missing[*]}" >&2
    echo "setup: run this, then try again:  sudo apt-get update && sudo apt-get install -y ${missing[*]}" >&2
    exit 1
  fi
fi

node_major=$(node -p 'process.versions.node.split(".")[0]')
if [ "$node_major" -lt 20 ]; then
  echo "setup: Node.js 20.19 or newer is needed (found $(node --version))" >&2
  exit 1
fi

stamp=node_modules/.pmchart-install-stamp
if [ ! -f "$stamp" ] || [ package.json -nt "$stamp" ] || [ package-lock.json -nt "$stamp" ] || ! node -e "require('canvas')" >/dev/null 2>&1; then
  echo "setup: installing npm dependencies" >&2
  npm ci --no-audit --no-fund >&2
  touch "$stamp"
fi

echo "setup: building" >&2
npm run --silent build >&2
