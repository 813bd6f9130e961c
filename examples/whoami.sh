#!/usr/bin/env bash
# Prints who a key belongs to and which scopes it carries.
set -euo pipefail
: "${MELTWIRE_KEY:?set MELTWIRE_KEY to an API key (mw_live_…)}"
curl --fail-with-body -sS "${MELTWIRE_URL:-http://localhost:3000}/api/v1/auth/me" \
  -H "Authorization: Bearer ${MELTWIRE_KEY}"
echo
