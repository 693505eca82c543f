#!/usr/bin/env bash
# Reference tools the tests check against, from Debian's packages.
set -euo pipefail
source "$(dirname "$0")/common.sh"
apt_ensure postgresql curl ngspice gcc-avr avr-libc binutils-avr simavr libsimavr-dev gcc-arm-none-eabi chromium gcc libc6-dev
