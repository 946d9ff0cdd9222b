// Unpacks the inlined module and starts it. Nothing is fetched: the text is decoded in
// memory, unpacked (lzma by web/unlzma.wat, or gzip with DecompressionStream) and compiled.
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
        ". It needs Chrome or Edge 97, Firefox 102, Safari 16 or later (see the note below).";
    }
    document.documentElement.setAttribute("data-ready", "error");
    // The app cannot start here: the note on opening the file in a current browser again.
    document.documentElement.removeAttribute("data-run");
  }
  // The unpacker: web/unlzma.wat (hand-written WebAssembly text) assembled by binaryen's
  // wasm-as; `go generate ./web` writes this line (TestLoaderUnpackerIsAssembledFromSource).
  var UNPACKER = "AGFzbQEAAAABHgVgAX8Bf2ACf38Bf2ADf39/AX9gAABgBX9/f39/AAMKCQIDAAEBAAEEAAUDAQABBlEQfwFBAAt/AUEAC38BQQALfwFBAAt/AUEAC38BQQALfwFBAAt/AUEAC38BQQALfwFBAAt/AUEAC38BQQALfwFBAAt/AUEAC38BQQALfwFBAAsHJAQBbQIABnRleHQ5MQAACWx6bWFTdGFydAAHB2x6bWFSdW4ACAqMEQndAgEJfwNAIANB/wE6AAAgA0EBaiEDIANBgAFJDQALQSEhAwNAIANBPEYgA0E+RiADQSZGcnJFBEAgAyAEOgAAIARBAWohBAsgA0EBaiEDIANB/wBJDQALIAIhBgJAA0AgBUEBaiABTw0BIAAgBWotAAAhCSAAIAVqLQABIQogCSAKckGAAU8EQEF/DwsgCS0AACEJIAotAAAhCiAJIApyQYABcQRAQX8PCyAJIApB2wBsaiELIAtBgMAATwRAQX8PCyAHIAsgCHRyIQcgCEENaiEIA0AgAiAHOgAAIAJBAWohAiAHQQh2IQcgCEEIayEIIAhBCE8NAAsgBUECaiEFDAALAAsgBSABSQRAIAAgBWotAAAhCSAJQYABTwRAQX8PCyAJLQAAIQkgCUHAAE8EQEF/DwsgByAJIAh0ciEHIAhBBmpBCE8EQCACIAc6AAAgAkEBaiECCwsgAiAGawsxACMBQYCAgAhJBEAjAyMETwRAAAsjAUEIdCQBIwJBCHQjAy0AAHIkAiMDQQFqJAMLC2ABA38jACAAQQF0aiEBIAEvAQAhAiMBQQt2IAJsIQMjAiADSQR/IAMkASABIAJBgBAgAmtBBXZqOwEAEAFBAAUjASADayQBIwIgA2skAiABIAIgAkEFdms7AQAQAUEBCwswAQJ/QQEhAgNAIAJBAXQgACACahACaiECIANBAWohAyADIAFJDQALIAJBASABdGsLOAEEf0EBIQIDQCAAIAJqEAIhBCACQQF0IARqIQIgBSAEIAN0ciEFIANBAWohAyADIAFJDQALIAULOgEBfwNAIwFBAXYkASABQQF0IQEjAiMBTwRAIwIjAWskAiABQQFyIQELEAEgAEEBayEAIAANAAsgAQtGACAAEAJFBEAgAEECaiABQQN0akEDEAMPCyAAQQFqEAJFBEBBCCAAQYIBaiABQQN0akEDEANqDwtBECAAQYICakEIEANqC9UBAQR/IAAtAAAhBSAFQQlwJAUgBUEJbiEFIAVBBXAhBkEBIAVBBW50QQFrJAZBASAGdEEBayQHIAIkACACQbYOQYAGIwUgBmp0akEBdGohByACIQgDQCAIQYAIOwEAIAhBAmohCCAIIAdJDQALIABBDWokAyABJARBfyQBQQAkAiABIwNrQQVJBEAAC0EFIQgDQCMCQQh0IwMtAAByJAIjA0EBaiQDIAhBAWshCCAIDQALIAMkCCADJAkgAyAEaiQKQQAkC0EAJAxBACQNQQAkDkEAJA8L1AkBH38jBSEBIwYhAiMHIQMjCCEEIwkhBSMKIQYjCyEJIwwhCyMNIQwjDiENIw8hDiMAIRgjASEZIwIhGiMDIRsjBCEcIAYhByAAIAYgBWtJBEAgBSAAaiEHCwJAA0AgBSAHTw0BIAUgBGshCCAIIAJxIQogGCAJQQR0IApqQQF0aiEdIB0vAQAhHiAZQQt2IB5sIR8gGiAfSQRAIB8hGSAdIB5BgBAgHmtBBXZqOwEAQQAhFAUgGSAfayEZIBogH2shGiAdIB4gHkEFdms7AQBBASEUCyAZQYCAgAhJBEAgGyAcTwRAAAsgGUEIdCEZIBpBCHQgGy0AAHIhGiAbQQFqIRsLIBRFBEBBACEUIAgEQCAFQQFrLQAAIRQLQbYOQYAGIAggA3EgAXQgFEEIIAFrdmpsaiERQQEhECAJQQdPBEAgBSALa0EBay0AACESAkADQCASQQd2QQFxIRMgEkEBdCESIBggESATQQFqQQh0IBBqakEBdGohHSAdLwEAIR4gGUELdiAebCEfIBogH0kEQCAfIRkgHSAeQYAQIB5rQQV2ajsBAEEAIRQFIBkgH2shGSAaIB9rIRogHSAeIB5BBXZrOwEAQQEhFAsgGUGAgIAISQRAIBsgHE8EQAALIBlBCHQhGSAaQQh0IBstAAByIRogG0EBaiEbCyAQQQF0IBRyIRAgEyAURw0BIBBBgAJJDQALCwsCQANAIBBBgAJPDQEgGCARIBBqQQF0aiEdIB0vAQAhHiAZQQt2IB5sIR8gGiAfSQRAIB8hGSAdIB5BgBAgHmtBBXZqOwEAQQAhFAUgGSAfayEZIBogH2shGiAdIB4gHkEFdms7AQBBASEUCyAZQYCAgAhJBEAgGyAcTwRAAAsgGUEIdCEZIBpBCHQgGy0AAHIhGiAbQQFqIRsLIBBBAXQgFHIhEAwACwALIAUgEDoAACAFQQFqIQVBACAJQQNrIAlBBmsgCUEKSRsgCUEESRshCQwBCyAZJAEgGiQCIBskA0HAASAJahACBEAgCEUEQEF/DwtBzAEgCWoQAkUEQEHwASAJQQR0IApqahACRQRAQQlBCyAJQQdJGyEJIAUgBSALa0EBay0AADoAACAFQQFqIQUjASEZIwIhGiMDIRsMAwsFQdgBIAlqEAJFBEAgDCEXBUHkASAJahACRQRAIA0hFwUgDiEXIA0hDgsgDCENCyALIQwgFyELC0G0CiAKEAYhD0EIQQsgCUEHSRshCQUgDSEOIAwhDSALIQxBsgYgChAGIQ9BB0EKIAlBB0kbIQlBsAMgD0EDIA9BA0kbQQZ0akEGEAMhFSAVQQRJBEAgFSELBSAVQQF2QQFrIRZBAiAVQQFxciAWdCELIBVBDkkEQCALQbAFIAtqIBVrQQFrIBYQBGohCwUgCyAWQQRrEAVBBHRBogZBBBAEamohCyALQX9GBEBBfg8LCwsLIwEhGSMCIRojAyEbIA9BAmohDyALIAhPBEBBfw8LIA8gBiAFa0sEQCAGIAVrIQ8LIAUgC2tBAWshFCAFIA9qIQ8DQCAFIBQtAAA6AAAgBUEBaiEFIBRBAWohFCAFIA9JDQALDAALAAsgGSQBIBokAiAbJAMgBSQJIAkkCyALJAwgDCQNIA0kDiAOJA8gBiAFaws=";
  // unpack turns the module's text into the packed bytes (13 bits in every two characters of
  // 91; saltcast/web/text91 writes it and says why) and unpacks an lzma stream (xz
  // --format=lzma, the size in its header) into the unpacker's memory, where the module is
  // compiled from. A gzip stream (a build without xz) is returned as it is. The unpacker runs
  // in WebAssembly: a JavaScript decoder took two to three times as long in Chromium
  // (DEVELOPERS.md, "Decisions measured").
  function unpack(text) {
    var bin = atob(UNPACKER), code = new Uint8Array(bin.length), i;
    for (i = 0; i < bin.length; i++) code[i] = bin.charCodeAt(i);
    // Compiled at once: it is small (engines that limit compiling on the main thread allow 4 KB),
    // and waiting for a compile in the background cost 20-50 ms in the loading page.
    var x = new WebAssembly.Instance(new WebAssembly.Module(code)).exports, mem = x.m;
    function room(end) {
      var have = mem.buffer.byteLength;
      if (end > have) mem.grow(Math.ceil((end - have) / 65536));
    }
    // Memory: text91's table below 128, the text (then the packed bytes) from 128, the
    // probabilities after them, the module last (web/unlzma.wat).
    var t = 128, n = text.length;
    room(t + n);
    var put = new TextEncoder().encodeInto(text, new Uint8Array(mem.buffer, t, n));
    if (put.read !== n || put.written !== n) throw new Error("damaged module text");
    // In pieces of 16k characters (13k bytes): engines switch to their better code for a
    // function only between calls.
    var len = 0, got;
    for (i = 0; i < n; i += 16384) {
      got = x.text91(t + i, Math.min(16384, n - i), t + len);
      if (got < 0) throw new Error("damaged module text");
      len += got;
    }
    var src = new Uint8Array(mem.buffer, t, len);
    if (src[0] === 0x1f && src[1] === 0x8b) return src.slice();
    var d = src[0], lc = d % 9, lp = ((d / 9) | 0) % 5;
    var size = src[5] + src[6] * 256 + src[7] * 65536 + src[8] * 16777216 + src[9] * 4294967296;
    if (len < 13 || d >= 225 || src[10] || src[11] || src[12] || !(size > 0)) throw new Error("the module is not an lzma stream of known size");
    var p = (t + len + 7) & ~7, out = p + 2 * (1846 + (0x300 << (lc + lp)));
    if (out + size > 2147483648) throw new Error("the module is too large");
    room(out + size);
    var left;
    try {
      x.lzmaStart(t, t + len, p, out, size);
      while ((left = x.lzmaRun(16384)) > 0);
    } catch (e) {
      throw new Error("the lzma stream is cut short");
    }
    if (left === -1) throw new Error("damaged lzma stream");
    if (left !== 0) throw new Error("the lzma stream ends early");
    return new Uint8Array(mem.buffer, out, size);
  }
  async function start() {
    var node = document.getElementById("saltcast-wasm");
    // The text stays in the page: "save a copy" rebuilds the file from it (web/pagecopy).
    var packed = unpack(node.textContent.trim());
    var go = new Go(), mod;
    // Go collects its garbage when the heap has doubled, from 4 MB on: every ten keystrokes or
    // so in the app, 8-12 ms each, inside the keystroke. With GOGC=400 the heap may reach
    // 16 MB first, and the app collects in idle time (wasm/browser, collectWhenIdle).
    go.env = { GOGC: "400" };
    if (packed[0] === 0x1f && packed[1] === 0x8b) {
      // gzip (a build without xz): one chunk straight into the decompressor; reading through
      // a Blob's stream took 107-113 ms here against 35 ms this way (see DEVELOPERS.md).
      var stream = new ReadableStream({
        start: function (c) { c.enqueue(packed); c.close(); }
      }).pipeThrough(new DecompressionStream("gzip"));
      var res = new Response(stream, { headers: { "Content-Type": "application/wasm" } });
      mod = await WebAssembly.instantiateStreaming(res, go.importObject);
    } else {
      marks.unpacked = performance.now();
      // Compiled straight from the unpacker's memory, not from a copy.
      mod = await WebAssembly.instantiate(packed, go.importObject);
    }
    marks.compiled = performance.now();
    go.run(mod.instance);
  }
  start().catch(fail);
})();
