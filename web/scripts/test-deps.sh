#!/usr/bin/env bash
# Installs what `make test` needs beyond Go: Debian chromium (browser tests) and the pinned
# workerd from npm (worker tests). Each part is its own script so it can be run alone.
set -euo pipefail
cd "$(dirname "$0")/../.."
bash web/scripts/deps-chromium.sh
bash wasm/worker/deps-workerd.sh
