#!/usr/bin/env bash
# npm run db:backup [-- FILE]: a consistent dump of the application database (one transaction, no
# locks held for writers), gzipped, by default into .data/backups/<database>-<UTC time>.sql.gz.
set -euo pipefail
. "$(dirname "$0")/env.sh"
export PATH="$PATH:/usr/sbin"
CNF="$DATA_DIR/mariadb/my.cnf"
[ -f "$CNF" ] || { echo "No private MariaDB here yet: run npm run db:start first." >&2; exit 1; }
OUT="${1:-$DATA_DIR/backups/$DB_NAME-$(date -u +%Y%m%dT%H%M%SZ).sql.gz}"
mkdir -p "$(dirname "$OUT")"
mariadb-dump --defaults-file="$CNF" --user=root --single-transaction --quick --routines --triggers --hex-blob "$DB_NAME" | gzip -6 > "$OUT.part"
mv "$OUT.part" "$OUT"
echo "Backed up $DB_NAME to $OUT"
