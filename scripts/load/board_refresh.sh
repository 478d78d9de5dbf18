#!/bin/bash
# The board's refresh as the page makes it: GET /plants/{plant}/overview with gzip and the last answer's
# ETag in If-None-Match, N times, GAP seconds apart. One line per request:
#   status  time-to-first-byte(s)  total(s)  bytes-received
# usage: KEY=kw_... scripts/load/board_refresh.sh [base-url] [plant] [N] [GAP]
set -euo pipefail
BASE=${1:-http://localhost:8080}; PLANT=${2:-brackenmoor}; N=${3:-10}; GAP=${4:-15}
: "${KEY:?set KEY to an API key (read role is enough)}"
HEADERS=$(mktemp); trap 'rm -f "$HEADERS"' EXIT
TAG=""
for i in $(seq 1 "$N"); do
  ARGS=(-H "Authorization: Bearer $KEY" -H "Accept-Encoding: gzip")
  if [ -n "$TAG" ]; then ARGS+=(-H "If-None-Match: $TAG"); fi
  curl -s -D "$HEADERS" -o /dev/null -w "%{http_code} %{time_starttransfer} %{time_total} %{size_download}\n" \
    "${ARGS[@]}" "$BASE/api/v1/plants/$PLANT/overview"
  NEW=$(grep -i '^etag:' "$HEADERS" | sed 's/^[^:]*: *//' | tr -d '\r' || true)
  if [ -n "$NEW" ]; then TAG="$NEW"; fi
  if [ "$i" -lt "$N" ]; then sleep "$GAP"; fi
done
