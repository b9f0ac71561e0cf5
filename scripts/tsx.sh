#!/usr/bin/env bash
# Runs a TypeScript script the way every documented command needs it, from any fresh shell: with the
# project's settings (.env.local, created on first run) and the "react-server" export condition, so
# modules marked `import 'server-only'` load outside Next.js as they do on the server.
set -euo pipefail
. "$(dirname "$0")/env.sh"
cd "$ROOT"
exec ./node_modules/.bin/tsx --conditions=react-server "$@"
