#!/usr/bin/env bash
# The main job on the bundled demos: set up what is missing, then build the three demo chart-set books (ACI 318-19, EN 1992-1-1, AS 3600-2018).
set -euo pipefail
cd "$(dirname "$0")/.."
bash scripts/setup.sh
node bin/pmchart.js set charts-config/demo.json "$@"
node bin/pmchart.js set charts-config/demo-eu.json "$@"
node bin/pmchart.js set charts-config/demo-au.json "$@"
