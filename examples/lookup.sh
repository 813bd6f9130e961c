# Sourced by the scripts: resolves an instrument and a method by code to their ids.
# INSTRUMENT_CODE (default OES-1) and METHOD_CODE (default FE-LA) choose them.
api="${MELTWIRE_URL:-http://localhost:3000}/api/v1"
auth=(-H "Authorization: Bearer ${MELTWIRE_KEY}")
id_of() { # id_of <collection> <code>
  curl --fail-with-body -sS -G "$api/$1" "${auth[@]}" --data-urlencode limit=200 \
    | jq -er --arg code "$2" '.data[] | select(.code == $code) | .id' \
    || { echo "no $1 with the code $2" >&2; exit 1; }
}
instrument_id=$(id_of instruments "${INSTRUMENT_CODE:-OES-1}")
method_id=$(id_of methods "${METHOD_CODE:-FE-LA}")
