#!/usr/bin/env bash
# Load measurements of the EventReview HTTP API on loopback (figures go in the README's performance section).
#
#   benchmarks/load/run.sh writes [SECONDS]          32 clients with tokens: open cases, add notes and attachments (SQLite, WAL)
#   benchmarks/load/run.sh writes-postgres [SECONDS] the same against a throwaway PostgreSQL server
#   benchmarks/load/run.sh reads                     10,000 cases and one case of 40 items x 500 evidence: time the reads
#   benchmarks/load/run.sh soak                      the write load for 10 minutes, sampling the server's memory
#
# Each run starts the Release build of the app in Production on a fresh data folder under /tmp, creates its
# accounts and tokens with the command-line tool, drives it with benchmarks/EventReview.Load and stops it. The write
# modes then drive the same server with wrk (Debian package; benchmarks/load/notes.lua) on 32 fresh cases, check that
# the timelines hold every acknowledged note, stop the server and run `eventreview verify` over every case.
# Results are printed and written to benchmarks/load/results/. Run it on a quiet machine.
# EVENTREVIEW_LOAD_PORT (5300) and EVENTREVIEW_LOAD_PG_PORT (55499) choose the app's and PostgreSQL's ports.
set -euo pipefail
cd "$(dirname "$0")/../.."
ROOT="$(pwd)"
MODE="${1:-writes}"
SECONDS_ARG="${2:-60}"
PORT="${EVENTREVIEW_LOAD_PORT:-5300}"
PG_PORT="${EVENTREVIEW_LOAD_PG_PORT:-55499}"
URL="http://127.0.0.1:$PORT"
OUT="$ROOT/benchmarks/load/results"
mkdir -p "$OUT"

echo "Building (Release)..."
dotnet build -c Release src/EventReview.Web -v q -nologo >/dev/null
dotnet build -c Release src/EventReview.Cli -v q -nologo >/dev/null
dotnet build -c Release benchmarks/EventReview.Load -v q -nologo >/dev/null
WEB="$ROOT/src/EventReview.Web/bin/Release/net10.0/EventReview.Web.dll"
CLI=(dotnet "$ROOT/src/EventReview.Cli/bin/Release/net10.0/eventreview.dll")
LOAD=(dotnet "$ROOT/benchmarks/EventReview.Load/bin/Release/net10.0/eventreview-load.dll")

WORK="$(mktemp -d /tmp/eventreview-load.XXXXXX)"
chmod 755 "$WORK"   # the PostgreSQL server runs as its own user and must reach its folder
DATA="$WORK/data"
CHECKLISTS="$WORK/checklists"
mkdir -p "$DATA" "$CHECKLISTS"
cp "$ROOT"/checklists/*.yaml "$ROOT"/benchmarks/load/checklists/*.yaml "$CHECKLISTS/"
DBARGS=(--data "$DATA")
SERVER_ENV=()
PG_PID_DIR=""

cleanup() {
  [ -n "${SERVER_PID:-}" ] && kill "$SERVER_PID" 2>/dev/null && wait "$SERVER_PID" 2>/dev/null || true
  if [ -n "$PG_PID_DIR" ]; then "${RUNAS[@]}" "$PGBIN/pg_ctl" -D "$PG_PID_DIR/data" -m fast stop >/dev/null 2>&1 || true; fi
  rm -rf "$WORK"
}
trap cleanup EXIT

if [ "$MODE" = "writes-postgres" ]; then
  PGBIN="$(ls -d /usr/lib/postgresql/*/bin | sort -V | tail -1)"
  PG_PID_DIR="$WORK/pg"
  mkdir -p "$PG_PID_DIR"
  RUNAS=()
  if [ "$(id -u)" -eq 0 ]; then chown -R postgres "$PG_PID_DIR"; RUNAS=(runuser -u postgres --); fi
  "${RUNAS[@]}" "$PGBIN/initdb" -D "$PG_PID_DIR/data" -A trust -U postgres >/dev/null
  # Durable settings (fsync and synchronous_commit on, the defaults): the figures are for a real server.
  "${RUNAS[@]}" "$PGBIN/pg_ctl" -D "$PG_PID_DIR/data" -o "-p $PG_PORT -k $PG_PID_DIR -c listen_addresses=127.0.0.1 -c max_connections=200" -l "$PG_PID_DIR/log" -w start >/dev/null
  CONN="Host=127.0.0.1;Port=$PG_PORT;Username=postgres;Database=postgres;Maximum Pool Size=100"
  DBARGS=(--data "$DATA" --provider Postgres --connection "$CONN") # the record key folder lives in the data folder for the CLI and the server alike
  SERVER_ENV=(Database__Provider=Postgres "ConnectionStrings__Default=$CONN")
fi

echo "Accounts and tokens..."
"${CLI[@]}" users add --email load.coordinator@example.invalid --role coordinator --name "Load Coordinator" "${DBARGS[@]}" >/dev/null
: > "$WORK/tokens.txt"
for i in $(seq -w 1 32); do
  "${CLI[@]}" tokens create --name "load-$i" --scope cases:read,cases:open,evidence:add --expires-in-days 1 "${DBARGS[@]}" --json | sed -E 's/.*"token": *"([^"]+)".*/\1/' | grep '^ert_' >> "$WORK/tokens.txt"
