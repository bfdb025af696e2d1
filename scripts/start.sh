#!/usr/bin/env bash
# npm start: install what is missing, then run the app with its own MariaDB and demo data.
set -euo pipefail
cd "$(dirname "$0")/.."
source scripts/lib/bootstrap.sh
ensure_mariadb
ensure_node_modules
# Two malloc arenas instead of eight per core: the app's threads (requests, import worker, reader
# thread, libuv) otherwise each keep freed memory in an arena of their own (decision 0016).
export MALLOC_ARENA_MAX="${MALLOC_ARENA_MAX:-2}"
exec node --import tsx scripts/start.ts "$@"
