#!/usr/bin/env bash
# Installs Debian's chromium for the report's browser test (test/report/browser.test.ts) when it
# is missing. Called by .ci/run; needs root (apt-get). Safe to run twice.
set -euo pipefail
if [ -x /usr/bin/chromium ]; then
  echo "chromium: $(/usr/bin/chromium --version 2>/dev/null || echo present)"
  exit 0
fi
export DEBIAN_FRONTEND=noninteractive
apt-get update -qq
apt-get install -y -qq --no-install-recommends chromium
if [ ! -x /usr/bin/chromium ]; then
  echo "error: apt-get installed chromium but /usr/bin/chromium is missing" >&2
  exit 1
fi
echo "chromium: $(/usr/bin/chromium --version 2>/dev/null || echo installed)"
