#!/usr/bin/env bash
# Shared steps of `npm start` and `npm test`: dependencies, system packages, a project-local MariaDB.
# Sourced, not run. Every function prints what it does and fails with a message a person can act on.

ROOT="$(cd "$(dirname "${BASH_SOURCE[0]}")/.." && pwd)"
DATA="$ROOT/.data"
mkdir -p "$DATA"
# Cairn runs on loopback and reports nothing to anyone: the framework's usage telemetry stays off (set it to 0 to allow it).
export NEXT_TELEMETRY_DISABLED="${NEXT_TELEMETRY_DISABLED:-1}"

say() { printf '\033[1m[cairn]\033[0m %s\n' "$*"; }
die() { printf '\033[1;31m[cairn] error:\033[0m %s\n' "$*" >&2; exit 1; }

# Installs npm dependencies from the lock file when node_modules is missing or older than the lock.
ensure_node_modules() {
  local stamp="$ROOT/node_modules/.cairn-lock-hash"
  local want; want="$(sha256sum "$ROOT/package-lock.json" | cut -c1-64)"
  if [ ! -f "$stamp" ] || [ "$(cat "$stamp")" != "$want" ]; then
    say "installing npm dependencies (npm ci)"
    (cd "$ROOT" && npm ci --no-audit --no-fund) || die "npm ci failed; see the output above"
    echo "$want" > "$stamp"
  fi
}

apt_updated=""
# ensure_debian_package COMMAND PACKAGE...: installs PACKAGE with apt when COMMAND is missing.
ensure_debian_package() {
  local cmd="$1"; shift
  command -v "$cmd" >/dev/null 2>&1 && return 0
  if [ "$(id -u)" != 0 ]; then
    die "'$cmd' is missing. Install Debian's package(s) '$*' (sudo apt-get install $*) and run this again."
  fi
  command -v apt-get >/dev/null 2>&1 || die "'$cmd' is missing and apt-get is not available; install '$*' by hand."
  if [ -z "$apt_updated" ]; then say "apt-get update"; apt-get update -qq || die "apt-get update failed"; apt_updated=1; fi
  say "installing Debian package(s): $*"
  DEBIAN_FRONTEND=noninteractive apt-get install -y -qq "$@" >/dev/null || die "apt-get install $* failed"
  command -v "$cmd" >/dev/null 2>&1 || die "installed $* but '$cmd' is still not on PATH"
}

# db_start NAME PORT: starts (initialising if needed) a MariaDB server with its data under .data/NAME,
# listening on 127.0.0.1:PORT only, and sets DB_SOCKET. Fails with the cause in the server's log.
db_start() {
  local name="$1" port="$2"
  local dir="$DATA/$name"
  ensure_debian_package mariadbd mariadb-server mariadb-client
  PATH="$PATH:/usr/sbin"
  mkdir -p "$dir"
  DB_SOCKET="$dir/mysqld.sock"
  DB_PID_FILE="$dir/mysqld.pid"
  if [ -S "$DB_SOCKET" ] && mariadb-admin --no-defaults --socket="$DB_SOCKET" -uroot ping >/dev/null 2>&1; then
    say "MariaDB '$name' already running on 127.0.0.1:$port"
    return 0
  fi
  if [ ! -d "$dir/data/mysql" ]; then
    # Initialise into a scratch directory and rename only on success, so that a failed or
    # interrupted initialisation never leaves a half-made data directory for the next start.
    rm -rf "$dir/data.partial" "$dir/data"
    say "initialising MariaDB data directory .data/$name/data"
    mariadb-install-db --no-defaults --datadir="$dir/data.partial" --user="$(id -un)" \
      --auth-root-authentication-method=normal --skip-test-db >"$dir/install.log" 2>&1 \
      || { rm -rf "$dir/data.partial"; die "mariadb-install-db failed; see .data/$name/install.log"; }
    mv "$dir/data.partial" "$dir/data"
  fi
  if (exec 3<>"/dev/tcp/127.0.0.1/$port") 2>/dev/null; then
    die "port $port on 127.0.0.1 is already taken by another program; stop it or set CAIRN_DB_PORT to a free port"
  fi
  say "starting MariaDB '$name' on 127.0.0.1:$port"
  : >"$dir/error.log"
  mariadbd --no-defaults --datadir="$dir/data" --socket="$DB_SOCKET" --pid-file="$DB_PID_FILE" \
    --port="$port" --bind-address=127.0.0.1 --user="$(id -un)" --skip-name-resolve \
    --log-error="$dir/error.log" --character-set-server=utf8mb4 --collation-server=utf8mb4_unicode_ci \
    --innodb-buffer-pool-size=128M --max-connections=200 >/dev/null 2>&1 &
  local i
  for i in $(seq 1 150); do
    if mariadb-admin --no-defaults --socket="$DB_SOCKET" -uroot ping >/dev/null 2>&1; then
      say "MariaDB '$name' is ready"
      return 0
    fi
    if ! kill -0 $! 2>/dev/null; then break; fi
    sleep 0.2
  done
  die "MariaDB '$name' did not start: $(grep -iE 'error|denied|abort' "$dir/error.log" | tail -3 | tr '\n' ' ')(full log: .data/$name/error.log)"
}

