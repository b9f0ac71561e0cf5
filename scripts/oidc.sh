#!/usr/bin/env bash
# Starts the local OpenID provider (scripts/fake-oidc.ts) when the settings point at it and it is not already
# answering. A real provider (OIDC_ISSUER elsewhere) is left alone.
set -euo pipefail
cd "$(dirname "$0")/.."
. scripts/env.sh
. scripts/stand-in.sh
[[ "$OIDC_ISSUER" == "http://127.0.0.1:$OIDC_PORT" ]] || exit 0
base="${NEXTAUTH_URL:-http://localhost:3000}"
export OIDC_REDIRECT_URIS="${OIDC_REDIRECT_URIS:-$base/api/auth/callback/company,http://localhost:${PORT:-3000}/api/auth/callback/company,http://127.0.0.1:${PORT:-3000}/api/auth/callback/company}"
start_stand_in fake-oidc "$OIDC_PORT" scripts/fake-oidc.ts
echo "Fake OpenID provider on $OIDC_ISSUER (company directory in ${OIDC_DIRECTORY:-.data/oidc-directory.json})"
