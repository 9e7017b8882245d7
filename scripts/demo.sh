#!/usr/bin/env bash
# The main job on the bundled demo: set up what is missing, then build the demo chart-set book.
set -euo pipefail
cd "$(dirname "$0")/.."
bash scripts/setup.sh
node bin/pmchart.js set charts-config/demo.json "$@"
