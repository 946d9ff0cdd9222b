#!/usr/bin/env bash
# Installs the pinned workerd (Cloudflare's Workers runtime) from the npm registry into
# wasm/worker/node_modules/, for `make worker-run` and the worker tests. The version is pinned in
# package.json and package-lock.json; the Linux binary ships inside the npm package, so
# nothing else is downloaded. Does nothing when the pinned version is already installed.
set -euo pipefail
cd "$(dirname "$0")"

want=$(sed -n 's/.*"workerd": *"\([0-9.]*\)".*/\1/p' package.json | head -n1)
if [ -z "$want" ]; then
	echo "deps-workerd: no pinned workerd version in package.json" >&2
	exit 1
fi

have=""
if [ -f node_modules/workerd/package.json ]; then
	have=$(sed -n 's/^ *"version": *"\([^"]*\)".*/\1/p' node_modules/workerd/package.json | head -n1)
fi
if [ "$have" = "$want" ] && ./node_modules/.bin/workerd --version >/dev/null 2>&1; then
	echo "deps-workerd: workerd $want already installed"
	exit 0
fi

if ! command -v npm >/dev/null 2>&1; then
	echo "deps-workerd: npm not found; installing Debian's nodejs and npm" >&2
	apt-get update -qq
	DEBIAN_FRONTEND=noninteractive apt-get install -y -qq nodejs npm
fi

npm ci --no-audit --no-fund --loglevel=error
./node_modules/.bin/workerd --version
