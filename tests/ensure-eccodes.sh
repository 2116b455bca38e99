#!/usr/bin/env bash
# GRIB2 and BUFR intake (and their tests) run ECMWF's ecCodes tools from Debian's
# libeccodes-tools package. Install it when missing.
set -euo pipefail
if command -v grib_get_data >/dev/null 2>&1 && command -v bufr_dump >/dev/null 2>&1; then exit 0; fi
echo "Installing Debian's libeccodes-tools (ecCodes) for GRIB2/BUFR intake…"
SUDO=""
if [ "$(id -u)" != "0" ]; then SUDO="sudo"; fi
$SUDO apt-get update -qq
DEBIAN_FRONTEND=noninteractive $SUDO apt-get install -y -qq libeccodes-tools >/dev/null
codes_info -v
