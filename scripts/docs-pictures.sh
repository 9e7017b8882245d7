#!/usr/bin/env bash
# Regenerates the README's check-report pictures (docs/check-report-*.png) from the invented C-14 and C7
# scenarios, after `npm run build`. Needs pdftoppm (poppler-utils, installed by scripts/setup.sh).
set -euo pipefail
cd "$(dirname "$0")/.."
tmp=$(mktemp -d)
trap 'rm -rf "$tmp"' EXIT
# exit 1 only says a load does not pass: the picture is still wanted
node bin/pmchart.js check --units si --fc 32 --fy 420 --b 450 --h 450 --cover 40 --tie 10 --bar 25 \
  --arrangement four-faces --aggregate 20 --loads charts-config/c14-loads.csv --report "$tmp/c14.pdf" \
  --office "Orrin & Vale Structures (invented)" --project "Brackenridge Library annex, column C-14 (invented)" \
  --date 2026-03-02 >/dev/null || [ $? -eq 1 ]
node bin/pmchart.js check --fc 5 --fy 60 --b 18 --h 22 --arrangement four-faces --bars-per-face 4 --bar '#9' \
  --gamma 0.75 --loads charts-config/c7-loads.csv --klu 18ft --klu-y 13ft --beta-dns 0.55 --proposals 0 --report "$tmp/c7.pdf" \
  --office "Ferrand & Oake Structural Studio (invented)" --project "Larkspur Lane Offices, column C7 (invented)" \
  --date 2026-03-01 >/dev/null || [ $? -eq 1 ]
pdftoppm -png -r 110 -singlefile "$tmp/c14.pdf" docs/check-report-sample
pdftoppm -png -r 110 -singlefile "$tmp/c7.pdf" docs/check-report-biaxial-sample
echo "docs/check-report-sample.png docs/check-report-biaxial-sample.png"
# The README's biaxial sheet picture: the first biaxial sheet of the demo set (sheet 13), from its book at 60 dpi.
node bin/pmchart.js set charts-config/demo.json --out "$tmp" --no-progress >/dev/null
book="$tmp/quarry-lane-market-hall/book.pdf"
pages=$(pdfinfo "$book" | awk '/^Pages:/ {print $2}')
# sheets follow the cover and index pages: page = pages − sheets + the sheet's position
sheets=$(ls "$tmp/quarry-lane-market-hall/tables" | grep -c '\.json$')
first=$(ls "$tmp/quarry-lane-market-hall/tables" | grep '\.json$' | grep -n biaxial | head -1 | cut -d: -f1)
pdftoppm -png -r 60 -singlefile -f $((pages - sheets + first)) -l $((pages - sheets + first)) "$book" docs/sheet-biaxial-sample
echo "docs/sheet-biaxial-sample.png"
