#!/usr/bin/env bash
# Uploads an instrument result file (needs imports:write and samples:read) and prints the import
# report. Uploading the same bytes again returns the first import (HTTP 200) and creates nothing.
#   ./upload-results.sh results.csv           IMPORT_MODE=per_sample ./upload-results.sh results.csv
set -euo pipefail
: "${MELTWIRE_KEY:?set MELTWIRE_KEY to an API key (mw_live_…)}"
file="${1:?usage: upload-results.sh <file>}"
source "$(dirname "$0")/lookup.sh"
response=$(mktemp)
trap 'rm -f "$response"' EXIT
status=$(curl -sS -o "$response" -w '%{http_code}' "$api/imports" "${auth[@]}" \
  -F "file=@${file}" -F "instrument_id=$instrument_id" -F "method_id=$method_id" -F "mode=${IMPORT_MODE:-all_or_nothing}")
case "$status" in
  201) echo "imported as $(jq -r .id "$response")" ;;
  200) echo "already imported as $(jq -r .id "$response") (same bytes): nothing created" ;;
  *)
    jq -r '"\(.status) \(.title): \(.detail)", (.errors // [] | .[] | "  \(.location): \(.message)")' "$response" >&2
    exit 1 ;;
esac
jq -r '.report | "samples: \(.counts.samples_created) created, \(.counts.samples_rejected) rejected; burns: \(.counts.burns); values: \(.counts.values)",
  (.rejected[] | "rejected line \(.line) \(.column // ""): \(.message)")' "$response"
