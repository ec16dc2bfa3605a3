#!/usr/bin/env bash
# The coverage scorecard (BENCHMARKS.md "Coverage scorecard"): the detection scorecard's generated days
# (tools/DetectionScorecard), each run DRAWS times with calibration errors drawn from the rig file's stated
# distributions, `bcprep process` with default detection, and every written value ± U (window mean ± 2u_A for
# Type A) compared with the generator's truth. Prints the card as Markdown on standard output (one line per run on
# standard error).
#   benchmarks/coverage-scorecard.sh [DAYS] [FIRST_SEED] [DRAWS] [--monte-carlo] [--no-drift] [--card FILE]
set -euo pipefail
cd "$(dirname "$0")/.."
days="${1:-50}"
first="${2:-1}"
draws="${3:-4}"
shift $(( $# < 3 ? $# : 3 ))
dotnet build tools/DetectionScorecard -c Release -nologo -v q >&2
dotnet tools/DetectionScorecard/bin/Release/net10.0/DetectionScorecard.dll coverage --days "$days" --first-seed "$first" --draws "$draws" "$@"
