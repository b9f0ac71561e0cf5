#!/usr/bin/env bash
# npm run bench:api — HTTP API throughput and latency against the production build on loopback.
# Starts MariaDB and its own server on port 3200 (demo database), then runs scripts/bench-api.ts.
set -euo pipefail
ROOT="$(cd "$(dirname "$0")/.." && pwd)"
cd "$ROOT"
bash scripts/ensure-deps.sh
. scripts/env.sh
bash scripts/db.sh start >/dev/null
bash scripts/tsx.sh scripts/migrate.ts up >/dev/null
bash scripts/tsx.sh scripts/seed.ts up >/dev/null
[ -f .next/BUILD_ID ] || ./node_modules/.bin/next build >"$DATA_DIR/build-bench.log" 2>&1
export BENCH_URL="http://127.0.0.1:3200"
export NEXTAUTH_URL="$BENCH_URL"
# The benchmark measures the evaluation path, not the rate limiter's refusals.
export RATE_LIMIT_PER_MINUTE=100000000
./node_modules/.bin/next start -H 127.0.0.1 -p 3200 >"$DATA_DIR/server-bench.log" 2>&1 &
SERVER=$!
trap 'kill $SERVER 2>/dev/null || true' EXIT
for _ in $(seq 1 60); do curl -fsS "$BENCH_URL/api/health" >/dev/null 2>&1 && break; sleep 0.5; done
bash scripts/tsx.sh scripts/bench-api.ts "$@"
