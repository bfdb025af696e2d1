#!/usr/bin/env bash
# npm start: install what is missing, then run the app with its own MariaDB and demo data.
set -euo pipefail
cd "$(dirname "$0")/.."
source scripts/lib/bootstrap.sh
ensure_mariadb
ensure_node_modules
exec node --import tsx scripts/start.ts "$@"
