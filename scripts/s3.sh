#!/usr/bin/env bash
# Starts the local S3 stand-in (scripts/fake-s3.ts) when the settings point at it and it is not already answering.
# A real store (S3_ENDPOINT elsewhere) is left alone.
set -euo pipefail
cd "$(dirname "$0")/.."
. scripts/env.sh
. scripts/stand-in.sh
[[ "$S3_ENDPOINT" == "http://127.0.0.1:$S3_PORT" ]] || exit 0
start_stand_in fake-s3 "$S3_PORT" scripts/fake-s3.ts
echo "Fake S3 document store on 127.0.0.1:$S3_PORT (objects kept in ${S3_DIR:-.data/s3})"
