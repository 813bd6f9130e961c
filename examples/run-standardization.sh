#!/usr/bin/env bash
# Runs a two-point standardization (needs standardizations:write, standardizations:read and
# samples:read) from the high and low reference materials of a method and prints each element's
# correction with its flag. The burns here are simulated from the certified values with a drift factor — in real
# use they are what the instrument measured on the references. The run is stored as a draft:
# a manager activates it in the console (or POST /standardizations/{id}/activate).
#   HIGH_CODE=KB-FE-HI LOW_CODE=KB-FE-LO DRIFT=1.03 ./run-standardization.sh
set -euo pipefail
: "${MELTWIRE_KEY:?set MELTWIRE_KEY to an API key (mw_live_…)}"
source "$(dirname "$0")/lookup.sh"
drift="${DRIFT:-1.03}"
materials=$(curl --fail-with-body -sS -G "$api/reference-materials" "${auth[@]}" --data-urlencode limit=200)
# Three burns per reference: the certified value × DRIFT, ±0.2 % from burn to burn.
burns_of() {
  jq -e --arg code "$1" --argjson drift "$drift" '
    .data[] | select(.code == $code) | . as $m | {
      reference_material_id: $m.id,
      burns: [0.998, 1.0, 1.002] | map(. as $s | { values: ($m.values | map({ (.element): ((((.nominal | tonumber) * $drift * $s) * 100000 | round) / 100000) }) | add) })
    }' <<<"$materials" || { echo "no reference material with the code $1" >&2; exit 1; }
}
body=$(jq -n --arg method "$method_id" --argjson high "$(burns_of "${HIGH_CODE:-KB-FE-HI}")" --argjson low "$(burns_of "${LOW_CODE:-KB-FE-LO}")" \
  '{ method_id: $method, mode: "two_point", measurements: [$high, $low] }')
run=$(curl --fail-with-body -sS "$api/instruments/$instrument_id/standardizations" "${auth[@]}" \
  -H 'Content-Type: application/json' -H "Idempotency-Key: std-$(date +%s%N)" --data "$body")
jq -r '"run \(.id) (\(.status)): overall \(.flag)",
  (.corrections[] | "\(.element)  slope \(.slope // "-")  offset \(.offset // "-")  \(.flag)\(if (.reasons | length) > 0 then "  — " + (.reasons | join("; ")) else "" end)")' <<<"$run"
