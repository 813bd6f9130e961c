#!/usr/bin/env bash
# Pushes one sample with three burns as JSON (needs samples:write and samples:read), retry-safe
# thanks to an Idempotency-Key, and prints the reported results.
#   SAMPLE_CODE=K24-0412-F2 HEAT=K24-0412 ./push-sample.sh
set -euo pipefail
: "${MELTWIRE_KEY:?set MELTWIRE_KEY to an API key (mw_live_…)}"
source "$(dirname "$0")/lookup.sh"
body=$(jq -n --arg code "${SAMPLE_CODE:-K24-0412-F2}" --arg heat "${HEAT:-K24-0412}" \
  --arg instrument "$instrument_id" --arg method "$method_id" '{
  sample_code: $code, heat: $heat, grade: "SAE 1045", kind: "final",
  instrument_id: $instrument, method_id: $method, unit: "%",
  burns: [
    { values: { C: 0.452, Si: 0.24, Mn: 0.74, P: 0.012, S: "<0.002" } },
    { values: { C: 0.449, Si: 0.25, Mn: 0.75, P: 0.011, S: "<0.002" } },
    { values: { C: 0.455, Si: 0.24, Mn: 0.75, P: 0.012, S: 0.003 } }
  ] }')
# One key per logical write: a retry with the same key cannot store the sample twice.
key="${IDEMPOTENCY_KEY:-push-$(date +%s%N)}"
sample=$(curl --fail-with-body -sS "$api/samples" "${auth[@]}" \
  -H 'Content-Type: application/json' -H "Idempotency-Key: $key" --data "$body")
jq -r '"sample \(.id) \(.sample_code) (\(.status))", (.results[] | "\(.element) \(if .reported == null then "(not reported)" else "\(.qualifier // "")\(.reported) \(.unit)" end)  n=\(.n)  flags=\(.flags | join(","))")' <<<"$sample"
