#!/usr/bin/env bash
# Cost of `trimline check` of each example aircraft (and of the built-in demo) against the
# bare process start (`trimline --version`): N interleaved runs of each, the median wall
# time of each, and their ratio (issue 15's target: under 3).
#
# Usage: scripts/check-ratio.sh [N] [BINARY]   (defaults: 31, target/release/trimline)
# The section polars are kept in a private cache folder, filled by one run of each file
# before timing (the warm case, as a second `check` of the same file); set COLD=1 to time
# with the cache off instead (every polar computed in every run).
set -euo pipefail
n=${1:-31}
bin=${2:-target/release/trimline}
here=$(cd "$(dirname "$0")/.." && pwd)
cd "$here"
cache=$(mktemp -d)
trap 'rm -rf "$cache"' EXIT
if [[ "${COLD:-0}" == 1 ]]; then
    export TRIMLINE_CACHE_DIR=off
else
    export TRIMLINE_CACHE_DIR="$cache"
fi

cases=("" aircraft/*.toml)
for c in "${cases[@]}"; do
    # shellcheck disable=SC2086
    "$bin" check $c >/dev/null
done

now() { date +%s%N; }
declare -A times
for ((i = 0; i < n; i++)); do
    t0=$(now)
    "$bin" --version >/dev/null
    t1=$(now)
    times[version]+="$((t1 - t0)) "
    for c in "${cases[@]}"; do
        t0=$(now)
        # shellcheck disable=SC2086
        "$bin" check $c >/dev/null
        t1=$(now)
        times["${c:-demo}"]+="$((t1 - t0)) "
    done
done

median() { tr ' ' '\n' | grep -v '^$' | sort -n | awk '{a[NR]=$1} END {print a[int((NR+1)/2)]}'; }
base=$(echo "${times[version]}" | median)
printf '%-36s %10s %7s\n' case "median ms" ratio
printf '%-36s %10.2f %7.2f\n' "--version" "$(echo "$base / 1000000" | bc -l)" 1
for c in "${cases[@]}"; do
    key=${c:-demo}
    m=$(echo "${times[$key]}" | median)
    printf '%-36s %10.2f %7.2f\n' "check ${c:-(demo)}" "$(echo "$m / 1000000" | bc -l)" \
        "$(echo "$m / $base" | bc -l)"
done
echo "runs: $n interleaved; load: $(cut -d' ' -f1-3 /proc/loadavg); cache: ${TRIMLINE_CACHE_DIR}"
