#!/usr/bin/env bash
# Starts the local S3 stand-in (scripts/fake-s3.ts) in the background when the settings point at it and it is
# not already answering; waits until it does. A real store (S3_ENDPOINT elsewhere) is left alone.
set -euo pipefail
cd "$(dirname "$0")/.."
. scripts/env.sh
[[ "$S3_ENDPOINT" == "http://127.0.0.1:$S3_PORT" ]] || exit 0
(exec 3<>"/dev/tcp/127.0.0.1/$S3_PORT") 2>/dev/null && exit 0
mkdir -p "$DATA_DIR"
nohup node --import tsx scripts/fake-s3.ts >"$DATA_DIR/fake-s3.log" 2>&1 &
for _ in $(seq 1 40); do
  if (exec 3<>"/dev/tcp/127.0.0.1/$S3_PORT") 2>/dev/null; then echo "Fake S3 document store started on 127.0.0.1:$S3_PORT (objects kept in ${S3_DIR:-.data/s3})"; exit 0; fi
  sleep 0.25
done
echo "The fake S3 store did not start; see $DATA_DIR/fake-s3.log" >&2; exit 1
