//go:build js && wasm

package main

import (
	"net/http"
	"syscall/js"

	"github.com/syumai/workers"
)

// rawBodyWriter is the response writer of github.com/syumai/workers, which can answer with a
// JS value as the body (its own interface is internal to that module).
type rawBodyWriter interface {
	WriteRawJSBody(body js.Value)
}

func main() {
	// glue/worker.mjs passes {env, ctx, binding, page}; see the limits noted there.
	runtime := js.Global().Get("context")
	page := runtime.Get("page") // the text module saltcast.html, a JS string
	opt := Options{AllowOrigin: stringOf(runtime.Get("env").Get("SALTCAST_ALLOW_ORIGIN"))}
	if page.Type() == js.TypeString {
		opt.Page = []byte(page.String())
		opt.WritePage = func(w http.ResponseWriter) bool {
			raw, ok := w.(rawBodyWriter)
			if !ok {
				return false
			}
			w.WriteHeader(http.StatusOK)
			raw.WriteRawJSBody(page)
			return true
		}
	}
	workers.ServeNonBlock(NewHandler(opt))
	workers.Ready()
	// Stay alive for the isolate's later requests instead of returning after the first one
	// (workers.Serve's behaviour, made for its one-program-per-request glue).
	select {}
}

func stringOf(v js.Value) string {
	if v.Type() != js.TypeString {
		return ""
	}
	return v.String()
}
