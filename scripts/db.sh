#!/usr/bin/env bash
# The project's own MariaDB: Debian's mariadb-server binary, a private data dir under .data/mariadb,
# bound to 127.0.0.1 on $DB_PORT (default 3307). Never touches a system-wide instance.
#   scripts/db.sh start   install if missing, init, start, create databases and the app user (idempotent)
#   scripts/db.sh stop    shut the private server down
#   scripts/db.sh status
set -euo pipefail
. "$(dirname "$0")/env.sh"
DIR="$DATA_DIR/mariadb"
CNF="$DIR/my.cnf"

ensure_installed() {
  if command -v mariadbd >/dev/null 2>&1 || [ -x /usr/sbin/mariadbd ]; then return; fi
  if [ "$(id -u)" = "0" ]; then
    echo "MariaDB server not found: installing Debian's mariadb-server…"
    apt-get update -qq
    DEBIAN_FRONTEND=noninteractive apt-get install -y -qq mariadb-server >/dev/null
  else
    echo "MariaDB server not found. Install it once with:" >&2
    echo "  sudo apt-get install -y mariadb-server" >&2
    exit 1
  fi
}

write_cnf() {
  mkdir -p "$DIR/data" "$DIR/tmp"
  cat > "$CNF" <<CNF
[client-server]
port=$DB_PORT
socket=$DIR/mysqld.sock

[mariadbd]
datadir=$DIR/data
tmpdir=$DIR/tmp
pid-file=$DIR/mysqld.pid
log-error=$DIR/error.log
bind-address=127.0.0.1
skip-name-resolve
character-set-server=utf8mb4
collation-server=utf8mb4_unicode_ci
innodb_flush_log_at_trx_commit=2
max_connections=300
CNF
}

ping() { mariadb-admin --defaults-file="$CNF" --user=root ping >/dev/null 2>&1; }

start() {
  ensure_installed
  export PATH="$PATH:/usr/sbin"
  write_cnf
  if [ ! -d "$DIR/data/mysql" ]; then
    echo "Initialising private MariaDB data directory in $DIR/data"
    mariadb-install-db --defaults-file="$CNF" --user="$(id -un)" --auth-root-authentication-method=socket --skip-test-db >"$DIR/install.log" 2>&1
  fi
  if ! ping; then
    echo "Starting MariaDB on 127.0.0.1:$DB_PORT"
    nohup mariadbd --defaults-file="$CNF" --user="$(id -un)" >>"$DIR/mariadbd.out" 2>&1 &
    for _ in $(seq 1 60); do ping && break; sleep 0.5; done
    ping || { echo "MariaDB did not start; see $DIR/error.log" >&2; tail -20 "$DIR/error.log" >&2; exit 1; }
  fi
  mariadb --defaults-file="$CNF" --user=root <<SQL
CREATE DATABASE IF NOT EXISTS \`$DB_NAME\` CHARACTER SET utf8mb4 COLLATE utf8mb4_unicode_ci;
CREATE DATABASE IF NOT EXISTS \`$DB_TEST_NAME\` CHARACTER SET utf8mb4 COLLATE utf8mb4_unicode_ci;
CREATE DATABASE IF NOT EXISTS \`${DB_TEST_NAME}_scratch\` CHARACTER SET utf8mb4 COLLATE utf8mb4_unicode_ci;
CREATE DATABASE IF NOT EXISTS \`$DB_BENCH_NAME\` CHARACTER SET utf8mb4 COLLATE utf8mb4_unicode_ci;
CREATE USER IF NOT EXISTS '$DB_USER'@'127.0.0.1' IDENTIFIED BY '$DB_PASSWORD';
CREATE USER IF NOT EXISTS '$DB_USER'@'localhost' IDENTIFIED BY '$DB_PASSWORD';
ALTER USER '$DB_USER'@'127.0.0.1' IDENTIFIED BY '$DB_PASSWORD';
ALTER USER '$DB_USER'@'localhost' IDENTIFIED BY '$DB_PASSWORD';
GRANT ALL PRIVILEGES ON \`$DB_NAME\`.* TO '$DB_USER'@'127.0.0.1';
GRANT ALL PRIVILEGES ON \`$DB_NAME\`.* TO '$DB_USER'@'localhost';
GRANT ALL PRIVILEGES ON \`$DB_TEST_NAME\`.* TO '$DB_USER'@'127.0.0.1';
GRANT ALL PRIVILEGES ON \`$DB_TEST_NAME\`.* TO '$DB_USER'@'localhost';
GRANT ALL PRIVILEGES ON \`${DB_TEST_NAME}_scratch\`.* TO '$DB_USER'@'127.0.0.1';
GRANT ALL PRIVILEGES ON \`${DB_TEST_NAME}_scratch\`.* TO '$DB_USER'@'localhost';
GRANT ALL PRIVILEGES ON \`$DB_BENCH_NAME\`.* TO '$DB_USER'@'127.0.0.1';
GRANT ALL PRIVILEGES ON \`$DB_BENCH_NAME\`.* TO '$DB_USER'@'localhost';
SQL
  echo "MariaDB ready on 127.0.0.1:$DB_PORT (databases $DB_NAME, $DB_TEST_NAME)"
}

# Drops and recreates the test database: every test run starts from an empty schema.
reset_test() {
  mariadb --defaults-file="$CNF" --user=root -e "DROP DATABASE IF EXISTS \`$DB_TEST_NAME\`; CREATE DATABASE \`$DB_TEST_NAME\` CHARACTER SET utf8mb4 COLLATE utf8mb4_unicode_ci;"
}

stop() {
  if [ -f "$CNF" ] && ping; then
    mariadb-admin --defaults-file="$CNF" --user=root shutdown
    echo "MariaDB stopped"
  else
    echo "MariaDB (private) is not running"
  fi
}

case "${1:-start}" in
  start) start ;;
  stop) stop ;;
  reset-test) reset_test ;;
  status) if [ -f "$CNF" ] && ping; then echo running; else echo stopped; exit 3; fi ;;
  *) echo "usage: scripts/db.sh start|stop|status|reset-test" >&2; exit 2 ;;
esac
