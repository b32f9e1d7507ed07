#!/bin/sh
# compare over a large archive from its index, side by side with the same command over a small
# one: builds archives of SMALL and LARGE runs (ArchiveFill), times the first compare of each
# (the indexing pass: every run read, analysed and its figures kept), then alternates
# `compare` over the two archives ROUNDS times with -Xmx256m and prints min/median/max of each
# and of their ratio. Usage: sh src/bench/compare-scale.sh [WORK_DIR] [LARGE] [SMALL] [ROUNDS]
# after `mvn -q -DskipTests package` and with the bench classes compiled (see DEVELOPERS.md).
set -eu
work=${1:-/tmp/loadstone-compare-scale}
large=${2:-10000}
small=${3:-10}
rounds=${4:-7}
jar=${LOADSTONE_JAR:-target/loadstone.jar}
bench=${BENCH_CLASSES:-target/bench-classes}
cmp() { java -Xmx256m -jar "$jar" compare --archive "$1" --metric peak >/dev/null; }
now() { date +%s%N; }
for n in "$small" "$large"; do
  if [ ! -d "$work/runs-$n" ]; then
    t=$(now)
    java -cp "$jar:$bench" org.loadstone.bench.ArchiveFill "$work/runs-$n" "$n"
    echo "filled $n runs in $(( ($(now) - t) / 1000000 )) ms"
  fi
  rm -f "$work/runs-$n"/.loadstone-index.sqlite*
  t=$(now)
  cmp "$work/runs-$n"
  ms=$(( ($(now) - t) / 1000000 ))
  echo "first compare (indexing pass) over $n runs: $ms ms, $(( ms * 1000 / n )) µs a run"
done
: > "$work/times"
i=0
while [ $i -lt "$rounds" ]; do
  t=$(now); cmp "$work/runs-$large"; a=$(( ($(now) - t) / 1000000 ))
  t=$(now); cmp "$work/runs-$small"; b=$(( ($(now) - t) / 1000000 ))
  echo "$a $b" >> "$work/times"
  i=$((i + 1))
done
awk -v L="$large" -v S="$small" '
  { a[NR] = $1; b[NR] = $2; r[NR] = $1 / $2 }
  function stats(v, n,   i, j, t) {
    for (i = 1; i <= n; i++) for (j = i + 1; j <= n; j++) if (v[j] < v[i]) { t = v[i]; v[i] = v[j]; v[j] = t }
    return sprintf("%.3g / %.3g / %.3g", v[1], v[int((n + 1) / 2)], v[n])
  }
  END {
    n = NR
    print "compare over " L " runs, ms (min / median / max): " stats(a, n)
    print "compare over " S " runs, ms: " stats(b, n)
    print "ratio, pair by pair: " stats(r, n)
  }' "$work/times"
