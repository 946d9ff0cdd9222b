//go:build js && wasm

package main

import (
	"bytes"
	"errors"
	"io"
	"strconv"
	"syscall/js"
)

// ready tells glue/worker.mjs that handleRequest is set (the import it provides as
// workers.ready, the name github.com/syumai/workers gives it).
//
//go:wasmimport workers ready
func ready()

func main() {
	// glue/worker.mjs passes {env, ctx, binding, page, files}; see the limits noted there.
	runtime := js.Global().Get("context")
	page := runtime.Get("page") // the text module saltcast.html, a JS string
	opt := Options{AllowOrigin: stringOf(runtime.Get("env").Get("SALTCAST_ALLOW_ORIGIN"))}
	if page.Type() == js.TypeString {
		opt.LoadPage = func() []byte { return []byte(page.String()) }
		opt.WritePage = func(w ResponseWriter) bool {
			jw, ok := w.(*jsWriter)
			if !ok {
				return false
			}
			jw.WriteHeader(statusOK)
			jw.raw, jw.rawSet = page, true
			return true
		}
	}
	opt.Files = staticFiles(runtime.Get("files"))
	h := newHandler(opt)
	promise := js.Global().Get("Promise")
	// handleRequest(request) → Promise<Response>, called by glue/worker.mjs for every request.
	// It is set once and lives as long as the program.
	runtime.Get("binding").Set("handleRequest", js.FuncOf(func(_ js.Value, args []js.Value) any {
		req := args[0]
		var executor js.Func
		executor = js.FuncOf(func(_ js.Value, settle []js.Value) any {
			executor.Release()
			resolve := settle[0]
			// A goroutine, since reading the body waits for a promise of the event loop.
			go func() { resolve.Invoke(serveJS(h, req)) }()
			return nil
		})
		return promise.New(executor)
	}))
	ready()
	// Stay alive for the isolate's later requests.
	select {}
}

// serveJS answers one runtime Request object with a runtime Response object.
func serveJS(h *handler, req js.Value) js.Value {
	r := &Request{Method: req.Get("method").String(), Header: jsHeaders{req.Get("headers")}}
	r.Path, r.RawQuery = splitURL(req.Get("url").String())
	body := req.Get("body") // a ReadableStream, or null
	hasBody := !body.IsNull() && !body.IsUndefined()
	if n, err := strconv.ParseInt(r.Header.Get("Content-Length"), 10, 64); err == nil {
		r.ContentLength = n
	} else if hasBody {
		r.ContentLength = -1
	}
	if hasBody {
		r.Body = &jsBody{stream: body}
	}
	w := &jsWriter{hdr: Header{}, status: statusOK}
	h.Serve(w, r)
	return w.response()
}

// jsHeaders reads request headers from the runtime's Headers object.
type jsHeaders struct{ h js.Value }

func (j jsHeaders) Get(name string) string { return stringOf(j.h.Call("get", name)) }

// jsWriter collects the answer and makes one runtime Response of it: the body crosses from
// Go to JS whole, as one Uint8Array (or as the runtime's own string, for the page).
type jsWriter struct {
	hdr         Header
	buf         bytes.Buffer
	status      int
	wroteHeader bool
	raw         js.Value
	rawSet      bool
}

func (w *jsWriter) Header() Header { return w.hdr }

func (w *jsWriter) WriteHeader(status int) {
	if !w.wroteHeader {
		w.status, w.wroteHeader = status, true
	}
}

func (w *jsWriter) Write(p []byte) (int, error) {
	w.WriteHeader(statusOK)
	return w.buf.Write(p)
}

func (w *jsWriter) response() js.Value {
	headers := js.Global().Get("Headers").New()
	for name, values := range w.hdr {
		for _, v := range values {
			headers.Call("append", name, v)
		}
	}
	init := js.Global().Get("Object").New()
	init.Set("status", w.status)
	init.Set("headers", headers)
	body := js.Null()
	switch {
	case w.rawSet:
		body = w.raw
	case w.buf.Len() > 0:
		body = js.Global().Get("Uint8Array").New(w.buf.Len())
		js.CopyBytesToJS(body, w.buf.Bytes())
	}
	return js.Global().Get("Response").New(body, init)
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
