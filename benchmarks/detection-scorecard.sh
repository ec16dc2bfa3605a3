#!/usr/bin/env bash
# The detection scorecard (BENCHMARKS.md "Detection scorecard"): generates DAYS varied test days with known truth
# (tools/DetectionScorecard), runs `bcprep process` with the rig's settings on each, and prints the scorecard as a
# Markdown table on standard output (one line per day on standard error).
#   benchmarks/detection-scorecard.sh [DAYS] [FIRST_SEED] [STEADY] [--filters]
# STEADY: "defaults" (no [steady] table: what a new user gets) or "hand" (the sample rig's hand-written limits).
# --filters: with mains = "50 Hz" and lowpass_cutoff = "0.5 Hz", so detection runs on the filtered series.
set -euo pipefail
cd "$(dirname "$0")/.."
days="${1:-50}"
first="${2:-1}"
steady="${3:-defaults}"
dotnet build tools/DetectionScorecard -c Release -nologo -v q >&2
dotnet tools/DetectionScorecard/bin/Release/net10.0/DetectionScorecard.dll --days "$days" --first-seed "$first" --steady "$steady" ${4:+"$4"}
