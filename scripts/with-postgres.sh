#!/usr/bin/env bash
# Runs a command against a throwaway PostgreSQL server on 127.0.0.1 (a spare port), with
# TEST_DATABASE_URL pointing at a fresh database; the server is stopped afterwards.
set -euo pipefail

bin=""
# Resolve symlinks (an initdb linked into /usr/local/bin has no createdb beside it).
for d in $(dirname "$(readlink -f "$(command -v initdb 2>/dev/null || echo /nonexistent/initdb)")") /usr/lib/postgresql/*/bin; do
  if [ -x "$d/initdb" ] && [ -x "$d/pg_ctl" ] && [ -x "$d/createdb" ]; then bin="$d"; break; fi
done
[ -n "$bin" ] || { echo "PostgreSQL server binaries not found: run scripts/setup.sh (installs Debian's postgresql)." >&2; exit 1; }

work=$(mktemp -d /tmp/candlewise-pg.XXXXXX)
port=$(node -e "const s=require('net').createServer();s.listen(0,'127.0.0.1',()=>{console.log(s.address().port);s.close()})")
as_pg=()
if [ "$(id -u)" -eq 0 ]; then
  chown postgres "$work" 2>/dev/null || true
  as_pg=(runuser -u postgres --)
fi

"${as_pg[@]}" "$bin/initdb" -D "$work/data" -U candlewise --auth=trust -E UTF8 >/dev/null
"${as_pg[@]}" "$bin/pg_ctl" -D "$work/data" -o "-p $port -k $work -c listen_addresses=127.0.0.1 -c fsync=off" -l "$work/log" -w start >/dev/null
cleanup() { "${as_pg[@]}" "$bin/pg_ctl" -D "$work/data" -m fast -w stop >/dev/null 2>&1 || true; rm -rf "$work"; }
trap cleanup EXIT

# The throwaway cluster's own `postgres` database is the test database.
export TEST_DATABASE_URL="postgres://candlewise@127.0.0.1:$port/postgres"
echo "PostgreSQL $("$bin/pg_ctl" --version | awk '{print $3}') on 127.0.0.1:$port"
"$@"
