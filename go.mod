module saltcast

go 1.26

require (
	github.com/chromedp/cdproto v0.159.0 // indirect
	github.com/chromedp/chromedp v0.23.0 // indirect
	github.com/go-json-experiment/json v0.0.0-20260213210345-44df1a37e875 // indirect
	github.com/syumai/workers v0.33.0 // indirect
	honnef.co/go/js/dom/v2 v2.0.0-20231112215516-51f43a291193 // indirect
)

// wasm/worker/build.sh takes Go's wasm_exec.js, as patched for Workers, from this generator;
// the worker's Go program itself does not import github.com/syumai/workers.
tool github.com/syumai/workers/cmd/workers-assets-gen
