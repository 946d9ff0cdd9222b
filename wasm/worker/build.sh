#!/usr/bin/env bash
# Builds the Cloudflare Workers bundle into build/worker/ (called by `make worker`):
#   app.wasm       the Go program of wasm/worker (GOOS=js GOARCH=wasm, stripped, -trimpath, no
#                  inlining), its data segments merged by web/cmd/wasmpack (smaller once compressed)
#   wasm_exec.js   Go's JS support, as patched by github.com/syumai/workers' workers-assets-gen
#   worker.mjs     Saltcast's own entry module (wasm/worker/glue), one Go instance per isolate
#   saltcast.html  the single-file app served at GET / (dist/saltcast.html as web/offline serves it:
#                  with a manifest link and the service worker's install script; built if missing)
#   sw.txt, manifest.webmanifest, icons/*.png   the installable offline copy (web/offline)
# Fast when nothing changed (Go's build cache); prints the sizes measured against the plan limits.
set -euo pipefail
cd "$(dirname "$0")/../.."
GO=${GO:-go}
out=build/worker

if [ ! -f dist/saltcast.html ]; then
	echo "build-worker: dist/saltcast.html missing; running make build" >&2
	make --no-print-directory build || echo "build-worker: make build failed; GET / will serve a placeholder page" >&2
fi

# workers-assets-gen clears its output directory, so it writes to a scratch one.
gen=build/worker-gen
"$GO" run github.com/syumai/workers/cmd/workers-assets-gen -mode=go -o "$gen"
mkdir -p "$out"
cp "$gen/wasm_exec.js" "$out/wasm_exec.js"
rm -rf "$gen"
cp wasm/worker/glue/worker.mjs "$out/worker.mjs"

# -gcflags=all=-l (no inlining), as for the page: app.wasm gzip 1 066 142 → 949 800 B; no
# difference in cold start or per-request CPU this machine resolves (wasm/worker/README.md).
GOOS=js GOARCH=wasm "$GO" build -trimpath -gcflags=all=-l -ldflags="-s -w" -o "$out/app.wasm.link" ./wasm/worker
"$GO" run ./web/cmd/wasmpack "$out/app.wasm.link" "$out/app.wasm.tmp"
rm "$out/app.wasm.link"
mv "$out/app.wasm.tmp" "$out/app.wasm"

# The page as served (with the manifest link and the script that installs the service
# worker), sw.txt, the manifest and the icons: the installable offline copy (web/offline).
if [ -f dist/saltcast.html ]; then
	"$GO" run ./web/offline -page dist/saltcast.html -out "$out"
else
	"$GO" run ./web/offline -page "" -out "$out"
	cat >"$out/saltcast.html" <<'HTML'
<!doctype html>
<html lang="en"><head><meta charset="utf-8"><title>Saltcast: app not built</title></head>
<body><h1>Saltcast</h1><p>The single-file app was not built into this worker. Run
<code>make build worker</code> and deploy again. The JSON API under /api/v1/ works.</p></body></html>
HTML
fi

gz() { gzip -9c "$1" | wc -c; }
total=$(cat "$out"/worker.mjs "$out"/wasm_exec.js "$out"/app.wasm "$out"/saltcast.html "$out"/sw.txt \
	"$out"/manifest.webmanifest "$out"/icons/*.png | gzip -9c | wc -c)
printf 'build-worker: %s app.wasm %d B (gzip %d), saltcast.html %d B (gzip %d); bundle gzip %d B\n' \
	"$out" "$(wc -c <"$out/app.wasm")" "$(gz "$out/app.wasm")" \
	"$(wc -c <"$out/saltcast.html")" "$(gz "$out/saltcast.html")" "$total"
