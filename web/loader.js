// Unpacks the inlined module and starts it. Nothing is fetched: the text is decoded in
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
  // The module's text: 13 bits in every two characters of 91 (saltcast/web/text91 writes it
  // and says why; 1.23 characters a byte where base64 takes 1.33).
  function bytes(text) {
    var val = new Int16Array(128).fill(-1), k = 0, c;
    for (c = 33; c < 127; c++) if (c !== 60 && c !== 62 && c !== 38) val[c] = k++;
    var n = text.length, out = new Uint8Array(Math.floor(((n >> 1) * 13 + (n & 1) * 6) / 8));
    var acc = 0, bits = 0, o = 0, i = 0, v;
    for (; i + 1 < n; i += 2) {
      v = val[text.charCodeAt(i) & 127] + 91 * val[text.charCodeAt(i + 1) & 127];
      if (v < 0 || v >= 8192 || text.charCodeAt(i) > 126 || text.charCodeAt(i + 1) > 126) throw new Error("damaged module text at " + i);
      acc |= v << bits;
      bits += 13;
      while (bits >= 8) { out[o++] = acc & 255; acc >>>= 8; bits -= 8; }
    }
    if (i < n) {
      v = val[text.charCodeAt(i) & 127];
      if (v < 0 || v >= 64) throw new Error("damaged module text at " + i);
      acc |= v << bits;
      if (bits + 6 >= 8) out[o++] = acc & 255;
    }
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
