#!/usr/bin/env bash
# Starts the local OpenID provider (scripts/fake-oidc.ts) in the background when the settings point at it and it is
# not already answering; waits until it does. A real provider (OIDC_ISSUER elsewhere) is left alone.
set -euo pipefail
cd "$(dirname "$0")/.."
. scripts/env.sh
[[ "$OIDC_ISSUER" == "http://127.0.0.1:$OIDC_PORT" ]] || exit 0
(exec 3<>"/dev/tcp/127.0.0.1/$OIDC_PORT") 2>/dev/null && exit 0
mkdir -p "$DATA_DIR"
base="${NEXTAUTH_URL:-http://localhost:3000}"
export OIDC_REDIRECT_URIS="${OIDC_REDIRECT_URIS:-$base/api/auth/callback/company,http://localhost:${PORT:-3000}/api/auth/callback/company,http://127.0.0.1:${PORT:-3000}/api/auth/callback/company}"
nohup node --import tsx scripts/fake-oidc.ts >"$DATA_DIR/fake-oidc.log" 2>&1 &
for _ in $(seq 1 40); do
  if (exec 3<>"/dev/tcp/127.0.0.1/$OIDC_PORT") 2>/dev/null; then echo "Fake OpenID provider started on $OIDC_ISSUER (company directory in .data/oidc-directory.json)"; exit 0; fi
  sleep 0.25
done
echo "The fake OpenID provider did not start; see $DATA_DIR/fake-oidc.log" >&2; exit 1
