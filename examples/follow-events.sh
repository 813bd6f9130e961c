#!/usr/bin/env bash
# Follows the change feed (needs events:read) from the cursor saved by the last run, prints each
# event, and saves the new cursor: run it on a schedule, or with FOLLOW_SECONDS=5 to keep polling.
# Each event is printed once across runs; none is skipped. TYPES=sample.created,import.failed filters.
#   CURSOR_FILE=./meltwire.cursor ./follow-events.sh
set -euo pipefail
: "${MELTWIRE_KEY:?set MELTWIRE_KEY to an API key (mw_live_…)}"
api="${MELTWIRE_URL:-http://localhost:3000}/api/v1"
cursor_file="${CURSOR_FILE:-./meltwire.cursor}"
cursor=$(cat "$cursor_file" 2>/dev/null || true)
while :; do
  page=$(curl --fail-with-body -sS -G "$api/events" -H "Authorization: Bearer ${MELTWIRE_KEY}" \
    --data-urlencode "limit=${PAGE_SIZE:-100}" ${TYPES:+--data-urlencode "types=$TYPES"} \
    ${cursor:+--data-urlencode "after=$cursor"})
  jq -r '.data[] | "\(.sequence)  \(.occurred_at)  \(.type)  \(.id)  \(.data.sample_code // .data.file.name // .data.standardization.id // "")"' <<<"$page"
  cursor=$(jq -r '.next_cursor // empty' <<<"$page")
  # Saved after the events are handled: a run that dies prints them again rather than losing them.
  [ -z "$cursor" ] || printf '%s' "$cursor" >"$cursor_file"
  [ "$(jq -r '.has_more' <<<"$page")" = true ] && continue
  [ -n "${FOLLOW_SECONDS:-}" ] || break
  sleep "$FOLLOW_SECONDS"
done
