#!/usr/bin/env bash
# Runs every fuzz target in the repository for a short, bounded time (called by `make test`).
# Targets are found by grep, so a new `func FuzzX(f *testing.F)` in any *_test.go is included
# without editing this script. Files fenced to js/wasm are skipped (they do not run on the
# host); the browser and workerd tags are set, so a target in a file fenced by them is found
# and built too (-run '^$' runs no browser or worker test). FUZZTIME sets the time per target (default 10s), e.g. FUZZTIME=1m bash web/scripts/fuzz-short.sh.
set -euo pipefail
cd "$(dirname "$0")/../.."
export PATH=/usr/local/go/bin:$PATH
fuzztime="${FUZZTIME:-10s}"
tags=browser,workerd
failed=0
log="$(mktemp)"
trap 'rm -f "$log"' EXIT
count=0
while IFS= read -r file; do
	# A file built only for js/wasm is skipped; one fenced away from it (!(js && wasm)) runs.
	if head -n 5 "$file" | grep '^//go:build.*js' | grep -vq '!'; then
		continue
	fi
	dir="./$(dirname "$file")"
	for target in $(grep -oE '^func (Fuzz[A-Za-z0-9_]*)\(' "$file" | sed -E 's/^func (Fuzz[A-Za-z0-9_]*)\(/\1/'); do
		count=$((count + 1))
		echo "fuzz $dir $target ($fuzztime)"
		before=$( (ls "$dir/testdata/fuzz/$target" 2>/dev/null || true) | wc -l)
		ok=0
		for try in 1 2; do
			if go test -tags "$tags" -run '^$' -fuzz "^${target}\$" -fuzztime "$fuzztime" -fuzzminimizetime 0 "$dir" >"$log" 2>&1; then
				ok=1
				break
			fi
			# Go's fuzzing engine can end with "context deadline exceeded" when a worker is
			# still busy (e.g. minimizing a new, passing input) as the time runs out; it saves
			# no input then. -fuzzminimizetime 0 turns minimizing off for these short runs (a
			# failing input is still saved, just not shrunk), and such a run is tried once
			# more; a real failure saves its input and is not retried.
			after=$( (ls "$dir/testdata/fuzz/$target" 2>/dev/null || true) | wc -l)
			if [ "$try" = 1 ] && [ "$after" = "$before" ] && grep -q 'context deadline exceeded' "$log"; then
				echo "fuzz $dir $target: the engine timed out at its deadline with no failing input; once more"
				continue
			fi
			break
		done
		if [ "$ok" = 0 ]; then
			cat "$log"
			echo "FAIL: $dir $target (a failing input is saved under $dir/testdata/fuzz/$target)"
			failed=1
		fi
	done
done < <(grep -rlE --include='*_test.go' '^func Fuzz[A-Za-z0-9_]*\(' --exclude-dir=node_modules --exclude-dir=.git --exclude-dir=build --exclude-dir=dist . | sed 's|^\./||' | sort)
echo "fuzz: $count targets, ${fuzztime} each"
exit "$failed"