# db_stop NAME: stops the server started by db_start and waits (up to 20 s) until it has exited,
# so that its data directory can be removed right after.
db_stop() {
  local dir="$DATA/$1" pid
  pid="$(pid_in "$dir/mysqld.pid")"
  if [ -S "$dir/mysqld.sock" ]; then
    mariadb-admin --no-defaults --socket="$dir/mysqld.sock" -uroot shutdown >/dev/null 2>&1 || true
  fi
  wait_exit "$pid" 100 0.2
}

# pid_in FILE: the process id written in FILE, or nothing when there is no such file.
pid_in() {
  if [ -f "$1" ]; then cat "$1" 2>/dev/null || true; fi
}

# wait_exit PID TRIES PAUSE: waits until process PID (if any) has exited, checking at most TRIES times, PAUSE seconds apart.
wait_exit() {
  local i
  [ -n "$1" ] || return 0
  for i in $(seq 1 "$2"); do kill -0 "$1" 2>/dev/null || return 0; sleep "$3"; done
}

# db_create NAME DATABASE USER PASSWORD: creates a database and an account for 127.0.0.1 (idempotent).
db_create() {
  local dir="$DATA/$1"
  mariadb --no-defaults --socket="$dir/mysqld.sock" -uroot -e "
    CREATE DATABASE IF NOT EXISTS \`$2\` CHARACTER SET utf8mb4 COLLATE utf8mb4_unicode_ci;
    CREATE USER IF NOT EXISTS '$3'@'127.0.0.1' IDENTIFIED BY '$4';
    GRANT ALL PRIVILEGES ON \`$2\`.* TO '$3'@'127.0.0.1';
    FLUSH PRIVILEGES;" || die "could not create database $2"
}

# db_recreate NAME DATABASE USER PASSWORD: drops and creates (for tests).
db_recreate() {
  local dir="$DATA/$1"
  mariadb --no-defaults --socket="$dir/mysqld.sock" -uroot -e "DROP DATABASE IF EXISTS \`$2\`;" || die "could not drop $2"
  db_create "$@"
}

# A secret for signing sessions, made once per checkout unless NEXTAUTH_SECRET is set.
ensure_secret() {
  if [ -z "${NEXTAUTH_SECRET:-}" ]; then
    [ -f "$DATA/secret" ] || head -c 32 /dev/urandom | base64 > "$DATA/secret"
    NEXTAUTH_SECRET="$(cat "$DATA/secret")"
    export NEXTAUTH_SECRET
  fi
}

# redis_start NAME PORT: starts Debian's redis-server with its data under .data/NAME/redis, listening on
# 127.0.0.1:PORT only, with an append-only file so that queued jobs survive a restart. Sets REDIS_URL.
redis_start() {
  local name="$1" port="$2"
  local dir="$DATA/$name/redis"
  ensure_debian_package redis-server redis-server
  mkdir -p "$dir"
  export REDIS_URL="redis://127.0.0.1:$port"
  if redis-cli -p "$port" ping 2>/dev/null | grep -q PONG; then
    if [ -f "$dir/redis.pid" ] && kill -0 "$(cat "$dir/redis.pid")" 2>/dev/null; then say "Redis '$name' already running on 127.0.0.1:$port"; return 0; fi
    die "port $port on 127.0.0.1 is already taken by another Redis; stop it, set CAIRN_REDIS_PORT to a free port, or set REDIS_URL to use it"
  fi
  if (exec 3<>"/dev/tcp/127.0.0.1/$port") 2>/dev/null; then
    die "port $port on 127.0.0.1 is already taken by another program; stop it or set CAIRN_REDIS_PORT to a free port"
  fi
  say "starting Redis '$name' on 127.0.0.1:$port"
  redis-server --port "$port" --bind 127.0.0.1 --dir "$dir" --pidfile "$dir/redis.pid" --logfile "$dir/redis.log" \
    --appendonly yes --save "" --daemonize yes >/dev/null || die "redis-server did not start; see .data/$name/redis/redis.log"
  local i
  for i in $(seq 1 100); do
    redis-cli -p "$port" ping 2>/dev/null | grep -q PONG && { say "Redis '$name' is ready"; return 0; }
    sleep 0.1
  done
  die "Redis '$name' did not answer on 127.0.0.1:$port: $(tail -3 "$dir/redis.log" | tr '\n' ' ')"
}

# redis_stop NAME: stops the Redis started by redis_start and waits (up to 10 s) until it has exited.
redis_stop() {
  local pid
  pid="$(pid_in "$DATA/$1/redis/redis.pid")"
  [ -n "$pid" ] || return 0
  kill "$pid" 2>/dev/null || true
  wait_exit "$pid" 100 0.1
}

# worker_count: verification workers for `npm start`: one per core less one (the web server's), at least one.
worker_count() {
  local n; n="$(nproc 2>/dev/null || echo 2)"
  if [ -n "${CAIRN_WORKERS:-}" ]; then echo "$CAIRN_WORKERS"; elif [ "$n" -gt 2 ]; then echo $((n - 1)); else echo 1; fi
}
