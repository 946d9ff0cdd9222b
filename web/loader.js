// Unpacks the inlined module and starts it. Nothing is fetched: the text is decoded in
// memory, unpacked (lzma here, or gzip with DecompressionStream) and compiled.
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
  // unlzma unpacks an "lzma alone" stream (13-byte header: properties, dictionary size,
  // unpacked size; then the range-coded data) as xz --format=lzma writes it. The format is
  // the LZMA method of Igor Pavlov's 7-Zip; this decoder follows its published description
  // (the LZMA SDK's lzma-specification.txt). It packs Saltcast's module about a quarter
  // smaller than the best gzip, and no browser has it built in, so it is written out here.
  function unlzma(src) {
    var d = src[0], lc = d % 9, lp = ((d / 9) | 0) % 5, pb = (d / 45) | 0;
    var size = src[5] + src[6] * 256 + src[7] * 65536 + src[8] * 16777216 + src[9] * 4294967296;
    if (d >= 225 || src[10] || src[11] || src[12] || !(size > 0)) throw new Error("the module is not an lzma stream of known size");
    var out = new Uint8Array(size), pos = 0, inPos = 13, end = src.length;
    var cut = new Error("the lzma stream is cut short");
    var range = 0xFFFFFFFF, code = 0, i;
    if (end < 18) throw cut;
    for (i = 0; i < 5; i++) code = (code * 256 + src[inPos++]) % 4294967296;
    var p = new Uint16Array(1846 + (0x300 << (lc + lp))).fill(1024);
    // Where each group of probabilities starts in p.
    var IS_MATCH = 0, IS_REP = 192, IS_REP_G0 = 204, IS_REP_G1 = 216, IS_REP_G2 = 228,
      IS_REP0_LONG = 240, POS_SLOT = 432, SPEC_POS = 688, ALIGN = 802, LEN = 818, REP_LEN = 1332,
      LITERAL = 1846;
    function bit(k) {
      var v = p[k], bound = (range >>> 11) * v, b;
      if (code < bound) { range = bound; p[k] = v + ((2048 - v) >> 5); b = 0; }
      else { range -= bound; code -= bound; p[k] = v - (v >> 5); b = 1; }
      if (range < 16777216) { if (inPos >= end) throw cut; range = range * 256; code = code * 256 + src[inPos++]; }
      return b;
    }
    function tree(base, n) {
      var m = 1;
      for (var j = 0; j < n; j++) m = (m << 1) + bit(base + m);
      return m - (1 << n);
    }
    function reverse(base, n) {
      var m = 1, sym = 0;
      for (var j = 0; j < n; j++) { var b = bit(base + m); m = (m << 1) + b; sym |= b << j; }
      return sym;
    }
    function direct(n) {
      var r = 0;
      for (; n > 0; n--) {
        range = range / 2 >>> 0;
        var b = code >= range ? 1 : 0;
        if (b) code -= range;
        r = r * 2 + b;
        if (range < 16777216) { if (inPos >= end) throw cut; range = range * 256; code = code * 256 + src[inPos++]; }
      }
      return r;
    }
    // A length decoder's probabilities: choice, choice2, low[16][8], mid[16][8], high[256].
    function length(base, posState) {
      if (!bit(base)) return tree(base + 2 + posState * 8, 3);
      if (!bit(base + 1)) return 8 + tree(base + 130 + posState * 8, 3);
      return 16 + tree(base + 258, 8);
    }
    var state = 0, rep0 = 0, rep1 = 0, rep2 = 0, rep3 = 0, pbMask = (1 << pb) - 1, lpMask = (1 << lp) - 1;
    while (pos < size) {
      var posState = pos & pbMask, len;
      if (!bit(IS_MATCH + (state << 4) + posState)) {
        var prev = pos > 0 ? out[pos - 1] : 0;
        var base = LITERAL + 0x300 * (((pos & lpMask) << lc) + (prev >> (8 - lc))), sym = 1;
        if (state >= 7) {
          var match = out[pos - rep0 - 1];
          do {
            var mb = (match >> 7) & 1;
            match <<= 1;
            var b = bit(base + ((1 + mb) << 8) + sym);
            sym = (sym << 1) | b;
            if (mb !== b) break;
          } while (sym < 0x100);
        }
        while (sym < 0x100) sym = (sym << 1) | bit(base + sym);
        out[pos++] = sym & 255;
        state = state < 4 ? 0 : state < 10 ? state - 3 : state - 6;
        continue;
      }
      if (bit(IS_REP + state)) {
        if (pos === 0) throw new Error("damaged lzma stream");
        if (!bit(IS_REP_G0 + state)) {
          if (!bit(IS_REP0_LONG + (state << 4) + posState)) {
            state = state < 7 ? 9 : 11;
            out[pos] = out[pos - rep0 - 1];
            pos++;
            continue;
          }
        } else {
          var dist;
          if (!bit(IS_REP_G1 + state)) dist = rep1;
          else {
            if (!bit(IS_REP_G2 + state)) dist = rep2;
            else { dist = rep3; rep3 = rep2; }
            rep2 = rep1;
          }
          rep1 = rep0;
          rep0 = dist;
        }
        len = length(REP_LEN, posState);
        state = state < 7 ? 8 : 11;
      } else {
        rep3 = rep2; rep2 = rep1; rep1 = rep0;
        len = length(LEN, posState);
        state = state < 7 ? 7 : 10;
        var slot = tree(POS_SLOT + (len < 3 ? len : 3) * 64, 6);
        if (slot < 4) rep0 = slot;
        else {
          var nd = (slot >> 1) - 1;
          rep0 = (2 + (slot & 1)) * Math.pow(2, nd);
          if (slot < 14) rep0 += reverse(SPEC_POS + rep0 - slot - 1, nd);
          else rep0 += direct(nd - 4) * 16 + reverse(ALIGN, 4);
          if (rep0 === 4294967295) break; // the end marker
        }
      }
      len += 2;
      if (rep0 >= pos) throw new Error("damaged lzma stream");
      for (; len > 0 && pos < size; len--, pos++) out[pos] = out[pos - rep0 - 1];
    }
    if (pos !== size) throw new Error("the lzma stream ends early");
    return out;
  }
  async function start() {
    var node = document.getElementById("saltcast-wasm");
    // The text stays in the page: "save a copy" rebuilds the file from it (web/pagecopy).
    var packed = bytes(node.textContent.trim());
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
      var wasm = unlzma(packed);
      marks.unpacked = performance.now();
      mod = await WebAssembly.instantiate(wasm, go.importObject);
    }
    marks.compiled = performance.now();
    go.run(mod.instance);
  }
  start().catch(fail);
})();
