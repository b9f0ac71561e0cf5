#!/usr/bin/env bash
# npm run db:restore -- FILE [DATABASE]: loads a dump made by db:backup into DATABASE (default the
# application database), which is created if missing and must be empty; then verify it with
# DB_NAME=DATABASE npm run audit:verify (audit chain and every content hash).
set -euo pipefail
. "$(dirname "$0")/env.sh"
export PATH="$PATH:/usr/sbin"
CNF="$DATA_DIR/mariadb/my.cnf"
FILE="${1:?usage: npm run db:restore -- FILE [DATABASE]}"
TARGET="${2:-$DB_NAME}"
[ -f "$FILE" ] || { echo "No such backup file: $FILE" >&2; exit 1; }
[[ "$TARGET" =~ ^[A-Za-z0-9_]+$ ]] || { echo "The database name may hold letters, digits and _ only." >&2; exit 1; }
mariadb --defaults-file="$CNF" --user=root -e "CREATE DATABASE IF NOT EXISTS \`$TARGET\` CHARACTER SET utf8mb4 COLLATE utf8mb4_unicode_ci;
  GRANT ALL PRIVILEGES ON \`$TARGET\`.* TO '$DB_USER'@'127.0.0.1'; GRANT ALL PRIVILEGES ON \`$TARGET\`.* TO '$DB_USER'@'localhost';"
TABLES=$(mariadb --defaults-file="$CNF" --user=root -N -e "SELECT COUNT(*) FROM information_schema.tables WHERE table_schema = '$TARGET'")
[ "$TABLES" = "0" ] || { echo "Database $TARGET is not empty ($TABLES tables); restore into a new one." >&2; exit 1; }
gunzip -c "$FILE" | mariadb --defaults-file="$CNF" --user=root "$TARGET"
echo "Restored $FILE into $TARGET"
