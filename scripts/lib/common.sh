# Shared helpers for scripts/start, scripts/test and scripts/db (sourced, not run).
# Every path is relative to the repository root so the scripts work from any clone.

ROOT="$(cd "$(dirname "${BASH_SOURCE[0]}")/../.." && pwd)"
DATA_DIR="${TRENCHWARD_DATA_DIR:-$ROOT/.data}"
export ROOT DATA_DIR

say() { printf '\033[1;34m[trenchward]\033[0m %s\n' "$*" >&2; }
die() { printf '\033[1;31m[trenchward]\033[0m %s\n' "$*" >&2; exit 1; }

# Install Debian packages that are missing; as root with apt-get, otherwise say what to install.
ensure_debian_packages() {
  local missing=() pkg
  for pkg in "$@"; do
    dpkg-query -W -f='${Status}' "$pkg" 2>/dev/null | grep -q 'install ok installed' || missing+=("$pkg")
  done
  [ ${#missing[@]} -eq 0 ] && return 0
  if [ "$(id -u)" -ne 0 ] || ! command -v apt-get >/dev/null 2>&1; then
    die "Missing Debian packages: ${missing[*]}. Install them with: sudo apt-get install -y --no-install-recommends ${missing[*]}"
  fi
  say "Installing Debian packages: ${missing[*]}"
  export DEBIAN_FRONTEND=noninteractive
  apt-get update -qq >"$DATA_DIR/apt.log" 2>&1 || true
  apt-get install -y -qq --no-install-recommends "${missing[@]}" >>"$DATA_DIR/apt.log" 2>&1 \
    || die "apt-get install failed; see $DATA_DIR/apt.log"
}

# Run `npm ci` when node_modules is missing or older than package-lock.json.
ensure_node_modules() {
  local stamp="$ROOT/node_modules/.trenchward-lock-hash" want have
  want="$(sha256sum "$ROOT/package-lock.json" | cut -d' ' -f1)"
  have="$(cat "$stamp" 2>/dev/null || true)"
  if [ "$want" != "$have" ] || [ ! -d "$ROOT/node_modules" ]; then
    say "Installing npm dependencies (npm ci)"
    (cd "$ROOT" && npm ci --no-audit --no-fund --loglevel=error) || die "npm ci failed"
    echo "$want" >"$stamp"
  fi
}

# A random secret for local use (hex, 32 bytes).
random_secret() { od -An -N32 -tx1 /dev/urandom | tr -d ' \n'; }

# Local secrets live in .data/local.env (created once, mode 600, never committed).
ensure_local_env() {
  mkdir -p "$DATA_DIR"
  local f="$DATA_DIR/local.env"
  if [ ! -f "$f" ]; then
    umask 077
    {
      echo "DB_USER=trenchward"
      echo "DB_PASSWORD=$(random_secret)"
      echo "SESSION_SECRET=$(random_secret)"
    } >"$f"
  fi
  # Keys for the local fake payment server (scripts/fake-payments.ts); added to older files too.
  if ! grep -q '^STRIPE_SECRET_KEY=' "$f"; then
    umask 077
    {
      echo "STRIPE_SECRET_KEY=sk_test_local_$(random_secret | cut -c1-24)"
      echo "STRIPE_WEBHOOK_SECRET=whsec_local_$(random_secret | cut -c1-32)"
    } >>"$f"
  fi
  set -a
  # shellcheck disable=SC1090
  . "$f"
  set +a
}

# Build the client into dist/client when its sources changed since the last build.
build_client_if_stale() {
  local stamp="$ROOT/dist/client/.source-hash" want have
  want="$(cd "$ROOT" && find src shared index.html vite.config.ts package-lock.json -type f -print0 2>/dev/null \
    | sort -z | xargs -0 sha256sum | sha256sum | cut -d' ' -f1)"
  have="$(cat "$stamp" 2>/dev/null || true)"
  if [ "$want" != "$have" ] || [ ! -f "$ROOT/dist/client/index.html" ]; then
    say "Building the client (vite build)"
    (cd "$ROOT" && npx vite build --logLevel warn) || die "client build failed"
    echo "$want" >"$stamp"
  fi
}

# Environment shared by the server, migrations and the seed script.
export_app_env() {
  ensure_local_env
  export DB_HOST=127.0.0.1 DB_PORT="${TRENCHWARD_DB_PORT:-3307}"
  export PROJECTED_EPSG="${PROJECTED_EPSG:-25832}"
}

tsnode() { node --import tsx "$@"; }
