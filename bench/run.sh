#!/usr/bin/env bash
# Runs the benchmark suite and writes bench/results/<profile>.md (plus the raw JMH JSON).
#   bench/run.sh quick   # under 5 minutes on 2 cores: 1 fork per prediction cell, 3 training runs
#   bench/run.sh full    # 3 forks per prediction cell, 5 training runs, depths 8 and 14 (~45 min)
# Builds bench/target/benchmarks.jar first unless SKIP_BUILD=1. Not part of CI.
set -euo pipefail
cd "$(dirname "$0")/.."

profile=${1:-quick}
case "$profile" in
  quick)
    train_forks=3; j48_forks=1; depths=14
    predict=()  # the annotations' settings
    predict_text="1 fork per cell, warm-up 2 × 0.5 s (generated classes 6 × 1 s),"
    predict_text+=" measurement 3 × 0.5 s"
    ;;
  full)
    train_forks=5; j48_forks=3; depths=8,14
    predict=(-f 3 -wi 10 -w 1s -i 5 -r 1s)
    predict_text="3 forks per cell, warm-up 10 × 1 s, measurement 5 × 1 s"
    ;;
  *) echo "usage: bench/run.sh [quick|full]" >&2; exit 2 ;;
esac

jar=bench/target/benchmarks.jar
if [[ "${SKIP_BUILD:-0}" != 1 ]]; then
  mvn -B -q -pl bench -am package -DskipTests
fi
out=bench/results
mkdir -p "$out" bench/target
# Weka models trained once are kept here for the other JVMs (see BenchStore).
store="-Dsplitwright.bench.store=bench/target/bench-store"
load_start=$(cut -d' ' -f1-3 /proc/loadavg)
started=$(date +%s)

# Training first: its J48 run also stores the model the prediction forks then load.
java -jar "$jar" 'TrainingBenchmark\.(splitwright|splitwrightLarge|wekaRepTree)$' \
  -f "$train_forks" -p depth="$depths" -jvmArgsPrepend "$store" \
  -prof dev.splitwright.bench.PeakHeapProfiler -prof gc \
  -rf json -rff "$out/$profile-training.json"
java -jar "$jar" 'TrainingBenchmark\.wekaJ48$' \
  -f "$j48_forks" -p depth=14 -jvmArgsPrepend "$store" \
  -prof dev.splitwright.bench.PeakHeapProfiler -prof gc \
  -rf json -rff "$out/$profile-j48.json"
java -jar "$jar" 'PredictionBenchmark|EnsembleBenchmark' "${predict[@]}" -jvmArgsPrepend "$store" \
  -rf json -rff "$out/$profile-prediction.json"
java "$store" -cp "$jar" dev.splitwright.bench.ModelSummary "bench/target/$profile-models.md"

settings="prediction: $predict_text; training: JMH single-shot, one cold run per fresh JVM"
settings+=" (-Xmx2g), $train_forks runs each ($j48_forks for J48), median reported; peak heap"
settings+=" by PeakHeapProfiler (heap in use before each GC), allocation by JMH -prof gc;"
settings+=" whole run $(( $(date +%s) - started )) s"
java -cp "$jar" dev.splitwright.bench.ResultTable --profile "$profile" \
  --out "$out/$profile.md" --load-start "$load_start" --settings "$settings" \
  --models "bench/target/$profile-models.md" \
  "$out/$profile-training.json" "$out/$profile-j48.json" "$out/$profile-prediction.json"
echo "wrote $out/$profile.md"
