#!/usr/bin/env bash
# Cost of `trimline check` of each example aircraft (and of the built-in demo) against the
# bare process start (`trimline --version`): N interleaved runs of each, the median wall
# time of each, and their ratio (issue 15's target: under 3).
#
# Usage: scripts/check-ratio.sh [N] [BINARY...]   (defaults: 31, target/release/trimline)
# With several binaries (an older build to compare, say) their runs are interleaved too, so
# that they see the same load. Each binary keeps its section polars and figures in a private
# cache folder, filled by one run of each file before timing (the warm case, as a second
# `check` of the same file); set COLD=1 to time with the cache off (all computed every run).
set -euo pipefail
n=${1:-31}
shift || true
bins=("$@")
[[ ${#bins[@]} -eq 0 ]] && bins=(target/release/trimline)
cd "$(dirname "$0")/.."
scratch=$(mktemp -d)
trap 'rm -rf "$scratch"' EXIT

cases=("" aircraft/*.toml)
cache_of() { if [[ "${COLD:-0}" == 1 ]]; then echo off; else echo "$scratch/cache-$1"; fi; }
for b in "${!bins[@]}"; do
    for c in "${cases[@]}"; do
        # shellcheck disable=SC2086
        TRIMLINE_CACHE_DIR=$(cache_of "$b") "${bins[$b]}" check $c >/dev/null || true
    done
done

now() { date +%s%N; }
declare -A times
for ((i = 0; i < n; i++)); do
    for b in "${!bins[@]}"; do
        export TRIMLINE_CACHE_DIR
        TRIMLINE_CACHE_DIR=$(cache_of "$b")
        t0=$(now)
        "${bins[$b]}" --version >/dev/null
        t1=$(now)
        times[$b,version]+="$((t1 - t0)) "
        for c in "${cases[@]}"; do
            t0=$(now)
            # shellcheck disable=SC2086
            "${bins[$b]}" check $c >/dev/null || true
            t1=$(now)
            times[$b,${c:-demo}]+="$((t1 - t0)) "
        done
    done
done

median() { tr ' ' '\n' | grep -v '^$' | sort -n | awk '{a[NR]=$1} END {print a[int((NR+1)/2)]}'; }
ms() { echo "$1 / 1000000" | bc -l; }
for b in "${!bins[@]}"; do
    base=$(echo "${times[$b,version]}" | median)
    echo "${bins[$b]}"
    printf '  %-36s %10s %7s\n' case "median ms" ratio
    printf '  %-36s %10.2f %7.2f\n' "--version" "$(ms "$base")" 1
    for c in "${cases[@]}"; do
        m=$(echo "${times[$b,${c:-demo}]}" | median)
        printf '  %-36s %10.2f %7.2f\n' "check ${c:-(demo)}" "$(ms "$m")" "$(echo "$m / $base" | bc -l)"
    done
done
echo "runs: $n interleaved; load at the end: $(cut -d' ' -f1-3 /proc/loadavg); cache: $([[ "${COLD:-0}" == 1 ]] && echo off || echo warm)"
