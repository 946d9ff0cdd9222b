// Command worker is Saltcast's shared lab service on Cloudflare Workers: HTTP glue around
// web/api, so the worker, the CLI and the browser give byte-identical answers.
//
// Built with GOOS=js GOARCH=wasm by wasm/worker/build.sh, it is started by glue/worker.mjs,
// which keeps one Go program per isolate; main_js.go turns the runtime's Request objects into
// the handler's own small Request and its answer into a Response, so the js/wasm build links
// neither net/http nor net/url. Built for the host it serves the same handler with net/http
// for debugging (`go run ./wasm/worker`, 127.0.0.1:8788).
//
// Routes (described for clients in openapi.json, served at /api/v1/openapi.json):
//
//	GET  /                      the single-file app, with a Content-Security-Policy
//	POST /api/v1/plan           a recipe in, the plan out
//	GET  /api/v1/solubility     ?solute=KNO3&temp_C=20
//	GET|POST /api/v1/gas        dissolved gas at saturation (POST: the same keys in a JSON object)
//	GET  /api/v1/gas/outgas     gas given off on heating
//	GET  /api/v1/gas/table      a printable oxygen-saturation table
//	GET  /api/v1/compounds      the built-in library
//	GET  /api/v1/openapi.json   the OpenAPI 3.1 description
//
// Bodies are at most 64 KiB (413 beyond). Every bad request is answered 4xx with
// {"error": "...", "field": "..."}; a 500 means a bug in Saltcast, never bad input.
// CORS is off unless SALTCAST_ALLOW_ORIGIN names an origin (or "*").
package main
