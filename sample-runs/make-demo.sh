#!/bin/sh
# Regenerates the demo archive: fifteen shelf-panel runs on the simulated frame, each recorded
# with the calibration made on the simulator's dead weights. Run from the repository root after
# 'mvn -q -DskipTests package'; writes into the folder given (default sample-runs).
set -e
out=${1:-sample-runs}
cal=calibration/shelf-rig-1kN-2026-12-03.json
for core in foam balsa board; do
  for i in 1 2 3 4 5; do
    seed=$((7 * i + ${#core}))
    java -jar target/loadstone.jar record --port sim --scenario panel-$core --seed $seed \
      --rate-hz 80 --sim-speed 50 --cal $cal --specimen $core-0$i --group $core \
      --tag shelf-panel --operator workshop --archive "$out"
  done
done
