#!/usr/bin/env bash
# Solve a requirement, save the best feasible candidate as a design, and attach a current recording.
#
#   SENSEWRIGHT_URL=http://localhost:3000 SENSEWRIGHT_TOKEN=swt_… ./examples/solve-save-upload.sh [recording.csv]
#
# Needs curl and jq, and a personal API token with write access (create one on /account) of an
# owner or designer. Without a recording file it uploads a small made-up one.
set -euo pipefail

url="${SENSEWRIGHT_URL:-http://localhost:3000}"
token="${SENSEWRIGHT_TOKEN:?set SENSEWRIGHT_TOKEN to a write token from /account}"
recording="${1:-}"

api() { # METHOD PATH [curl args…]: prints the body; exits with the API's message on a 4xx/5xx
  local method="$1" path="$2"
  shift 2
  local out status
  out="$(mktemp)"
  status="$(curl -sS -o "$out" -w '%{http_code}' -X "$method" -H "Authorization: Bearer $token" "$@" "$url$path")"
  if [ "$status" -ge 400 ]; then
    echo "$method $path → $status: $(jq -r '.message // .' "$out" 2>/dev/null || cat "$out")" >&2
    rm -f "$out"
    exit 1
  fi
  cat "$out"
  rm -f "$out"
}

requirement='{
  "current":  { "min": "1 mA", "max": "100 mA" },
  "supply":   { "voltage": "3.3 V", "side": "low" },
  "drop":     { "max": "100 mV" },
  "readout":  { "kind": "adc", "bits": 12, "fullScale": "2.5 V" },
  "resolution": { "countsAtMin": 10 },
  "calibration": "one-point"
}'

solved="$(api POST /api/solve -H 'content-type: application/json' --data "$requirement")"
echo "$solved" | jq -r '"evaluated \(.evaluated) pairs, \(.feasibleCount) feasible"'
choice="$(echo "$solved" | jq -c 'first(.candidates[] | select(.feasible)) | {shuntOhms, gain}')"
[ -n "$choice" ] || { echo "no feasible candidate for this requirement" >&2; exit 1; }

body="$(jq -n --argjson r "$requirement" --argjson c "$choice" \
  '{name: "Scripted rail monitor", project: "Night rig", requirement: $r, choice: $c}')"
id="$(api POST /api/designs -H 'content-type: application/json' --data "$body" | jq -r .id)"
echo "saved design $id with $choice"

if [ -z "$recording" ]; then
  recording="$(mktemp --suffix=.csv)"
  trap 'rm -f "$recording"' EXIT
  { echo "time (ms),current (mA)"; for t in 0 1 2 3 4 5 6 7 8 9; do echo "$t,$((20 + t * 7))"; done; } >"$recording"
fi
api POST "/api/designs/$id/profiles" -F "file=@$recording;type=text/csv" |
  jq -r '"uploaded \(.samples) samples as profile \(.id)"'
echo "design: $url/designs/$id"
