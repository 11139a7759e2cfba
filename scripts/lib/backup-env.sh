# Settings shared by scripts/backup and scripts/restore (sourced after common.sh).
if [ -z "${DB_PASSWORD:-}" ] && [ -f "$DATA_DIR/local.env" ]; then
  set -a
  # shellcheck disable=SC1091
  . "$DATA_DIR/local.env"
  set +a
fi
DB_HOST="${DB_HOST:-127.0.0.1}"
DB_PORT="${DB_PORT:-${TRENCHWARD_DB_PORT:-3307}}"
DB_NAME="${DB_NAME:-trenchward}"
[[ "$DB_NAME" =~ ^[A-Za-z0-9_]+$ ]] || die "DB_NAME must be letters, digits and _"
: "${DB_USER:?DB_USER is not set}"
: "${DB_PASSWORD:?DB_PASSWORD is not set}"


# The folder of one file part, resolved as server/config.ts does.
part_dir() {
  case "$1" in
    uploads) echo "${UPLOAD_DIR:-$DATA_DIR/uploads}" ;;
    permits) echo "${PERMIT_DIR:-$DATA_DIR/permits}" ;;
    keys) echo "${KEY_DIR:-$DATA_DIR/keys}" ;;
  esac
}

# A MariaDB client as the app user over TCP; the password travels in the environment only.
db_client() {
  local tool="$1"
  shift
  MYSQL_PWD="$DB_PASSWORD" "$tool" --no-defaults --host="$DB_HOST" --port="$DB_PORT" \
    --user="$DB_USER" "$@"
}

# "table rows" per line, exact counts, in name order.
table_row_counts() {
  local t
  for t in $(db_client mariadb -N -B -e "SELECT table_name FROM information_schema.tables WHERE table_schema = DATABASE() AND table_type = 'BASE TABLE' ORDER BY table_name" "$DB_NAME"); do
    echo "$t $(db_client mariadb -N -B -e "SELECT COUNT(*) FROM \`$t\`" "$DB_NAME")"
  done
}
