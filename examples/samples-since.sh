#!/usr/bin/env bash
# Pages through every sample changed since a time (needs samples:read), oldest change first,
# then prints the value to pass next time. A plant system can run this on a schedule.
#   ./samples-since.sh 2026-12-01T00:00:00Z
set -euo pipefail
: "${MELTWIRE_KEY:?set MELTWIRE_KEY to an API key (mw_live_…)}"
since="${1:-$(date -u -d '1 day ago' +%Y-%m-%dT%H:%M:%SZ)}"
api="${MELTWIRE_URL:-http://localhost:3000}/api/v1"
cursor=""
last="$since"
while :; do
  page=$(curl --fail-with-body -sS -G "$api/samples" -H "Authorization: Bearer ${MELTWIRE_KEY}" \
    --data-urlencode "updated_since=$since" --data-urlencode "limit=${PAGE_SIZE:-100}" \
    ${cursor:+--data-urlencode "cursor=$cursor"})
  jq -r '.data[] | "\(.updated_at)  \(.sample_code)  \(.heat // "-")  \(.status)  \(.flags | join(","))"' <<<"$page"
  last=$(jq -r --arg last "$last" '(.data | last | .updated_at) // $last' <<<"$page")
  cursor=$(jq -r '.next_cursor // empty' <<<"$page")
  [ -n "$cursor" ] || break
done
echo "next time: updated_since=$last" >&2
