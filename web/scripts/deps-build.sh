#!/usr/bin/env bash
# Makes sure `make build` has zopfli, web/bundle's gzip: about 5 % smaller than Go's
# compress/gzip, which is what keeps dist/saltcast.html under its 1.5 MB limit (measured
# 2026-12-01: 1.45 MB with zopfli, 1.52 MB without). Fast and silent when it is there. As root
# it installs it with apt-get; otherwise it says what to install and the build goes on with
# Go's gzip (the page then works the same, it is only larger).
set -uo pipefail
command -v zopfli >/dev/null 2>&1 && exit 0
if [ "$(id -u)" -eq 0 ] && command -v apt-get >/dev/null 2>&1; then
	echo "deps-build: installing zopfli with apt-get" >&2
	export DEBIAN_FRONTEND=noninteractive
	{ apt-get update -qq && apt-get install -y -qq --no-install-recommends zopfli >/dev/null; } ||
		echo "deps-build: apt-get could not install zopfli; building with Go's gzip (page above 1.5 MB)" >&2
else
	echo "deps-build: zopfli is missing; install it (apt-get install zopfli) to keep the page under 1.5 MB; building with Go's gzip" >&2
fi
exit 0
