# PostgreSQL's programs, for the scripts in db/ (sourced, not run).
# Debian installs them under /usr/lib/postgresql/<major>/bin; the newest major wins.

# The bin folder of the newest installed server that has program $1 (initdb by default).
pg_bin_dir() {
  local d
  for d in $(ls -d /usr/lib/postgresql/*/bin 2>/dev/null | sort -V -r); do
    if [ -x "$d/${1:-initdb}" ]; then echo "$d"; return 0; fi
  done
  return 1
}

# The path of client program $1 (pg_dump, pg_restore, psql): from the newest server, else from PATH.
pg_tool() {
  local d
  if d="$(pg_bin_dir "$1")"; then echo "$d/$1"; return 0; fi
  command -v "$1" || { echo "$1 not found: install Debian's postgresql-client package." >&2; return 1; }
}
