#!/usr/bin/env bash
# Installs the Debian packages the tests use when they are missing: Chromium (browser tests,
# driven by playwright-core; never a downloaded browser), ngspice (the engine's reference
# simulator) and the PostgreSQL server. Needs root for apt-get; otherwise says what to install.
set -euo pipefail
missing=()
command -v chromium >/dev/null 2>&1 || missing+=(chromium)
command -v ngspice >/dev/null 2>&1 || missing+=(ngspice)
{ command -v pg_config >/dev/null 2>&1 && [ -x "$(pg_config --bindir)/initdb" ]; } ||
  ls /usr/lib/postgresql/*/bin/initdb >/dev/null 2>&1 || missing+=(postgresql)
[ ${#missing[@]} = 0 ] && exit 0
if [ "$(id -u)" != 0 ]; then
  echo "[setup] missing Debian packages: ${missing[*]} — install them (apt-get install ${missing[*]}) and retry" >&2
  exit 1
fi
echo "[setup] installing Debian packages: ${missing[*]}" >&2
export DEBIAN_FRONTEND=noninteractive
apt-get update -qq
apt-get install -y -qq "${missing[@]}" >/dev/null
