#!/usr/bin/env bash
# Shared by scripts/s3.sh and scripts/oidc.sh: start_stand_in NAME PORT SCRIPT starts a local stand-in service
# (node --import tsx SCRIPT, log in $DATA_DIR/NAME.log) in the background unless something already answers on
# 127.0.0.1:PORT, and waits until it does.
start_stand_in() {
  local name="$1" port="$2" script="$3"
  (exec 3<>"/dev/tcp/127.0.0.1/$port") 2>/dev/null && return 0
  mkdir -p "$DATA_DIR"
  nohup node --import tsx "$script" >"$DATA_DIR/$name.log" 2>&1 &
  for _ in $(seq 1 40); do
    (exec 3<>"/dev/tcp/127.0.0.1/$port") 2>/dev/null && return 0
    sleep 0.25
  done
  echo "The $name stand-in did not start on 127.0.0.1:$port; see $DATA_DIR/$name.log" >&2
  return 1
}