done
[ "$(wc -l < "$WORK/tokens.txt")" -eq 32 ] || { echo "token creation failed"; exit 1; }

echo "Starting the server on $URL ($MODE)..."
env ASPNETCORE_ENVIRONMENT=Production ASPNETCORE_URLS="$URL" \
  EventReview__DataDirectory="$DATA" EventReview__SeedDemo=false EventReview__ChecklistDirectory="$CHECKLISTS" \
  "${SERVER_ENV[@]}" dotnet "$WEB" > "$WORK/server.log" 2>&1 &
SERVER_PID=$!
for _ in $(seq 1 240); do
  curl -fsS "$URL/healthz" >/dev/null 2>&1 && break
  kill -0 "$SERVER_PID" 2>/dev/null || { echo "server exited:"; tail -20 "$WORK/server.log"; exit 1; }
  sleep 0.5
done
curl -fsS "$URL/healthz" >/dev/null || { echo "server did not become healthy"; tail -20 "$WORK/server.log"; exit 1; }

STAMP="$(date -u +%Y%m%dT%H%M%SZ)"
echo "machine: $(nproc) cores, $(uname -r), load average $(cut -d' ' -f1-3 /proc/loadavg)"
case "$MODE" in
  writes|writes-postgres)
    "${LOAD[@]}" writes --url "$URL" --tokens "$WORK/tokens.txt" --clients 32 --seconds "$SECONDS_ARG" --warmup 30 \
      --server-pid "$SERVER_PID" --json "$OUT/$MODE-$STAMP.json" ;;
  soak)
    "${LOAD[@]}" writes --url "$URL" --tokens "$WORK/tokens.txt" --clients 32 --seconds 600 --warmup 30 \
      --server-pid "$SERVER_PID" --json "$OUT/soak-$STAMP.json" ;;
  reads)
    "${LOAD[@]}" reads --url "$URL" --tokens "$WORK/tokens.txt" --cases 10000 --evidence-per-item 500 \
      --json "$OUT/reads-$STAMP.json" ;;
  *) echo "unknown mode '$MODE' (writes, writes-postgres, reads, soak)"; exit 2 ;;
esac

if [[ "$MODE" == writes* ]]; then
  # The same load from an outside tool in the same session: wrk posts notes to 32 fresh cases, one token each.
  if command -v wrk >/dev/null; then
    : > "$WORK/targets.txt"
    i=0
    while read -r token; do
      i=$((i + 1))
      curl -fsS -X POST "$URL/api/cases" -H "Authorization: Bearer $token" -H 'Content-Type: application/json' \
        -d "{\"candidateId\":\"WRK-$STAMP-$i\",\"gpsTime\":$((1500000000 + i)),\"search\":\"wrk\",\"summary\":\"wrk case.\",\"checklist\":\"candidate-review\"}" \
        | python3 -c 'import json,sys; c=json.load(sys.stdin); print(sys.argv[1], c["id"], ",".join(x["key"] for x in c["items"]))' "$token" >> "$WORK/targets.txt"
    done < "$WORK/tokens.txt"
    WRK_CMD=(wrk -t2 -c32 -d"${SECONDS_ARG}s" --timeout 10s --latency -s "$ROOT/benchmarks/load/notes.lua" "$URL")
    echo "wrk: ${WRK_CMD[*]} (load average $(cut -d' ' -f1-3 /proc/loadavg))"
    TARGETS="$WORK/targets.txt" WRK_THREADS=2 "${WRK_CMD[@]}" | tee "$OUT/$MODE-wrk-$STAMP.txt"
    ACKED="$(sed -n 's/^wrk: \([0-9]*\) notes acknowledged.*/\1/p' "$OUT/$MODE-wrk-$STAMP.txt")"
    STORED=0
    while read -r token id _; do
      total="$(curl -fsS "$URL/api/cases/$id/timeline?limit=1" -H "Authorization: Bearer $token" | python3 -c 'import json,sys; print(json.load(sys.stdin)["total"])')"
      STORED=$((STORED + total - 1)) # every entry after the case's opening is one note
    done < "$WORK/targets.txt"
    echo "wrk: $ACKED notes acknowledged, $STORED stored in the 32 cases' timelines" | tee -a "$OUT/$MODE-wrk-$STAMP.txt"
    [ "$STORED" -ge "$ACKED" ] || { echo "LOST: fewer notes stored than acknowledged"; exit 1; }
  else
    echo "wrk not installed (apt-get install -y wrk): the outside-tool run is skipped"
  fi
fi
echo "server log lines at Error: $(grep -c '"LogLevel":"Error"' "$WORK/server.log" || true)"

if [[ "$MODE" == writes* || "$MODE" == soak ]]; then
  # After the load: stop the server (its witness lines are flushed) and verify every case with the CLI.
  kill "$SERVER_PID" 2>/dev/null && wait "$SERVER_PID" 2>/dev/null || true
  SERVER_PID=""
  echo "verify (all cases, after the load):"
  "${CLI[@]}" verify "${DBARGS[@]}" | tee -a "$OUT/$MODE-verify-$STAMP.txt"
fi
