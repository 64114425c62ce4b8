# Shared set-up steps for scripts/start.sh and scripts/test.sh (sourced, not run).

ROOT="$(cd "$(dirname "${BASH_SOURCE[0]}")/.." && pwd)"
export NEXT_TELEMETRY_DISABLED=1

say() { printf '\033[1;36m▸ %s\033[0m\n' "$*"; }

as_root() { [ "$(id -u)" = "0" ]; }

apt_install() {
  local SUDO=""
  as_root || SUDO="sudo"
  if [ -z "${SAGLINE_APT_UPDATED:-}" ]; then $SUDO apt-get update -qq; export SAGLINE_APT_UPDATED=1; fi
  DEBIAN_FRONTEND=noninteractive $SUDO apt-get install -y -qq "$@" >/dev/null
}

# npm packages: install when node_modules is missing or older than the lock file.
ensure_node_modules() {
  cd "$ROOT"
  local stamp="node_modules/.package-lock.json"
  if [ ! -f "$stamp" ] || [ package-lock.json -nt "$stamp" ] || [ package.json -nt "$stamp" ]; then
    say "Installing npm packages (npm ci)"
    npm ci --no-audit --no-fund --loglevel=error
  fi
}

# A stable secret for next-auth, kept in the git-ignored data folder.
ensure_secret() {
  if [ -z "${NEXTAUTH_SECRET:-}" ]; then
    mkdir -p "$ROOT/.data"
    [ -s "$ROOT/.data/nextauth-secret" ] || node -e 'process.stdout.write(require("crypto").randomBytes(32).toString("base64url"))' >"$ROOT/.data/nextauth-secret"
    NEXTAUTH_SECRET="$(cat "$ROOT/.data/nextauth-secret")"
    export NEXTAUTH_SECRET
  fi
}
