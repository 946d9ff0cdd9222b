// Unpacks the inlined module and starts it. Nothing is fetched: the base64 text is decoded in
// memory, gunzipped with DecompressionStream and compiled while it streams.
(function () {
  "use strict";
  var marks = (window.saltcastMarks = { start: performance.now() });
  // The Go program calls this once its first result is on screen.
  window.saltcastReady = function () {
    if (marks.ready === undefined) {
      marks.ready = performance.now();
      document.documentElement.setAttribute("data-ready", "1");
    }
  };
  function fail(err) {
    var box = document.getElementById("load-error");
    if (box) {
      box.hidden = false;
      box.textContent = "Saltcast could not start in this browser: " + String(err) +
        ". It needs a current browser with WebAssembly and DecompressionStream.";
    }
    document.documentElement.setAttribute("data-ready", "error");
  }
  function bytes(b64) {
    if (typeof Uint8Array.fromBase64 === "function") {
      return Uint8Array.fromBase64(b64);
    }
    var s = atob(b64), n = s.length, out = new Uint8Array(n);
    for (var i = 0; i < n; i++) out[i] = s.charCodeAt(i);
    return out;
  }
  async function start() {
    var node = document.getElementById("saltcast-wasm");
    // The text stays in the page: "save a copy" rebuilds the file from it (web/pagecopy).
    var packed = bytes(node.textContent.trim());
    // One chunk straight into the decompressor: reading through a Blob's stream took
    // 107-113 ms here against 35 ms this way (measured; see DEVELOPERS.md).
    var stream = new ReadableStream({
      start: function (c) { c.enqueue(packed); c.close(); }
    }).pipeThrough(new DecompressionStream("gzip"));
    var go = new Go();
    var res = new Response(stream, { headers: { "Content-Type": "application/wasm" } });
    var mod = await WebAssembly.instantiateStreaming(res, go.importObject);
    marks.compiled = performance.now();
    go.run(mod.instance);
  }
  start().catch(fail);
})();
