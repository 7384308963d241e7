#!/usr/bin/env bash
# Installs rotcap's build and test dependencies from Debian 12 packages, only those missing.
# Run as root (or with sudo available). Safe to run repeatedly.
set -euo pipefail
packages=(build-essential cmake libeigen3-dev libsuitesparse-dev libopenblas-dev libvtk9-dev
          libspdlog-dev libtomlplusplus-dev libcli11-dev nlohmann-json3-dev libspectra-dev
          libgtest-dev libhdf5-dev chromium poppler-utils libopenmpi-dev openmpi-bin)
missing=()
for p in "${packages[@]}"; do
  dpkg-query -W -f='${Status}' "$p" 2>/dev/null | grep -q "install ok installed" || missing+=("$p")
done
if [ ${#missing[@]} -eq 0 ]; then
  echo "install-deps: all ${#packages[@]} packages present"
  exit 0
fi
echo "install-deps: installing ${missing[*]}"
SUDO=""
[ "$(id -u)" -eq 0 ] || SUDO="sudo"
$SUDO apt-get update -qq
DEBIAN_FRONTEND=noninteractive $SUDO apt-get install -y -qq --no-install-recommends "${missing[@]}"
