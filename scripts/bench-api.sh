#!/usr/bin/env bash
# npm run bench:api [-- --json] — HTTP API throughput and latency against the production build on loopback.
# Starts MariaDB, a fake SMTP server and its own app server on port 3200 against the benchmark's own database
# ($DB_BENCH_NAME: the demo data plus generated library entries up to BENCH_LIBRARY_SIZE, 5,000 by default), then
# runs scripts/bench-api.ts. BENCH_SECONDS sets the length of each case (10 s by default).
set -euo pipefail
ROOT="$(cd "$(dirname "$0")/.." && pwd)"
cd "$ROOT"
bash scripts/ensure-deps.sh
. scripts/env.sh
bash scripts/db.sh start >/dev/null
export DB_NAME="$DB_BENCH_NAME"
export SMTP_PORT="${BENCH_SMTP_PORT:-2527}"
export MAIL_DIR="$DATA_DIR/mail-bench"
mkdir -p "$MAIL_DIR"
export BENCH_URL="http://127.0.0.1:3200"
export TEST_BASE_URL="$BENCH_URL"
export NEXTAUTH_URL="$BENCH_URL"
# The benchmark measures the evaluation path, not the rate limiter's refusals.
export RATE_LIMIT_PER_MINUTE=100000000
export RATE_LIMIT_EVALUATIONS_PER_MINUTE=100000000000

PIDS=()
trap 'for p in "${PIDS[@]}"; do kill "$p" 2>/dev/null || true; done' EXIT
node --import tsx scripts/fake-smtp.ts >"$DATA_DIR/fake-smtp-bench.log" 2>&1 &
PIDS+=($!)

bash scripts/tsx.sh scripts/migrate.ts up >/dev/null
bash scripts/tsx.sh scripts/seed.ts up >/dev/null
bash scripts/tsx.sh scripts/bench-library.ts
# Build when there is no build or the sources changed since the last one.
if [ ! -f .next/BUILD_ID ] || [ -n "$(find app lib components models validation next.config.* -newer .next/BUILD_ID -type f 2>/dev/null | head -1)" ]; then
  echo "Building the app for the benchmark…"
  ./node_modules/.bin/next build >"$DATA_DIR/build-bench.log" 2>&1 || { tail -40 "$DATA_DIR/build-bench.log"; exit 1; }
fi
./node_modules/.bin/next start -H 127.0.0.1 -p 3200 >"$DATA_DIR/server-bench.log" 2>&1 &
PIDS+=($!)
for _ in $(seq 1 60); do curl -fsS "$BENCH_URL/api/health" >/dev/null 2>&1 && break; sleep 0.5; done
bash scripts/tsx.sh scripts/bench-api.ts "$@"
