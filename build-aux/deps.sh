#!/usr/bin/env bash
# deps.sh: installs the Debian 12 packages Basinwright builds, tests and runs with, when missing.
# Sourced by build-aux/run and build-aux/test; safe to run again (installs nothing when all present).
set -euo pipefail

BW_PACKAGES=(
  # build
  gcc libc6-dev pkg-config meson ninja-build
  libglib2.0-dev libgtk-4-dev libcairo2-dev libpango1.0-dev libxml2-dev libxml2-utils
  # tests
  check python3 python3-iapws python3-fluids python3-numpy units
  poppler-utils librsvg2-bin xvfb xauth xdotool
  desktop-file-utils appstream-util gettext
  # the install check (build-aux/test-install): launcher, GIO, MIME and icon caches
  libgtk-4-bin libglib2.0-bin xdg-utils shared-mime-info
  # translations: msgfmt/xgettext (gettext), and the es_ES source data that localedef builds
  # the Spanish test locale from (locales)
  locales
)

bw_install_deps () {
  local missing=() pkg status
  for pkg in "${BW_PACKAGES[@]}"; do
    status=$(dpkg-query -W -f='${db:Status-Abbrev}' "$pkg" 2>/dev/null || true)
    [[ "$status" == ii* ]] || missing+=("$pkg")
  done
  if [ ${#missing[@]} -eq 0 ]; then
    return 0
  fi
  echo "build-aux: installing ${missing[*]}"
  local sudo=()
  if [ "$(id -u)" -ne 0 ]; then
    command -v sudo >/dev/null || { echo "build-aux: need root or sudo to install: ${missing[*]}" >&2; return 1; }
    sudo=(sudo)
  fi
  export DEBIAN_FRONTEND=noninteractive
  "${sudo[@]}" apt-get update -qq
  "${sudo[@]}" apt-get install -y -qq --no-install-recommends "${missing[@]}" </dev/null
}
