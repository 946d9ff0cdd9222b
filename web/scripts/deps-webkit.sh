#!/usr/bin/env bash
# Makes sure the WebKit browser tests (build tag webkit) have their engine: Debian's
# webkit2gtk-driver (WebKitWebDriver, and WebKitGTK's MiniBrowser, which it drives) and xvfb
# (the virtual X display MiniBrowser is shown on). Fast and silent when all are there. As root
# it installs them with apt-get; otherwise it prints what to install and fails.
set -euo pipefail
minibrowser() { ls /usr/lib/*/webkit2gtk-4.1/MiniBrowser 2>/dev/null | head -n 1; }
missing=()
[ -x /usr/bin/WebKitWebDriver ] && [ -n "$(minibrowser)" ] || missing+=(webkit2gtk-driver)
[ -x /usr/bin/Xvfb ] || missing+=(xvfb)
if [ ${#missing[@]} -eq 0 ]; then
	exit 0
fi
if [ "$(id -u)" -ne 0 ]; then
	echo "deps-webkit: missing ${missing[*]}; the WebKit browser tests need them." >&2
	echo "deps-webkit: install as root:  apt-get update && apt-get install -y ${missing[*]}" >&2
	exit 1
fi
echo "deps-webkit: installing ${missing[*]} with apt-get" >&2
export DEBIAN_FRONTEND=noninteractive
apt-get update -qq
# With Debian's recommended packages (fonts, Mesa's software GL, xauth): the suites were
# written and tested with them, and a bare X server or browser without fonts is not what
# a tablet shows.
apt-get install -y -qq "${missing[@]}" >/dev/null
for f in /usr/bin/WebKitWebDriver "$(minibrowser)" /usr/bin/Xvfb; do
	[ -x "$f" ] || { echo "deps-webkit: $f still missing after apt-get" >&2; exit 1; }
done
