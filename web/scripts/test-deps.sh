#!/usr/bin/env bash
# Installs what `make test` needs beyond Go: Debian chromium (browser tests), firefox-esr
# (Gecko tests), webkit2gtk-driver and xvfb (WebKit tests) and the pinned workerd from npm
# (worker tests). Each part is its own script so it can be run alone.
set -euo pipefail
cd "$(dirname "$0")/../.."
bash web/scripts/deps-chromium.sh
bash web/scripts/deps-gecko.sh
bash web/scripts/deps-webkit.sh
bash wasm/worker/deps-workerd.sh
