#!/usr/bin/env bash
# Everything the tests need, then: type-check → migrations/seed on the test database → production
# build → vitest (unit + integration against the real MariaDB and the running app) → Playwright →
# resilience (database outage, two app instances, a loopback load, backup and restore).
set -euo pipefail
ROOT="$(cd "$(dirname "$0")/.." && pwd)"
cd "$ROOT"
bash scripts/ensure-deps.sh
. scripts/env.sh

if [ ! -x /usr/bin/chromium ]; then
  if [ "$(id -u)" = "0" ]; then
    echo "Installing Debian's chromium for browser tests…"
    apt-get update -qq && DEBIAN_FRONTEND=noninteractive apt-get install -y -qq chromium >/dev/null
  else
    echo "Browser tests need Debian's chromium: sudo apt-get install -y chromium" >&2; exit 1
  fi
fi

# The property-table tests compare with the standard formulations through Debian's python3-iapws.
if ! /usr/bin/python3 -c 'import iapws' 2>/dev/null; then
  if [ "$(id -u)" = "0" ]; then
    echo "Installing Debian's python3-iapws for the property-table tests…"
    apt-get update -qq && DEBIAN_FRONTEND=noninteractive apt-get install -y -qq python3-iapws >/dev/null
  else
    echo "The property-table tests need Debian's python3-iapws: sudo apt-get install -y python3-iapws" >&2; exit 1
  fi
fi

DB_WAS_RUNNING=0
bash scripts/db.sh status >/dev/null 2>&1 && DB_WAS_RUNNING=1
bash scripts/db.sh start
bash scripts/db.sh reset-test

export DB_NAME="$DB_TEST_NAME"
export SMTP_PORT="${TEST_SMTP_PORT:-2526}"
export MAIL_DIR="$DATA_DIR/mail-test"
export S3_PORT="${TEST_S3_PORT:-4569}"
export S3_ENDPOINT="http://127.0.0.1:$S3_PORT"
export S3_BUCKET="correlary-evidence-test"
export S3_DIR="$DATA_DIR/s3-test"
export OIDC_PORT="${TEST_OIDC_PORT:-4701}"
export OIDC_ISSUER="http://127.0.0.1:$OIDC_PORT"
export OIDC_DIRECTORY="$DATA_DIR/oidc-directory-test.json"
export TEST_PORT="${TEST_PORT:-3100}"
export TEST_BASE_URL="http://127.0.0.1:$TEST_PORT"
export NEXTAUTH_URL="$TEST_BASE_URL"
export OIDC_REDIRECT_URIS="$NEXTAUTH_URL/api/auth/callback/company"
export RATE_LIMIT_PER_MINUTE="${RATE_LIMIT_PER_MINUTE:-100000}"
# Webhook retries in a test run: the first retry after 0.3 s, the queue looked at every 0.2 s.
export WEBHOOK_RETRY_BASE_MS="${WEBHOOK_RETRY_BASE_MS:-300}"
export WEBHOOK_POLL_MS="${WEBHOOK_POLL_MS:-200}"
rm -rf "$MAIL_DIR" "$S3_DIR" "$OIDC_DIRECTORY" && mkdir -p "$MAIL_DIR" "$S3_DIR"

PIDS=()
cleanup() {
  for pid in "${PIDS[@]}"; do kill "$pid" 2>/dev/null || true; done
  wait 2>/dev/null || true
  if [ "$DB_WAS_RUNNING" = "0" ]; then bash scripts/db.sh stop >/dev/null || true; fi
}
trap cleanup EXIT

node --import tsx scripts/fake-smtp.ts >"$DATA_DIR/fake-smtp-test.log" 2>&1 &
PIDS+=($!)
node --import tsx scripts/fake-s3.ts >"$DATA_DIR/fake-s3-test.log" 2>&1 &
PIDS+=($!)
node --import tsx scripts/fake-oidc.ts >"$DATA_DIR/fake-oidc-test.log" 2>&1 &
PIDS+=($!)
for port in "$S3_PORT" "$OIDC_PORT"; do
  for _ in $(seq 1 40); do (exec 3<>"/dev/tcp/127.0.0.1/$port") 2>/dev/null && break; sleep 0.25; done
done

echo "== type-check"
./node_modules/.bin/tsc --noEmit

echo "== migrations and seed (test database $DB_NAME)"
bash scripts/tsx.sh scripts/migrate.ts up
bash scripts/tsx.sh scripts/seed.ts up

echo "== production build"
./node_modules/.bin/next build >"$DATA_DIR/build-test.log" 2>&1 || { tail -60 "$DATA_DIR/build-test.log"; exit 1; }

./node_modules/.bin/next start -H 127.0.0.1 -p "$TEST_PORT" >"$DATA_DIR/server-test.log" 2>&1 &
PIDS+=($!)
for _ in $(seq 1 120); do
  curl -fsS "$TEST_BASE_URL/api/health" >/dev/null 2>&1 && break
  sleep 0.5
done
curl -fsS "$TEST_BASE_URL/api/health" >/dev/null || { echo "The app did not become healthy"; tail -40 "$DATA_DIR/server-test.log"; exit 1; }

status=0
# TEST_STAGES=resilience (npm run test:resilience) runs the last stage only.
if [ "${TEST_STAGES:-all}" != "resilience" ]; then
  echo "== vitest"
  ./node_modules/.bin/vitest run || status=1
  echo "== playwright"
  ./node_modules/.bin/playwright test || status=1
fi
# Last, as they stop the database and start a second server: outage, two instances, load, backup.
echo "== resilience (LOAD_SECONDS=${LOAD_SECONDS:-60})"
./node_modules/.bin/vitest run --config vitest.resilience.config.mts || status=1
exit $status
