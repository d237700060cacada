#!/usr/bin/env bash
# npm run test:pg: the API and security tests (and the two-instance test) against PostgreSQL.
# Starts a throwaway cluster (initdb in a temporary directory, a free port on 127.0.0.1, trust
# authentication), points DATABASE_URL at it, runs vitest, then stops and removes the cluster,
# whatever happened. Extra arguments go to vitest (e.g. a single file).
set -euo pipefail
cd "$(dirname "$0")/.."

# PostgreSQL's tools: on PATH, or where Debian's packages put them.
find_tool() {
  if command -v "$1" >/dev/null 2>&1; then
    command -v "$1"
    return
  fi
  local found
  found=$(ls -1 /usr/lib/postgresql/*/bin/"$1" 2>/dev/null | sort -V | tail -n 1 || true)
  [ -n "$found" ] && echo "$found"
}
initdb=$(find_tool initdb || true)
pg_ctl=$(find_tool pg_ctl || true)
if [ -z "$initdb" ] || [ -z "$pg_ctl" ]; then
  echo "test:pg needs PostgreSQL's initdb and pg_ctl (on PATH or in /usr/lib/postgresql/*/bin)." >&2
  echo "On Debian: apt-get install -y postgresql" >&2
  exit 1
fi

# PostgreSQL refuses to run as root: as root, the cluster belongs to the postgres user (or nobody).
run_as=()
if [ "$(id -u)" = 0 ]; then
  owner=postgres
  id -u "$owner" >/dev/null 2>&1 || owner=nobody
  run_as=(runuser -u "$owner" --)
fi

dir=$(mktemp -d "${TMPDIR:-/tmp}/conductory-test-pg.XXXXXX")
cleanup() {
  "${run_as[@]}" "$pg_ctl" -D "$dir/data" -m immediate stop >/dev/null 2>&1 || true
  rm -rf "$dir"
}
trap cleanup EXIT
trap 'exit 130' INT TERM
[ ${#run_as[@]} -gt 0 ] && chown "$owner" "$dir"

port=$(node -e "const s=require('node:net').createServer().listen(0,'127.0.0.1',()=>{console.log(s.address().port);s.close()})")

started=$(date +%s)
"${run_as[@]}" "$initdb" -D "$dir/data" -U postgres -A trust -E UTF8 --no-locale --no-sync >"$dir/initdb.log" 2>&1 ||
  { cat "$dir/initdb.log" >&2; exit 1; }
# Durability is not under test here: no fsync makes the many CREATE DATABASEs quick.
"${run_as[@]}" "$pg_ctl" -D "$dir/data" -l "$dir/server.log" -w -t 60 \
  -o "-h 127.0.0.1 -p $port -k $dir -c fsync=off -c synchronous_commit=off -c full_page_writes=off -c max_connections=400" \
  start >/dev/null || { cat "$dir/server.log" >&2; exit 1; }
echo "test:pg: PostgreSQL $("$pg_ctl" --version | awk '{print $3}') on 127.0.0.1:$port ($dir), ready in $(($(date +%s) - started)) s"

export DATABASE_URL="postgres://postgres@127.0.0.1:$port/postgres"
status=0
if [ $# -gt 0 ]; then
  npx vitest run "$@" || status=$?
else
  # delivery.test.ts is about the built front end's files (npm test builds them), not the database.
  npx vitest run tests/api tests/pg --exclude tests/api/delivery.test.ts || status=$?
fi
echo "test:pg: finished in $(($(date +%s) - started)) s (exit $status)"
exit "$status"
