# Shared shell functions of the start and test scripts. Source it; do not run it.
# Everything the project needs from outside npm comes from Debian's packages,
# installed here only when missing.

ROOT="$(cd "$(dirname "${BASH_SOURCE[0]}")/.." && pwd)"
DATA_DIR="$ROOT/.data"
cd "$ROOT"

log() { printf '\033[1mkeepstitch:\033[0m %s\n' "$*"; }

# Debian packages, installed without starting any service of theirs.
apt_install() {
  local made_policy=0
  if [ ! -e /usr/sbin/policy-rc.d ]; then
    printf '#!/bin/sh\nexit 101\n' > /usr/sbin/policy-rc.d && chmod +x /usr/sbin/policy-rc.d && made_policy=1
  fi
  DEBIAN_FRONTEND=noninteractive apt-get install -y -q "$@" || {
    apt-get update -q && DEBIAN_FRONTEND=noninteractive apt-get install -y -q "$@"
  }
  local rc=$?
  [ "$made_policy" = 1 ] && rm -f /usr/sbin/policy-rc.d
  return $rc
}

pg_bin_dir() {
  local dir
  for dir in $(ls -d /usr/lib/postgresql/*/bin 2>/dev/null | sort -V -r); do
    if [ -x "$dir/initdb" ] && [ -x "$dir/postgres" ]; then echo "$dir"; return 0; fi
  done
  return 1
}

ensure_postgres() {
  if ! pg_bin_dir >/dev/null; then
    log "PostgreSQL server not found: installing Debian's postgresql"
    apt_install postgresql
  fi
  PG_BIN="$(pg_bin_dir)"
  export PATH="$PG_BIN:$PATH"
  if ! id postgres >/dev/null 2>&1; then
    useradd --system --home-dir /var/lib/postgresql --shell /bin/sh postgres
  fi
}

ensure_chromium() {
  if [ ! -x /usr/bin/chromium ]; then
    log "Chromium not found: installing Debian's chromium"
    apt_install chromium
  fi
  export CHROME_BIN=/usr/bin/chromium
}

ensure_node_modules() {
  if [ ! -d node_modules ] || [ ! -f node_modules/.package-lock.json ] || [ package-lock.json -nt node_modules/.package-lock.json ]; then
    log "Installing npm packages (npm ci)"
    npm ci --no-audit --no-fund
  fi
}

# As root, PostgreSQL's programs run as the postgres user (from /, which it can
# always enter; every path given to them is absolute).
as_pg() {
  if [ "$(id -u)" = 0 ]; then (cd / && runuser -u postgres -- "$@"); else "$@"; fi
}

# Where clusters live when the postgres user cannot reach the project (below).
PG_AWAY_DIR="${KEEPSTITCH_PG_AWAY_DIR:-/var/lib/keepstitch}"

# The folder a cluster kept away from DIR lives in: one per DIR, named by a hash of its path.
pg_away_path() {
  printf '%s/%s' "$PG_AWAY_DIR" "$(printf '%s' "$1" | sha256sum | cut -c1-16)"
}

# pg_where DIR: the folder the cluster named DIR really is in (DIR, or where its link points).
pg_where() {
  if [ -L "$1" ]; then readlink -f "$1"; else printf '%s' "$1"; fi
}

# pg_place DIR: makes the folder for a cluster named DIR and prints where it is.
# As root, PostgreSQL runs as the postgres user, who cannot enter a project in a
# folder closed to others (root's home is mode 0700 on Debian). Opening the
# parents to others would expose root's home, so instead such a cluster lives in
# /var/lib/keepstitch/<hash of DIR>/ (owned by postgres, mode 0700; a file
# "project" there names DIR) and DIR is a link to it.
pg_place() {
  local dir="$1" away
  if [ -L "$dir" ]; then
    away="$(readlink -f "$dir")"
    mkdir -p "$away" && chown postgres "$away" && chmod 700 "$away" || return 1
    printf '%s' "$away"; return 0
  fi
  mkdir -p "$dir" || return 1
  if [ "$(id -u)" != 0 ]; then printf '%s' "$dir"; return 0; fi
  chown postgres "$dir" || return 1
  if runuser -u postgres -- test -w "$dir" -a -x "$dir"; then printf '%s' "$dir"; return 0; fi
  if [ -f "$dir/data/PG_VERSION" ]; then
    echo "The PostgreSQL cluster in $dir cannot be reached by the postgres user (a folder above it is closed to others): stop using it there by moving it with 'mv $dir $(pg_away_path "$dir") && ln -s $(pg_away_path "$dir") $dir', then run this again." >&2
    return 1
  fi
  # Nothing worth keeping here yet (at most the log of a failed first try): put the cluster away.
  away="$(pg_away_path "$dir")"
  mkdir -p "$PG_AWAY_DIR" && chmod 755 "$PG_AWAY_DIR" && mkdir -p "$away" && chown postgres "$away" && chmod 700 "$away" || {
    echo "Cannot make $away for the PostgreSQL cluster of $dir: make that folder writable by root, or set KEEPSTITCH_PG_AWAY_DIR to a folder the postgres user can reach." >&2
    return 1; }
  printf '%s\n' "$dir" >"$away/project"
  rm -rf "$dir" && ln -s "$away" "$dir" || return 1
  printf '%s' "$away"
}

# pg_remove DIR: deletes a throwaway cluster named DIR (stopped first), wherever it lives.
pg_remove() {
  local dir="$1" away
  away="$(pg_away_path "$dir")"
  pg_down "$dir" >/dev/null 2>&1
  rm -rf "$dir"
  if [ -d "$away" ]; then rm -rf "$away"; fi
}

# pg_up DIR PORT: a cluster of the project's own named DIR, listening on 127.0.0.1:PORT
# with its socket inside it. Creates it the first time; re-uses it after.
pg_up() {
  local dir port="$2"
  dir="$(pg_place "$1")" || return 1
  local data="$dir/data" sock="$dir/run"
  if [ ${#sock} -gt 90 ]; then sock="/tmp/keepstitch-pg-$port"; fi
  mkdir -p "$sock"
  if [ "$(id -u)" = 0 ]; then chown postgres "$sock"; fi
  if [ ! -f "$data/PG_VERSION" ]; then
    log "Creating a PostgreSQL cluster in ${1#$ROOT/}$([ "$dir" != "$1" ] && printf ' (kept in %s, which the postgres user can reach)' "$dir")"
    as_pg initdb -D "$data" -U postgres --auth=trust -E UTF8 --locale=C >"$dir/initdb.log" 2>&1 || {
      cat "$dir/initdb.log" >&2; return 1; }
  fi
  if as_pg pg_ctl -D "$data" status >/dev/null 2>&1; then
    log "PostgreSQL already running on 127.0.0.1:$port"
    return 0
  fi
  log "Starting PostgreSQL on 127.0.0.1:$port"
  as_pg pg_ctl -D "$data" -l "$dir/server.log" -w -t 60 \
    -o "-k $sock -c listen_addresses=127.0.0.1 -p $port -c fsync=${PG_FSYNC:-on}" start >/dev/null || {
    tail -n 20 "$dir/server.log" >&2; return 1; }
}

pg_down() {
  local dir
  dir="$(pg_where "$1")"
  if [ -f "$dir/data/PG_VERSION" ] && as_pg pg_ctl -D "$dir/data" status >/dev/null 2>&1; then
    log "Stopping PostgreSQL"
    as_pg pg_ctl -D "$dir/data" -m fast -w stop >/dev/null || true
  fi
}

# For one-off chores (backup, restore): use DATABASE_URL when set; otherwise the
# development database, starting its cluster for the chore when it is not
# running. `chore_done` stops what `chore_database` started.
CHORE_STARTED_PG=0
chore_database() {
  local port="${KEEPSTITCH_PG_PORT:-54330}"
  if [ -z "${DATABASE_URL:-}" ]; then
    export DATABASE_URL="postgres://postgres@127.0.0.1:$port/keepstitch"
    if ! as_pg pg_ctl -D "$(pg_where "$DATA_DIR/pg")/data" status >/dev/null 2>&1; then
      pg_up "$DATA_DIR/pg" "$port" >/dev/null
      CHORE_STARTED_PG=1
    fi
  fi
  UPLOAD_DIR="${UPLOAD_DIR:-$DATA_DIR/uploads}"
}
chore_done() {
  if [ "$CHORE_STARTED_PG" = 1 ]; then pg_down "$DATA_DIR/pg" >/dev/null; fi
}

# Every TypeScript project of the repo, type-checked by `npm test` and `npm run typecheck`.
TS_PROJECTS=(shared/tsconfig.json server/tsconfig.json tsconfig.app.json tsconfig.spec.json e2e/tsconfig.json)
