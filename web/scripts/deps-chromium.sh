#!/usr/bin/env bash
# Makes sure the browser tests and the page build have their tools: Debian's chromium (the
# headless browser chromedp drives), xz (xz-utils: web/bundle packs the module with its LZMA,
# and web/loader_test.go checks the loader against it), zopfli (the gzip fallback, measured by
# make bench) and binaryen (wasm-as: web/loader_test.go checks the unpacker's bytes in
# web/loader.js against web/unlzma.wat; wasm-opt, for measuring with -wasm-opt).
# Fast and silent when all are there.
# As root it installs them with apt-get; otherwise it prints what to install and fails.
set -euo pipefail

missing=()
command -v chromium >/dev/null 2>&1 || missing+=(chromium)
command -v zopfli >/dev/null 2>&1 || missing+=(zopfli)
command -v xz >/dev/null 2>&1 || missing+=(xz-utils)
{ command -v wasm-opt && command -v wasm-as; } >/dev/null 2>&1 || missing+=(binaryen)
if [ ${#missing[@]} -eq 0 ]; then
	exit 0
fi

if [ "$(id -u)" -ne 0 ]; then
	echo "deps-chromium: missing ${missing[*]}; the browser tests need them." >&2
	echo "deps-chromium: install as root:  apt-get update && apt-get install -y ${missing[*]}" >&2
	exit 1
fi

echo "deps-chromium: installing ${missing[*]} with apt-get" >&2
export DEBIAN_FRONTEND=noninteractive
apt-get update -qq
apt-get install -y -qq --no-install-recommends "${missing[@]}" >/dev/null
command -v chromium >/dev/null 2>&1 || { echo "deps-chromium: chromium still missing after apt-get" >&2; exit 1; }
