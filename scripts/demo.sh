#!/usr/bin/env bash
# The main job on the bundled demos: set up what is missing, then build the three demo chart-set books (ACI 318-19, EN 1992-1-1, AS 3600-2018)
# the schedule check of the invented Haldane Street Offices (out/demo-schedule.pdf),
# and the live chart page preset to the invented column C-14 with its load combinations (out/column-charts.html).
set -euo pipefail
cd "$(dirname "$0")/.."
bash scripts/setup.sh
node bin/pmchart.js set charts-config/demo.json "$@"
node bin/pmchart.js set charts-config/demo-eu.json "$@"
node bin/pmchart.js set charts-config/demo-au.json "$@"
node bin/pmchart.js page --out out/column-charts.html --units si --fc 32MPa --fy 420MPa --gamma 0.72 \
  --arrangement four-faces --bars-per-face 5 --b 450 --h 450 --loads charts-config/c14-loads.csv --date 2026-03-02
# a whole building's columns from an (invented) analysis export: compression negative, export headers mapped to ours;
# exit status 1 is expected (the demo schedule has failing marks on purpose)
node bin/pmchart.js schedule charts-config/demo-schedule.csv --loads charts-config/demo-schedule-loads.csv \
  --columns "mark=Member,id=Level+Combination,Pu=Axial N,Mu=Moment Major,Muy=Moment Minor" --compression negative \
  --report out/demo-schedule.pdf --project "Haldane Street Offices" --office "Quarry Lane Structural" --date 2026-03-02 \
  > out/demo-schedule.txt || test $? -eq 1
