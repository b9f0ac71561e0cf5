#!/usr/bin/env bash
# Development server with hot reload against the demo database.
set -euo pipefail
cd "$(dirname "$0")/.."
bash scripts/ensure-deps.sh
. scripts/env.sh
export NEXTAUTH_URL="${NEXTAUTH_URL:-http://localhost:3000}"
bash scripts/db.sh start
if ! (exec 3<>"/dev/tcp/127.0.0.1/$SMTP_PORT") 2>/dev/null; then
  nohup node --import tsx scripts/fake-smtp.ts >"$DATA_DIR/fake-smtp.log" 2>&1 &
fi
bash scripts/s3.sh
bash scripts/oidc.sh
bash scripts/tsx.sh scripts/migrate.ts up
bash scripts/tsx.sh scripts/seed.ts up
exec ./node_modules/.bin/next dev -H 127.0.0.1 -p "${PORT:-3000}"
