#!/usr/bin/env bash
# Reference tools the tests check against, from Debian's packages.
set -euo pipefail
source "$(dirname "$0")/common.sh"
# Build toolchains for the images, then the emulators and reference tools the tests check against.
apt_ensure postgresql curl "${FIRMWARE_TOOLCHAINS[@]}" ngspice simavr libsimavr-dev gpsim mspdebug python3-unicorn chromium gcc libc6-dev
