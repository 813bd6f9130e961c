#!/usr/bin/env bash
# Lists the API keys you can see (needs the scope api-keys:read): one line per key.
# Secrets are never shown again after a key is issued; the prefix tells keys apart.
set -euo pipefail
: "${MELTWIRE_KEY:?set MELTWIRE_KEY to an API key (mw_live_…)}"
curl --fail-with-body -sS "${MELTWIRE_URL:-http://localhost:3000}/api/v1/api-keys?limit=200" \
  -H "Authorization: Bearer ${MELTWIRE_KEY}" \
  | jq -r '.data[] | "\(.prefix)…  \(.status)  \(.name)  [\(.scopes | join(","))]"'
