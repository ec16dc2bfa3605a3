#!/usr/bin/env bash
# Whole-run benchmark of `bcprep process` against a parse-only baseline (same CSV reader, same file), at three
# file sizes, median of several runs each. Prints a Markdown table to paste into BENCHMARKS.md.
# Usage: RATE=500 benchmarks/whole-run.sh [runs] [hours...]   (defaults: 5 runs; 1 2 4 hours of a 200 Hz day)
# A day shorter than about an hour holds no settled operating point (the first settles at about 49 min).
# SHAPE=wide: the filter benchmark's day instead (tools/SampleDay --wide --pace 2: 17 columns, nine thermocouples,
# 50 Hz hum, dropouts, two operating points an hour; RATE defaults to 1000), timed without filters, with
# mains = "50 Hz", with mains and lowpass_cutoff = "0.5 Hz", and `calibrate --conditioned` with both (CAL=0 leaves the
# last out: it is the slow full-rate chain), each as paired ratios against its own parse-only run; PY=1 adds the
# pandas + scipy script of benchmarks/pandas-scipy (Debian's python3-pandas and python3-scipy) on the 1 h day.
set -euo pipefail
cd "$(dirname "$0")/.."
runs=${1:-5}; shift || true
hours=("${@:-1 2 4}"); read -r -a hours <<< "${hours[*]}"
shape=${SHAPE:-sample}
if [ "$shape" = wide ]; then rate=${RATE:-1000}; else rate=${RATE:-200}; fi
data=${BENCH_DATA:-/tmp/bcprep-bench}
mkdir -p "$data"
# The tool is timed as README ("Large days") installs it for large days: published in Release, self-contained and
# ahead-of-time compiled as one composite image with the runtime, so it neither JITs its start-up code nor the
# generic code shared with the framework and the CSV reader. The baseline is timed in its fastest form, a plain
# Release build: its one hot loop sits in Main, and a ReadyToRun build of it measured 10-20 % slower on the 1 h day.
# The composite publish's intermediate files would be reused by a later framework-dependent publish, which then
# aborts at start, so they are removed before and after.
bin="$data/bin"
rid_obj=src/BcPrep.Cli/obj/Release/net10.0/linux-x64
# PUBLISH=0 reuses the build of an earlier run with the same BENCH_DATA (the publish takes minutes on a loaded machine).
if [ "${PUBLISH:-1}" = 1 ] || [ ! -x "$bin/bcprep/bcprep" ]; then
  rm -rf "$rid_obj"
  dotnet publish src/BcPrep.Cli -c Release -r linux-x64 --self-contained true -p:PublishReadyToRun=true -p:PublishReadyToRunComposite=true \
    -o "$bin/bcprep" -nologo -v q >/dev/null
  rm -rf "$rid_obj"
fi
for p in benchmarks/ParseBaseline tools/SampleDay; do dotnet build -c Release "$p" -nologo -v q >/dev/null; done
cli=$bin/bcprep/bcprep
base=benchmarks/ParseBaseline/bin/Release/net10.0/ParseBaseline
gen=tools/SampleDay/bin/Release/net10.0/SampleDay

# Benchmark days repeat the sample day's cycle of set points, so the rig's pinned windows do not fit them:
# detect every operating point instead (two passes over the log: block means, then the detected windows).
rig="$data/rig-detect.toml"
sed '/^\[\[point\]\]/,/^end = /d' sample-logs/marten-rig.toml > "$rig"

# One timed run: prints "seconds peak_kB"; a run that fails stops the benchmark (a refused day is no timing).
timed() {
  local out
  out=$(/usr/bin/time -f "%e %M" "$@" 2>&1 >/dev/null) || { echo "benchmark run failed: $*" >&2; echo "$out" >&2; exit 1; }
  echo "$out" | tail -1
}
median() { sort -n | awk '{a[NR]=$1} END {print (NR%2) ? a[(NR+1)/2] : (a[NR/2]+a[NR/2+1])/2}'; }

