#!/usr/bin/env bash
# Installs the Debian packages Patchwise needs when they are missing: PostgreSQL with the matching
# PostGIS, and (with --browser) Chromium for the browser tests. Safe to run again: it only installs what is absent.
set -euo pipefail

want_browser=false
[[ "${1:-}" == "--browser" ]] && want_browser=true

missing=()
pg_major() { ls /usr/lib/postgresql 2>/dev/null | sort -n | tail -1; }

if [[ -z "$(pg_major)" || ! -x "/usr/lib/postgresql/$(pg_major)/bin/postgres" ]]; then
  missing+=(postgresql)
fi

if $want_browser && [[ ! -x /usr/bin/chromium ]]; then
  missing+=(chromium)
fi

install() {
  if [[ "$(id -u)" -ne 0 ]]; then
    if command -v sudo >/dev/null && sudo -n true 2>/dev/null; then
      sudo env DEBIAN_FRONTEND=noninteractive apt-get update -qq
      sudo env DEBIAN_FRONTEND=noninteractive apt-get install -y -qq "$@"
      return
    fi
    echo "Patchwise needs these Debian packages: $*" >&2
    echo "Install them with: sudo apt-get update && sudo apt-get install -y $*" >&2
    exit 1
  fi
  DEBIAN_FRONTEND=noninteractive apt-get update -qq
  DEBIAN_FRONTEND=noninteractive apt-get install -y -qq "$@" >/dev/null
}

if (( ${#missing[@]} )); then
  echo "Installing ${missing[*]} (first run on this machine)…"
  install "${missing[@]}"
fi

# PostGIS must match the server's major version, which is only known once the server is in.
major="$(pg_major)"
if [[ ! -f "/usr/share/postgresql/$major/extension/postgis.control" ]]; then
  echo "Installing PostGIS for PostgreSQL $major…"
  install "postgresql-$major-postgis-3"
fi
