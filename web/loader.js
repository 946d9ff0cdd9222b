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
  var UNPACKER = "AGFzbQEAAAABFwRgAn9/AX9gAX8Bf2AAAGAFf39/f38AAwoJAAIBAAABAAMBBQMBAAEGURB/AUEAC38BQQALfwFBAAt/AUEAC38BQQALfwFBAAt/AUEAC38BQQALfwFBAAt/AUEAC38BQQALfwFBAAt/AUEAC38BQQALfwFBAAt/AUEACwckBAFtAgAGdGV4dDkxAAAJbHptYVN0YXJ0AAcHbHptYVJ1bgAICowRCd0CAQl/A0AgAkH/AToAACACQQFqIQIgAkGAAUkNAAtBISECA0AgAkE8RiACQT5GIAJBJkZyckUEQCACIAM6AAAgA0EBaiEDCyACQQFqIQIgAkH/AEkNAAsgACEFAkADQCAEQQFqIAFPDQEgACAEai0AACEIIAAgBGotAAEhCSAIIAlyQYABTwRAQX8PCyAILQAAIQggCS0AACEJIAggCXJBgAFxBEBBfw8LIAggCUHbAGxqIQogCkGAwABPBEBBfw8LIAYgCiAHdHIhBiAHQQ1qIQcDQCAFIAY6AAAgBUEBaiEFIAZBCHYhBiAHQQhrIQcgB0EITw0ACyAEQQJqIQQMAAsACyAEIAFJBEAgACAEai0AACEIIAhBgAFPBEBBfw8LIAgtAAAhCCAIQcAATwRAQX8PCyAGIAggB3RyIQYgB0EGakEITwRAIAUgBjoAACAFQQFqIQULCyAFIABrCzEAIwFBgICACEkEQCMDIwRPBEAACyMBQQh0JAEjAkEIdCMDLQAAciQCIwNBAWokAwsLYAEDfyMAIABBAXRqIQEgAS8BACECIwFBC3YgAmwhAyMCIANJBH8gAyQBIAEgAkGAECACa0EFdmo7AQAQAUEABSMBIANrJAEjAiADayQCIAEgAiACQQV2azsBABABQQELCzABAn9BASECA0AgAkEBdCAAIAJqEAJqIQIgA0EBaiEDIAMgAUkNAAsgAkEBIAF0aws4AQR/QQEhAgNAIAAgAmoQAiEEIAJBAXQgBGohAiAFIAQgA3RyIQUgA0EBaiEDIAMgAUkNAAsgBQs6AQF/A0AjAUEBdiQBIAFBAXQhASMCIwFPBEAjAiMBayQCIAFBAXIhAQsQASAAQQFrIQAgAA0ACyABC0YAIAAQAkUEQCAAQQJqIAFBA3RqQQMQAw8LIABBAWoQAkUEQEEIIABBggFqIAFBA3RqQQMQA2oPC0EQIABBggJqQQgQA2oL1QEBBH8gAC0AACEFIAVBCXAkBSAFQQluIQUgBUEFcCEGQQEgBUEFbnRBAWskBkEBIAZ0QQFrJAcgAiQAIAJBtg5BgAYjBSAGanRqQQF0aiEHIAIhCANAIAhBgAg7AQAgCEECaiEIIAggB0kNAAsgAEENaiQDIAEkBEF/JAFBACQCIAEjA2tBBUkEQAALQQUhCANAIwJBCHQjAy0AAHIkAiMDQQFqJAMgCEEBayEIIAgNAAsgAyQIIAMkCSADIARqJApBACQLQQAkDEEAJA1BACQOQQAkDwvUCQEffyMFIQEjBiECIwchAyMIIQQjCSEFIwohBiMLIQkjDCELIw0hDCMOIQ0jDyEOIwAhGCMBIRkjAiEaIwMhGyMEIRwgBiEHIAAgBiAFa0kEQCAFIABqIQcLAkADQCAFIAdPDQEgBSAEayEIIAggAnEhCiAYIAlBBHQgCmpBAXRqIR0gHS8BACEeIBlBC3YgHmwhHyAaIB9JBEAgHyEZIB0gHkGAECAea0EFdmo7AQBBACEUBSAZIB9rIRkgGiAfayEaIB0gHiAeQQV2azsBAEEBIRQLIBlBgICACEkEQCAbIBxPBEAACyAZQQh0IRkgGkEIdCAbLQAAciEaIBtBAWohGwsgFEUEQEEAIRQgCARAIAVBAWstAAAhFAtBtg5BgAYgCCADcSABdCAUQQggAWt2amxqIRFBASEQIAlBB08EQCAFIAtrQQFrLQAAIRICQANAIBJBB3ZBAXEhEyASQQF0IRIgGCARIBNBAWpBCHQgEGpqQQF0aiEdIB0vAQAhHiAZQQt2IB5sIR8gGiAfSQRAIB8hGSAdIB5BgBAgHmtBBXZqOwEAQQAhFAUgGSAfayEZIBogH2shGiAdIB4gHkEFdms7AQBBASEUCyAZQYCAgAhJBEAgGyAcTwRAAAsgGUEIdCEZIBpBCHQgGy0AAHIhGiAbQQFqIRsLIBBBAXQgFHIhECATIBRHDQEgEEGAAkkNAAsLCwJAA0AgEEGAAk8NASAYIBEgEGpBAXRqIR0gHS8BACEeIBlBC3YgHmwhHyAaIB9JBEAgHyEZIB0gHkGAECAea0EFdmo7AQBBACEUBSAZIB9rIRkgGiAfayEaIB0gHiAeQQV2azsBAEEBIRQLIBlBgICACEkEQCAbIBxPBEAACyAZQQh0IRkgGkEIdCAbLQAAciEaIBtBAWohGwsgEEEBdCAUciEQDAALAAsgBSAQOgAAIAVBAWohBUEAIAlBA2sgCUEGayAJQQpJGyAJQQRJGyEJDAELIBkkASAaJAIgGyQDQcABIAlqEAIEQCAIRQRAQX8PC0HMASAJahACRQRAQfABIAlBBHQgCmpqEAJFBEBBCUELIAlBB0kbIQkgBSAFIAtrQQFrLQAAOgAAIAVBAWohBSMBIRkjAiEaIwMhGwwDCwVB2AEgCWoQAkUEQCAMIRcFQeQBIAlqEAJFBEAgDSEXBSAOIRcgDSEOCyAMIQ0LIAshDCAXIQsLQbQKIAoQBiEPQQhBCyAJQQdJGyEJBSANIQ4gDCENIAshDEGyBiAKEAYhD0EHQQogCUEHSRshCUGwAyAPQQMgD0EDSRtBBnRqQQYQAyEVIBVBBEkEQCAVIQsFIBVBAXZBAWshFkECIBVBAXFyIBZ0IQsgFUEOSQRAIAtBsAUgC2ogFWtBAWsgFhAEaiELBSALIBZBBGsQBUEEdEGiBkEEEARqaiELIAtBf0YEQEF+DwsLCwsjASEZIwIhGiMDIRsgD0ECaiEPIAsgCE8EQEF/DwsgDyAGIAVrSwRAIAYgBWshDwsgBSALa0EBayEUIAUgD2ohDwNAIAUgFC0AADoAACAFQQFqIQUgFEEBaiEUIAUgD0kNAAsMAAsACyAZJAEgGiQCIBskAyAFJAkgCSQLIAskDCAMJA0gDSQOIA4kDyAGIAVrCw==";
  // unpack turns the module's text into the packed bytes (13 bits in every two characters of
  // 91; saltcast/web/text91 writes it and says why) and unpacks an lzma stream (xz
  // --format=lzma, the size in its header) into the unpacker's memory, where the module is
  // compiled from. A gzip stream (a build without xz) is returned as it is. The unpacker runs
  // in WebAssembly: this JavaScript took three times as long in Chromium (DEVELOPERS.md).
  async function unpack(text) {
    var code = Uint8Array.from(atob(UNPACKER), function (c) { return c.charCodeAt(0); });
    var x = (await WebAssembly.instantiate(code)).instance.exports, mem = x.m;
    function room(end) {
      var have = mem.buffer.byteLength;
      if (end > have) mem.grow(Math.ceil((end - have) / 65536));
    }
    // Memory: text91's table below 128, the text (then the packed bytes) from 128, the
    // probabilities after them, the module last (web/unlzma.wat).
    var t = 128, n = text.length;
    room(t + n);
    var put = new TextEncoder().encodeInto(text, new Uint8Array(mem.buffer, t, n));
    var len = put.read === n && put.written === n ? x.text91(t, n) : -1;
    if (len < 0) throw new Error("damaged module text");
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
      // In pieces: engines switch to their better code for a function only between calls.
      while ((left = x.lzmaRun(65536)) > 0);
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
    var packed = await unpack(node.textContent.trim());
    var go = new Go(), mod;
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