if [ "$shape" = wide ]; then
  base_rig="$data/rig-wide.toml"
  cp "$rig" "$base_rig"
  for l in 1 2 3; do
    printf '\n[[channel]]\nid = "t_l%s"\ncolumn = "TC_L%s_MV"\nmeasures = "other"\nsensor = "thermocouple"\ntype = "K"\nraw_unit = "mV"\ncold_junction = "t_cj"\nuncertainty = [ { kind = "class", class = "1", source = "IEC 60584-1 class 1" } ]\n' "$l" "$l" >> "$base_rig"
  done
  cp "$base_rig" "$data/rig-wide-notch.toml"; printf '\n[conditioning]\nmains = "50 Hz"\n' >> "$data/rig-wide-notch.toml"
  cp "$base_rig" "$data/rig-wide-filters.toml"; printf '\n[conditioning]\nmains = "50 Hz"\nlowpass_cutoff = "0.5 Hz"\n' >> "$data/rig-wide-filters.toml"
  # One pair: parse-only, then the command; prints "ratio_percent seconds peak_kB parse_seconds".
  pair() {
    local r p s k
    r=$(timed "$base" "$file") || exit 1; read -r p _ <<< "$r"
    rm -rf "$dir/out"
    r=$(timed "$@") || exit 1; read -r s k <<< "$r"
    awk -v p="$p" -v s="$s" -v k="$k" 'BEGIN {printf "%.1f %s %s %s\n", 100*p/s, s, k, p}'
  }
  echo "| day | file MB | parse-only s | process, no filters: s, paired ratio, peak MB | process, notch: s, ratio, MB | process, notch + low-pass: s, ratio, MB | calibrate --conditioned: s, ratio, MB | pandas + scipy s (BcPrep notch + low-pass faster by) |"
  echo "|---|---|---|---|---|---|---|---|"
  for h in "${hours[@]}"; do
    dir="$data/wide-${rate}hz-${h}h"
    if [ ! -f "$dir/marten-2026-11-24-am.csv" ]; then
      mkdir -p "$dir"; "$gen" "$dir" 7 --rate "$rate" --hours "$h" --single --pace 2 --wide >/dev/null
    fi
    file="$dir/marten-2026-11-24-am.csv"
    mb=$(awk -v b="$(stat -L -c %s "$file")" 'BEGIN {printf "%.1f", b/1e6}')
    cat "$file" > /dev/null
    declare -A col=()
    kinds=(plain notch filters); [ "${CAL:-1}" = 1 ] && kinds+=(calibrate)
    for _ in $(seq "$runs"); do
      for kind in "${kinds[@]}"; do
        case $kind in
          plain) line=$(pair "$cli" process "$base_rig" "$file" --out "$dir/out" --force) ;;
          notch) line=$(pair "$cli" process "$data/rig-wide-notch.toml" "$file" --out "$dir/out" --force) ;;
          filters) line=$(pair "$cli" process "$data/rig-wide-filters.toml" "$file" --out "$dir/out" --force) ;;
          calibrate) line=$(pair "$cli" calibrate "$data/rig-wide-filters.toml" "$file" --conditioned) ;;
        esac
        col[$kind]+="$line"$'\n'
      done
    done
    cell() {  # median seconds, median paired ratio, median peak MB of one kind
      [ -z "${col[$1]:-}" ] && { echo "not run"; return; }
      local s q k
      s=$(printf '%s' "${col[$1]}" | awk '{print $2}' | median); q=$(printf '%s' "${col[$1]}" | awk '{print $1}' | median)
      k=$(printf '%s' "${col[$1]}" | awk '{print $3}' | median)
      awk -v s="$s" -v q="$q" -v k="$k" 'BEGIN {printf "%.2f, %.0f %%, %.0f", s, q, k/1024}'
    }
    p=$(printf '%s' "${col[plain]}" "${col[notch]}" "${col[filters]}" | awk '{print $4}' | median)
    py="not run"
    if [ "${PY:-0}" = 1 ] && [ "$h" = 1 ]; then
      pt=(); for _ in $(seq "$runs"); do r=$(timed /usr/bin/python3 benchmarks/pandas-scipy/reduce_day.py "$file" "$dir/py.csv") || exit 1; read -r s _ <<< "$r"; pt+=("$s"); done
      ps=$(printf '%s\n' "${pt[@]}" | median); fs=$(printf '%s' "${col[filters]}" | awk '{print $2}' | median)
      py=$(awk -v a="$ps" -v b="$fs" 'BEGIN {printf "%.1f (%.1f×)", a, a/b}')
    fi
    echo "| $h h at $rate Hz, 17 ch | $mb | $p | $(cell plain) | $(cell notch) | $(cell filters) | $(cell calibrate) | $py |"
    unset col
  done
  exit 0
fi

# Each process run follows its own parse-only run, and the ratio of each such pair is kept too: on a shared machine
# whose speed drifts within a minute, the median of the paired ratios is steadier than the ratio of the medians.
echo "| day | file MB | parse-only s (MB/s) | process s (MB/s) | process / parse-only throughput | median of paired ratios | process peak RSS MB |"
echo "|---|---|---|---|---|---|---|"
for h in "${hours[@]}"; do
  dir="$data/${rate}hz-${h}h"
  if [ ! -f "$dir/marten-2026-11-24-am.csv" ]; then
    mkdir -p "$dir"; "$gen" "$dir" 7 --rate "$rate" --hours "$h" --single >/dev/null
  fi
  file="$dir/marten-2026-11-24-am.csv"
  mb=$(awk -v b="$(stat -L -c %s "$file")" 'BEGIN {printf "%.1f", b/1e6}')
  cat "$file" > /dev/null   # page cache: both sides read from memory
  pt=(); ct=(); rss=(); pr=()
  for _ in $(seq "$runs"); do
    result=$(timed "$base" "$file") || exit 1; read -r s _ <<< "$result"; pt+=("$s")
    rm -rf "$dir/out"
    result=$(timed "$cli" process "$rig" "$file" --out "$dir/out" --force) || exit 1; read -r s k <<< "$result"; ct+=("$s"); rss+=("$k")
    pr+=("$(awk -v p="${pt[-1]}" -v c="$s" 'BEGIN {print 100*p/c}')")
  done
  p=$(printf '%s\n' "${pt[@]}" | median); c=$(printf '%s\n' "${ct[@]}" | median); r=$(printf '%s\n' "${rss[@]}" | median)
  q=$(printf '%s\n' "${pr[@]}" | median)
  awk -v h="$h" -v rate="$rate" -v mb="$mb" -v p="$p" -v c="$c" -v r="$r" -v q="$q" 'BEGIN {
    printf "| %s h at %s Hz, 13 ch | %s | %.2f (%.0f) | %.2f (%.0f) | %.0f %% | %.0f %% | %.0f |\n", h, rate, mb, p, mb/p, c, mb/c, 100*p/c, q, r/1024 }'
done
