#!/usr/bin/env bash
# Runs every test of EventReview on a fresh machine: installs what is missing (Debian's chromium, fonts,
# postgresql, poppler-utils; the dotnet tool manifest), starts a throwaway PostgreSQL server for the data-layer
# tests, builds, runs `dotnet test` and ends with the plain line "N passed, N failed".
set -uo pipefail
cd "$(dirname "$0")"
ROOT="$(pwd)"

need=()
command -v chromium >/dev/null 2>&1 || need+=(chromium)
[ -f /usr/share/fonts/truetype/dejavu/DejaVuSans.ttf ] || need+=(fonts-dejavu-core)
ls /usr/lib/postgresql/*/bin/initdb >/dev/null 2>&1 || need+=(postgresql)
command -v pdftoppm >/dev/null 2>&1 || need+=(poppler-utils)
if [ ${#need[@]} -gt 0 ]; then
  echo "Installing Debian packages: ${need[*]}"
  SUDO=""; [ "$(id -u)" -ne 0 ] && SUDO="sudo"
  $SUDO apt-get update -qq && DEBIAN_FRONTEND=noninteractive $SUDO apt-get install -y -qq "${need[@]}" >/dev/null || { echo "apt-get install failed"; echo "0 passed, 1 failed"; exit 1; }
fi

dotnet tool restore >/dev/null || { echo "dotnet tool restore failed"; echo "0 passed, 1 failed"; exit 1; }

# A throwaway PostgreSQL server on a local port, for the data-layer tests.
PGBIN="$(ls -d /usr/lib/postgresql/*/bin | sort -V | tail -1)"
PGDIR="$(mktemp -d /tmp/eventreview-pg.XXXXXX)"
PGPORT="${EVENTREVIEW_PG_PORT:-55433}"
RUNAS=()
if [ "$(id -u)" -eq 0 ]; then chown postgres "$PGDIR"; RUNAS=(runuser -u postgres --); fi
cleanup() {
  "${RUNAS[@]}" "$PGBIN/pg_ctl" -D "$PGDIR/data" -m immediate stop >/dev/null 2>&1 || true
  rm -rf "$PGDIR"
}
trap cleanup EXIT
if "${RUNAS[@]}" "$PGBIN/initdb" -D "$PGDIR/data" -A trust -U postgres >/dev/null 2>&1 &&
   "${RUNAS[@]}" "$PGBIN/pg_ctl" -D "$PGDIR/data" -o "-p $PGPORT -k $PGDIR -c listen_addresses=127.0.0.1 -c fsync=off" -l "$PGDIR/log" -w start >/dev/null 2>&1; then
  export EVENTREVIEW_TEST_POSTGRES="Host=127.0.0.1;Port=$PGPORT;Username=postgres;Database=postgres"
  echo "PostgreSQL for tests on 127.0.0.1:$PGPORT"
else
  echo "warning: could not start a throwaway PostgreSQL server; the Postgres tests will say why they fail"
  cat "$PGDIR/log" 2>/dev/null | tail -5
fi

echo "Building..."
if ! dotnet build EventReview.sln -c Debug 2>&1 | tail -3; then :; fi
if ! dotnet build EventReview.sln -c Debug --no-restore >/dev/null 2>&1; then
  dotnet build EventReview.sln -c Debug --no-restore 2>&1 | grep -E "error" | sort -u | head -30
  echo "0 passed, 1 failed"
  exit 1
fi

LOG="$(mktemp /tmp/eventreview-test.XXXXXX.log)"
dotnet test EventReview.sln -c Debug --no-build 2>&1 | tee "$LOG"
status=${PIPESTATUS[0]}

passed=$(grep -E "^(Passed|Failed)!" "$LOG" | sed -E 's/.*Passed:[[:space:]]*([0-9]+).*/\1/' | awk '{s+=$1} END {print s+0}')
failed=$(grep -E "^(Passed|Failed)!" "$LOG" | sed -E 's/.*Failed:[[:space:]]*([0-9]+),.*/\1/' | awk '{s+=$1} END {print s+0}')
rm -f "$LOG"
if [ "$status" -ne 0 ] && [ "$failed" -eq 0 ]; then failed=1; fi
echo "$passed passed, $failed failed"
exit "$status"
