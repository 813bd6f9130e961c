#!/usr/bin/env bash
# Pages through the audit trail, newest first, following next_cursor until the last page
# (needs the scope audit:read). Prints one line per event; PAGE_SIZE sets the page size.
set -euo pipefail
: "${MELTWIRE_KEY:?set MELTWIRE_KEY to an API key (mw_live_…)}"
base="${MELTWIRE_URL:-http://localhost:3000}/api/v1/audit-events"
cursor=""
pages=0
while :; do
  page=$(curl --fail-with-body -sS -G "$base" \
    -H "Authorization: Bearer ${MELTWIRE_KEY}" \
    --data-urlencode "limit=${PAGE_SIZE:-50}" \
    ${cursor:+--data-urlencode "cursor=$cursor"})
  pages=$((pages + 1))
  jq -r '.data[] | "\(.occurred_at)  \(.action)  \(.target.type) \(.target.id // "-")  by \(.actor.label)"' <<<"$page"
  cursor=$(jq -r '.next_cursor // empty' <<<"$page")
  [ -n "$cursor" ] || break
done
echo "pages: $pages" >&2
