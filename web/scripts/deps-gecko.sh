#!/usr/bin/env bash
# Makes sure the Gecko browser tests (build tag gecko) have their browser: Debian's
# firefox-esr, driven headless over WebDriver BiDi by saltcast/web/enginetest (no geckodriver
# needed). Fast and silent when it is there. As root it installs it with apt-get; otherwise it
# prints what to install and fails.
set -euo pipefail
if [ -x /usr/bin/firefox-esr ]; then
	exit 0
fi
if [ "$(id -u)" -ne 0 ]; then
	echo "deps-gecko: firefox-esr is missing; the Gecko browser tests need it." >&2
	echo "deps-gecko: install as root:  apt-get update && apt-get install -y firefox-esr" >&2
	exit 1
fi
echo "deps-gecko: installing firefox-esr with apt-get" >&2
export DEBIAN_FRONTEND=noninteractive
apt-get update -qq
# With Debian's recommended packages (fonts, Mesa's software GL, xauth): the suites were
# written and tested with them, and a bare X server or browser without fonts is not what
# a tablet shows.
apt-get install -y -qq firefox-esr >/dev/null
[ -x /usr/bin/firefox-esr ] || { echo "deps-gecko: firefox-esr still missing after apt-get" >&2; exit 1; }
