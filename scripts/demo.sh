#!/usr/bin/env bash
# One command from a fresh checkout to a running demo: dependencies, MariaDB, schema, demo data,
# fake mail server, production build and server on http://localhost:3000.
set -euo pipefail
ROOT="$(cd "$(dirname "$0")/.." && pwd)"
cd "$ROOT"
bash scripts/ensure-deps.sh
. scripts/env.sh
export NEXTAUTH_URL="${NEXTAUTH_URL:-http://localhost:3000}"
PORT="${PORT:-3000}"
bash scripts/db.sh start
mkdir -p "$DATA_DIR"
if ! (exec 3<>"/dev/tcp/127.0.0.1/$SMTP_PORT") 2>/dev/null; then
  nohup node --import tsx scripts/fake-smtp.ts >"$DATA_DIR/fake-smtp.log" 2>&1 &
  echo "Fake SMTP server started on 127.0.0.1:$SMTP_PORT (mail kept in .data/mail)"
fi
bash scripts/s3.sh
bash scripts/oidc.sh
bash scripts/tsx.sh scripts/migrate.ts up
bash scripts/tsx.sh scripts/seed.ts up
echo "Building the application…"
./node_modules/.bin/next build >"$DATA_DIR/build.log" 2>&1 || { tail -40 "$DATA_DIR/build.log"; exit 1; }
cat <<MSG

  Correlary is starting on http://localhost:$PORT
  Sign in as admin@, author@, approver@, approver2@, engineer@ or integrator@demo.example
  with the demo password: correlary-demo-2026
  Stop with Ctrl-C; stop the database with: npm run db:stop

MSG
exec ./node_modules/.bin/next start -H 127.0.0.1 -p "$PORT"
