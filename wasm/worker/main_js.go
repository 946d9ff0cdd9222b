//go:build js && wasm

package main

import (
	"bytes"
	"errors"
	"io"
	"net/http"
	"syscall/js"

	"github.com/syumai/workers"
)

func main() {
	// glue/worker.mjs passes {env, ctx, binding, page, files}; see the limits noted there.
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
	opt.Files = staticFiles(runtime.Get("files"))
	workers.ServeNonBlock(leakFree{NewHandler(opt)})
	workers.Ready()
	// Stay alive for the isolate's later requests instead of returning after the first one
	// (workers.Serve's behaviour, made for its one-program-per-request glue).
	select {}
}

// staticFiles reads the files of the installable copy that glue/worker.mjs passes, by path:
// text modules arrive as strings, data modules (the icons) as ArrayBuffers.
func staticFiles(files js.Value) map[string]Static {
	if files.Type() != js.TypeObject {
		return nil
	}
	out := map[string]Static{}
	keys := js.Global().Get("Object").Call("keys", files)
	for i := range keys.Length() {
		path := keys.Index(i).String()
		v := files.Get(path)
		ct := StaticType(path)
		if ct == "" {
			continue
		}
		var body []byte
		if v.Type() == js.TypeString {
			body = []byte(v.String())
		} else {
			u8 := js.Global().Get("Uint8Array").New(v)
			body = make([]byte, u8.Length())
			js.CopyBytesToGo(body, u8)
		}
		out[path] = Static{Body: body, ContentType: ct}
	}
	return out
}

// rawBodyWriter is the response writer of github.com/syumai/workers, which can answer with a
// JS value as the body; rawBodyGetter is its request body, which can give the JS stream.
// (Its own interfaces are internal to that module.)
type (
	rawBodyWriter interface{ WriteRawJSBody(body js.Value) }
	rawBodyGetter interface{ GetRawJSBody() js.Value }
)

// leakFree moves request and response bodies between JS and Go in one piece each.
//
// github.com/syumai/workers v0.33.0 streams bodies: a response through a ReadableStream whose
// pull and cancel callbacks (js.FuncOf, with a 16 KiB buffer) are never released, and a
// request chunk by chunk, leaking one callback per chunk. Its own glue starts a Go program
// per request, so that never shows; with one Go program per isolate the Go memory grew from
// 14 to 35.5 MiB and Go's table of JS references from 20 585 to 112 913 over 18 000 requests
// (measured 2026-12-01). Moving whole bodies, both stay flat (11.25 MiB, about 2 100).
// Saltcast's bodies are small (≤ 64 KiB in, tens of KiB out), so this costs nothing.
type leakFree struct{ h http.Handler }

func (l leakFree) ServeHTTP(w http.ResponseWriter, r *http.Request) {
	raw, ok := w.(rawBodyWriter)
	if !ok { // not syumai's writer: nothing to work around
		l.h.ServeHTTP(w, r)
		return
	}
	if g, ok := r.Body.(rawBodyGetter); ok {
		r.Body = &jsBody{stream: g.GetRawJSBody()}
	}
	bw := &bufferedWriter{ResponseWriter: w, raw: raw, status: http.StatusOK}
	defer bw.finish()
	l.h.ServeHTTP(bw, r)
}

// bufferedWriter collects the response and hands it to JS as one Uint8Array.
type bufferedWriter struct {
	http.ResponseWriter
	raw         rawBodyWriter
	buf         bytes.Buffer
	status      int
	wroteHeader bool
	rawSet      bool
}

func (w *bufferedWriter) WriteHeader(status int) {
	if !w.wroteHeader {
		w.status, w.wroteHeader = status, true
	}
}

func (w *bufferedWriter) Write(p []byte) (int, error) {
	w.WriteHeader(http.StatusOK)
	return w.buf.Write(p)
}

func (w *bufferedWriter) WriteRawJSBody(body js.Value) {
	w.rawSet = true
	w.raw.WriteRawJSBody(body)
}

func (w *bufferedWriter) finish() {
	w.ResponseWriter.WriteHeader(w.status)
	if w.rawSet {
		return
	}
	if w.buf.Len() == 0 {
		w.raw.WriteRawJSBody(js.Null())
		return
	}
	a := js.Global().Get("Uint8Array").New(w.buf.Len())
	js.CopyBytesToJS(a, w.buf.Bytes())
	w.raw.WriteRawJSBody(a)
}

// jsBody reads a request body stream in one call to glue/worker.mjs's saltcastReadBody,
// which keeps MaxBodyBytes+1 bytes, enough to see an oversize body, and drains the rest.
type jsBody struct {
	stream js.Value
	data   *bytes.Reader
}

func (b *jsBody) Read(p []byte) (int, error) {
	if b.data == nil {
		v, err := await(js.Global().Call("saltcastReadBody", b.stream, MaxBodyBytes+1, maxDrainBytes))
		if err != nil {
			return 0, err
		}
		buf := make([]byte, v.Get("byteLength").Int())
		js.CopyBytesToGo(buf, v)
		b.data = bytes.NewReader(buf)
	}
	return b.data.Read(p)
}

func (b *jsBody) Close() error { return nil }

var _ io.ReadCloser = (*jsBody)(nil)

// await waits for a JS promise, releasing both callbacks afterwards.
func await(promise js.Value) (js.Value, error) {
	type result struct {
		v   js.Value
		err error
	}
	done := make(chan result, 1) // the callbacks run on the JS event loop and must not block
	then := js.FuncOf(func(_ js.Value, args []js.Value) any {
		done <- result{v: args[0]}
		return nil
	})
	catch := js.FuncOf(func(_ js.Value, args []js.Value) any {
		done <- result{err: errors.New("reading the request body: " + args[0].Call("toString").String())}
		return nil
	})
	promise.Call("then", then, catch)
	r := <-done
	then.Release()
	catch.Release()
	return r.v, r.err
}

func stringOf(v js.Value) string {
	if v.Type() != js.TypeString {
		return ""
	}
	return v.String()
}
