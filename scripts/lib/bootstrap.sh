# Shared by start.sh and test.sh: install what is missing, or say exactly what to run.
# Sourced, not executed.

as_root() {
  if [ "$(id -u)" -eq 0 ]; then "$@"; return; fi
  echo "Gaugeline needs: $*" >&2
  echo "Run it as root (for example: sudo $*), then run this command again." >&2
  exit 1
}

apt_install() {
  if [ "$(id -u)" -ne 0 ]; then
    echo "Missing Debian package(s): $*" >&2
    echo "Install them with: sudo apt-get update && sudo apt-get install -y $*" >&2
    exit 1
  fi
  if [ -z "${GAUGELINE_APT_UPDATED:-}" ]; then
    echo "Updating Debian's package lists..."
    DEBIAN_FRONTEND=noninteractive apt-get update -qq
    GAUGELINE_APT_UPDATED=1
  fi
  echo "Installing Debian package(s): $* ..."
  DEBIAN_FRONTEND=noninteractive apt-get install -y -qq --no-install-recommends "$@" >/dev/null
}

ensure_mariadb() {
  if command -v mariadbd >/dev/null 2>&1 || [ -x /usr/sbin/mariadbd ]; then
    if command -v mariadb-install-db >/dev/null 2>&1; then return; fi
  fi
  apt_install mariadb-server mariadb-client
}

ensure_chromium() {
  if [ -x /usr/bin/chromium ]; then return; fi
  apt_install chromium
}

# The export tests validate every BCF XML file against the buildingSMART schemas.
ensure_xmllint() {
  command -v xmllint >/dev/null || apt_install libxml2-utils
}

# npm ci when node_modules is missing or was installed from another lock file.
ensure_node_modules() {
  local want have=""
  want=$(sha256sum package-lock.json | cut -d' ' -f1)
  [ -f node_modules/.gaugeline-lock ] && have=$(cat node_modules/.gaugeline-lock)
  if [ ! -d node_modules ] || [ "$want" != "$have" ]; then
    echo "Installing node modules (npm ci)..."
    npm ci --no-audit --no-fund --loglevel=error
    echo "$want" > node_modules/.gaugeline-lock
  fi
}
