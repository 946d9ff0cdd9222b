//go:build !(js && wasm)

package main

import "net/http"

// NewHandler returns the worker's handler as a net/http one: for the host build
// (main_other.go) and the in-process tests. The js/wasm build never links this file.
func NewHandler(opt Options) http.Handler { return httpHandler{newHandler(opt)} }

type httpHandler struct{ h *handler }

func (a httpHandler) ServeHTTP(w http.ResponseWriter, r *http.Request) {
	req := &Request{Method: r.Method, Path: r.URL.Path, RawQuery: r.URL.RawQuery,
		ContentLength: r.ContentLength, Header: r.Header}
	if r.Body != nil {
		req.Body = r.Body
	}
	a.h.Serve(&httpWriter{w: w, hdr: Header{}}, req)
}

// httpWriter hands the handler's headers to net/http when the status is written.
type httpWriter struct {
	w     http.ResponseWriter
	hdr   Header
	wrote bool
}

func (w *httpWriter) Header() Header { return w.hdr }

func (w *httpWriter) WriteHeader(status int) {
	if w.wrote {
		return
	}
	w.wrote = true
	out := w.w.Header()
	for name, values := range w.hdr {
		out[http.CanonicalHeaderKey(name)] = values
	}
	w.w.WriteHeader(status)
}

func (w *httpWriter) Write(p []byte) (int, error) {
	w.WriteHeader(statusOK)
	return w.w.Write(p)
}
