#!/usr/bin/env bash
# The one test command (README and .ci/run): set up what is missing, type-check, run every test.
set -euo pipefail
cd "$(dirname "$0")/.."
bash scripts/setup.sh
npx tsc -p tsconfig.json --noEmit
npx vitest run
