#!/usr/bin/env bash
# Makes sure `make build` has its packers: xz (xz-utils), whose LZMA packs the module about a
# quarter smaller than the best gzip and keeps dist/saltcast.html under its 1.15 MB limit
# (measured 2026-12-02: 0.99 MB with xz, 1.28 MB with zopfli's gzip), and zopfli, the gzip
# used when xz is missing. Fast and silent when both are there. As root it installs what is
# missing with apt-get; otherwise it says what to install and the build goes on with what it
# has (the page then works the same, it is only larger).
set -uo pipefail
missing=()
command -v xz >/dev/null 2>&1 || missing+=(xz-utils)
command -v zopfli >/dev/null 2>&1 || missing+=(zopfli)
[ ${#missing[@]} -eq 0 ] && exit 0
if [ "$(id -u)" -eq 0 ] && command -v apt-get >/dev/null 2>&1; then
	echo "deps-build: installing ${missing[*]} with apt-get" >&2
	export DEBIAN_FRONTEND=noninteractive
	{ apt-get update -qq && apt-get install -y -qq --no-install-recommends "${missing[@]}" >/dev/null; } ||
		echo "deps-build: apt-get could not install ${missing[*]}; building with what is here (larger page)" >&2
else
	echo "deps-build: ${missing[*]} missing; install them (apt-get install ${missing[*]}) to keep the page small" >&2
fi
exit 0
