#!/usr/bin/env bash
# Sourced by the other scripts: loads .env.local (creating it with fresh secrets on first run)
# and exports the defaults every tool of the project expects.
ROOT="$(cd "$(dirname "${BASH_SOURCE[0]}")/.." && pwd)"
if [ ! -f "$ROOT/.env.local" ]; then
  umask 077
  {
    echo "# Created by scripts/env.sh on first run; local secrets, never committed."
    echo "DB_PASSWORD=$(head -c 18 /dev/urandom | base64 | tr -d '+/=')"
    echo "NEXTAUTH_SECRET=$(head -c 32 /dev/urandom | base64 | tr -d '+/=')"
  } > "$ROOT/.env.local"
fi
set -a
# shellcheck disable=SC1091
. "$ROOT/.env.local"
set +a
export DB_HOST="${DB_HOST:-127.0.0.1}"
export DB_PORT="${DB_PORT:-3307}"
export DB_NAME="${DB_NAME:-correlary}"
export DB_TEST_NAME="${DB_TEST_NAME:-correlary_test}"
# The API benchmark's own database (demo data plus thousands of generated library entries).
export DB_BENCH_NAME="${DB_BENCH_NAME:-correlary_bench}"
export DB_USER="${DB_USER:-correlary}"
export SMTP_HOST="${SMTP_HOST:-127.0.0.1}"
export SMTP_PORT="${SMTP_PORT:-2525}"
# Evidence documents: the local S3 stand-in (scripts/fake-s3.ts) unless S3_ENDPOINT points at a real store.
export S3_PORT="${S3_PORT:-4568}"
export S3_ENDPOINT="${S3_ENDPOINT:-http://127.0.0.1:$S3_PORT}"
export S3_BUCKET="${S3_BUCKET:-correlary-evidence}"
# Company sign-in: the local OpenID provider (scripts/fake-oidc.ts) unless OIDC_ISSUER points at the real one.
export OIDC_PORT="${OIDC_PORT:-4700}"
export OIDC_ISSUER="${OIDC_ISSUER:-http://127.0.0.1:$OIDC_PORT}"
export OIDC_CLIENT_ID="${OIDC_CLIENT_ID:-correlary}"
export OIDC_CLIENT_SECRET="${OIDC_CLIENT_SECRET:-correlary-demo-oidc-secret}"
export NEXT_TELEMETRY_DISABLED=1
export DATA_DIR="$ROOT/.data"
