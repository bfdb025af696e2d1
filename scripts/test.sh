#!/usr/bin/env bash
# npm test: install what is missing, then run every suite against a throwaway MariaDB.
set -euo pipefail
cd "$(dirname "$0")/.."
source scripts/lib/bootstrap.sh
ensure_mariadb
ensure_chromium
ensure_xmllint
ensure_node_modules
exec node --import tsx scripts/test.ts "$@"
