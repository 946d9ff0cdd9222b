;; The loader's unpacker (web/loader.js): text91 text to bytes, then an "lzma alone" stream
;; (xz --format=lzma) to the module, both in this module's memory. Written by hand in the
;; WebAssembly text format; `go generate ./web` assembles it with binaryen's wasm-as and writes
;; the bytes into web/loader.js (TestLoaderUnpackerIsAssembledFromSource checks they match).
;;
;; LZMA is the method of Igor Pavlov's 7-Zip; this follows its published description (the LZMA
;; SDK's lzma-specification.txt): a binary range coder with adaptive 11-bit probabilities,
;; literals coded bit by bit (against the byte at the last distance after a match), matches
;; with a length and a distance, and repeats of the four last distances.
;;
;; Memory, laid out by the loader:
;;   [0, 128)           text91's value of each ASCII character (255: not in the alphabet)
;;   [t, t+n)           the page's text, decoded in place to the packed bytes (from t)
;;   [p, p+2*probs)     the probabilities, 16 bits each (probs = 1846 + 0x300 << (lc+lp))
;;   [out, out+size)    the unpacked module, compiled from here
;;
;; Probability groups, as indices into the probabilities:
;;   is-match 0, is-rep 192, is-rep-g0 204, is-rep-g1 216, is-rep-g2 228, is-rep0-long 240,
;;   position slots 432, special positions 688, align 802, match length 818,
;;   rep length 1332, literals 1846.
(module
  (memory (export "m") 1)
  (global $p (mut i32) (i32.const 0))
  (global $range (mut i32) (i32.const 0))
  (global $code (mut i32) (i32.const 0))
  (global $in (mut i32) (i32.const 0))
  (global $inEnd (mut i32) (i32.const 0))
  ;; The unpacker's state between calls of lzmaRun.
  (global $lc (mut i32) (i32.const 0))
  (global $pbMask (mut i32) (i32.const 0))
  (global $lpMask (mut i32) (i32.const 0))
  (global $out (mut i32) (i32.const 0))
  (global $o (mut i32) (i32.const 0))
  (global $end (mut i32) (i32.const 0))
  (global $state (mut i32) (i32.const 0))
  (global $rep0 (mut i32) (i32.const 0))
  (global $rep1 (mut i32) (i32.const 0))
  (global $rep2 (mut i32) (i32.const 0))
  (global $rep3 (mut i32) (i32.const 0))

  ;; text91 decodes the n characters at t to bytes at o (13 bits in every two characters, the
  ;; low bits first; a last lone character holds 6 bits). It returns the number of bytes, or -1
  ;; when a character is outside the alphabet or a pair's value is 8192 or more. 16 characters
  ;; make 13 bytes exactly, so the loader decodes the text in pieces of 16k characters, each
  ;; to 13k bytes (in place: o <= t; the pieces keep the engine's better code, as in lzmaRun).
  (func $text91 (export "text91") (param $t i32) (param $n i32) (param $o i32) (result i32)
    (local $c i32) (local $k i32) (local $i i32) (local $start i32)
    (local $acc i32) (local $bits i32) (local $a i32) (local $b i32) (local $v i32)
    (loop $blank
      (i32.store8 (local.get $c) (i32.const 255))
      (local.set $c (i32.add (local.get $c) (i32.const 1)))
      (br_if $blank (i32.lt_u (local.get $c) (i32.const 128))))
    ;; '!' to '~' without '<' (60), '>' (62) and '&' (38).
    (local.set $c (i32.const 33))
    (loop $alphabet
      (if (i32.eqz (i32.or (i32.eq (local.get $c) (i32.const 60))
                           (i32.or (i32.eq (local.get $c) (i32.const 62))
                                   (i32.eq (local.get $c) (i32.const 38)))))
        (then
          (i32.store8 (local.get $c) (local.get $k))
          (local.set $k (i32.add (local.get $k) (i32.const 1)))))
      (local.set $c (i32.add (local.get $c) (i32.const 1)))
      (br_if $alphabet (i32.lt_u (local.get $c) (i32.const 127))))
    (local.set $start (local.get $o))
    (block $pairsDone
      (loop $pair
        (br_if $pairsDone (i32.ge_u (i32.add (local.get $i) (i32.const 1)) (local.get $n)))
        (local.set $a (i32.load8_u (i32.add (local.get $t) (local.get $i))))
        (local.set $b (i32.load8_u offset=1 (i32.add (local.get $t) (local.get $i))))
        (if (i32.ge_u (i32.or (local.get $a) (local.get $b)) (i32.const 128))
          (then (return (i32.const -1))))
        (local.set $a (i32.load8_u (local.get $a)))
        (local.set $b (i32.load8_u (local.get $b)))
        ;; 255 marks a character outside the alphabet; values are at most 90.
        (if (i32.and (i32.or (local.get $a) (local.get $b)) (i32.const 128))
          (then (return (i32.const -1))))
        (local.set $v (i32.add (local.get $a) (i32.mul (local.get $b) (i32.const 91))))
        (if (i32.ge_u (local.get $v) (i32.const 8192))
          (then (return (i32.const -1))))
        (local.set $acc (i32.or (local.get $acc) (i32.shl (local.get $v) (local.get $bits))))
        (local.set $bits (i32.add (local.get $bits) (i32.const 13)))
        (loop $byte
          (i32.store8 (local.get $o) (local.get $acc))
          (local.set $o (i32.add (local.get $o) (i32.const 1)))
          (local.set $acc (i32.shr_u (local.get $acc) (i32.const 8)))
          (local.set $bits (i32.sub (local.get $bits) (i32.const 8)))
          (br_if $byte (i32.ge_u (local.get $bits) (i32.const 8))))
        (local.set $i (i32.add (local.get $i) (i32.const 2)))
        (br $pair)))
    (if (i32.lt_u (local.get $i) (local.get $n))
      (then
        (local.set $a (i32.load8_u (i32.add (local.get $t) (local.get $i))))
        (if (i32.ge_u (local.get $a) (i32.const 128))
          (then (return (i32.const -1))))
        (local.set $a (i32.load8_u (local.get $a)))
        (if (i32.ge_u (local.get $a) (i32.const 64))
          (then (return (i32.const -1))))
        (local.set $acc (i32.or (local.get $acc) (i32.shl (local.get $a) (local.get $bits))))
        (if (i32.ge_u (i32.add (local.get $bits) (i32.const 6)) (i32.const 8))
          (then
            (i32.store8 (local.get $o) (local.get $acc))
            (local.set $o (i32.add (local.get $o) (i32.const 1)))))))
    (i32.sub (local.get $o) (local.get $start)))

  ;; norm keeps the range at 2^24 or more, taking the next input byte; a stream that ends
  ;; here is cut short, and the decoder stops with a trap the loader reports.
  (func $norm
    (if (i32.lt_u (global.get $range) (i32.const 0x1000000))
      (then
        (if (i32.ge_u (global.get $in) (global.get $inEnd))
          (then (unreachable)))
        (global.set $range (i32.shl (global.get $range) (i32.const 8)))
        (global.set $code (i32.or (i32.shl (global.get $code) (i32.const 8))
                                  (i32.load8_u (global.get $in))))
        (global.set $in (i32.add (global.get $in) (i32.const 1))))))

  ;; bit decodes one bit with probability number k and adapts it (by 1/32 of the distance).
  (func $bit (param $k i32) (result i32)
    (local $a i32) (local $v i32) (local $bound i32)
    (local.set $a (i32.add (global.get $p) (i32.shl (local.get $k) (i32.const 1))))
    (local.set $v (i32.load16_u (local.get $a)))
    (local.set $bound (i32.mul (i32.shr_u (global.get $range) (i32.const 11)) (local.get $v)))
    (if (result i32) (i32.lt_u (global.get $code) (local.get $bound))
      (then
        (global.set $range (local.get $bound))
        (i32.store16 (local.get $a)
          (i32.add (local.get $v) (i32.shr_u (i32.sub (i32.const 2048) (local.get $v)) (i32.const 5))))
        (call $norm)
        (i32.const 0))
      (else
        (global.set $range (i32.sub (global.get $range) (local.get $bound)))
        (global.set $code (i32.sub (global.get $code) (local.get $bound)))
        (i32.store16 (local.get $a)
          (i32.sub (local.get $v) (i32.shr_u (local.get $v) (i32.const 5))))
        (call $norm)
        (i32.const 1))))

  ;; tree decodes n bits, highest first, along a binary tree of probabilities from base.
  (func $tree (param $base i32) (param $n i32) (result i32)
    (local $m i32) (local $j i32)
    (local.set $m (i32.const 1))
    (loop $next
      (local.set $m (i32.add (i32.shl (local.get $m) (i32.const 1))
                             (call $bit (i32.add (local.get $base) (local.get $m)))))
      (local.set $j (i32.add (local.get $j) (i32.const 1)))
      (br_if $next (i32.lt_u (local.get $j) (local.get $n))))
    (i32.sub (local.get $m) (i32.shl (i32.const 1) (local.get $n))))

  ;; reverse decodes n bits along a tree, lowest bit first.
  (func $reverse (param $base i32) (param $n i32) (result i32)
    (local $m i32) (local $j i32) (local $b i32) (local $sym i32)
    (local.set $m (i32.const 1))
    (loop $next
      (local.set $b (call $bit (i32.add (local.get $base) (local.get $m))))
      (local.set $m (i32.add (i32.shl (local.get $m) (i32.const 1)) (local.get $b)))
      (local.set $sym (i32.or (local.get $sym) (i32.shl (local.get $b) (local.get $j))))
      (local.set $j (i32.add (local.get $j) (i32.const 1)))
      (br_if $next (i32.lt_u (local.get $j) (local.get $n))))
    (local.get $sym))

  ;; direct decodes n bits of even probability, highest first.
  (func $direct (param $n i32) (result i32)
    (local $r i32)
    (loop $next
      (global.set $range (i32.shr_u (global.get $range) (i32.const 1)))
      (local.set $r (i32.shl (local.get $r) (i32.const 1)))
      (if (i32.ge_u (global.get $code) (global.get $range))
        (then
          (global.set $code (i32.sub (global.get $code) (global.get $range)))
          (local.set $r (i32.or (local.get $r) (i32.const 1)))))
      (call $norm)
      (local.set $n (i32.sub (local.get $n) (i32.const 1)))
      (br_if $next (local.get $n)))
    (local.get $r))

  ;; length decodes a match length less 2 with the group at base: choice, choice 2,
  ;; low[16][8], mid[16][8], high[256].
  (func $length (param $base i32) (param $posState i32) (result i32)
    (if (i32.eqz (call $bit (local.get $base)))
      (then (return (call $tree (i32.add (i32.add (local.get $base) (i32.const 2))
                                         (i32.shl (local.get $posState) (i32.const 3)))
                                (i32.const 3)))))
    (if (i32.eqz (call $bit (i32.add (local.get $base) (i32.const 1))))
      (then (return (i32.add (i32.const 8)
                             (call $tree (i32.add (i32.add (local.get $base) (i32.const 130))
                                                  (i32.shl (local.get $posState) (i32.const 3)))
                                         (i32.const 3))))))
    (i32.add (i32.const 16) (call $tree (i32.add (local.get $base) (i32.const 258)) (i32.const 8))))

;; lzmaStart readies the stream at [in, inEnd) (its 13-byte header first) to be unpacked to
  ;; size bytes at out, with its probabilities at p; lzmaRun then unpacks it piece by piece.
  ;; (Engines compile a module quickly first and better later, and switch a function over
  ;; only between calls: one call for the whole module would run the quick code throughout.)
  (func $lzmaStart (export "lzmaStart")
    (param $in i32) (param $inEnd i32) (param $p i32) (param $out i32) (param $size i32)
    (local $d i32) (local $lp i32) (local $end i32) (local $i i32)
    (local.set $d (i32.load8_u (local.get $in)))
    (global.set $lc (i32.rem_u (local.get $d) (i32.const 9)))
    (local.set $d (i32.div_u (local.get $d) (i32.const 9)))
    (local.set $lp (i32.rem_u (local.get $d) (i32.const 5)))
    (global.set $pbMask (i32.sub (i32.shl (i32.const 1) (i32.div_u (local.get $d) (i32.const 5)))
                                 (i32.const 1)))
    (global.set $lpMask (i32.sub (i32.shl (i32.const 1) (local.get $lp)) (i32.const 1)))
    ;; Every probability starts at one half (1024 of 2048).
    (global.set $p (local.get $p))
    (local.set $end (i32.add (local.get $p)
                             (i32.shl (i32.add (i32.const 1846)
                                               (i32.shl (i32.const 0x300)
                                                        (i32.add (global.get $lc) (local.get $lp))))
                                      (i32.const 1))))
    (local.set $i (local.get $p))
    (loop $fill
      (i32.store16 (local.get $i) (i32.const 1024))
      (local.set $i (i32.add (local.get $i) (i32.const 2)))
      (br_if $fill (i32.lt_u (local.get $i) (local.get $end))))
    ;; The range coder: its first byte is always 0, then 4 bytes of code.
    (global.set $in (i32.add (local.get $in) (i32.const 13)))
    (global.set $inEnd (local.get $inEnd))
    (global.set $range (i32.const -1))
    (global.set $code (i32.const 0))
    (if (i32.lt_u (i32.sub (local.get $inEnd) (global.get $in)) (i32.const 5))
      (then (unreachable)))
    (local.set $i (i32.const 5))
    (loop $init
      (global.set $code (i32.or (i32.shl (global.get $code) (i32.const 8))
                                (i32.load8_u (global.get $in))))
      (global.set $in (i32.add (global.get $in) (i32.const 1)))
      (local.set $i (i32.sub (local.get $i) (i32.const 1)))
      (br_if $init (local.get $i)))
    (global.set $out (local.get $out))
    (global.set $o (local.get $out))
    (global.set $end (i32.add (local.get $out) (local.get $size)))
    (global.set $state (i32.const 0))
    (global.set $rep0 (i32.const 0))
    (global.set $rep1 (i32.const 0))
    (global.set $rep2 (i32.const 0))
    (global.set $rep3 (i32.const 0)))

  ;; lzmaRun unpacks at least n more bytes (fewer at the end) and returns how many are still to
  ;; come: 0 when all are there. It returns -1 for a stream that refers to bytes before the
  ;; start (damaged) and -2 for one whose end marker comes early; a stream cut short traps
  ;; (in norm).
  (func $lzmaRun (export "lzmaRun") (param $n i32) (result i32)
    (local $lc i32) (local $pbMask i32) (local $lpMask i32) (local $out i32)
    (local $o i32) (local $end i32) (local $stop i32) (local $pos i32) (local $state i32)
    (local $posState i32) (local $rep0 i32) (local $rep1 i32) (local $rep2 i32) (local $rep3 i32)
    (local $len i32) (local $sym i32) (local $base i32) (local $match i32) (local $mb i32)
    (local $b i32) (local $slot i32) (local $nd i32) (local $dist i32)
    ;; The range coder in locals for the literals (bit, inlined).
    (local $p i32) (local $range i32) (local $code i32) (local $in i32) (local $inEnd i32)
    (local $a i32) (local $v i32) (local $bound i32)
    (local.set $lc (global.get $lc))
    (local.set $pbMask (global.get $pbMask))
    (local.set $lpMask (global.get $lpMask))
    (local.set $out (global.get $out))
    (local.set $o (global.get $o))
    (local.set $end (global.get $end))
    (local.set $state (global.get $state))
    (local.set $rep0 (global.get $rep0))
    (local.set $rep1 (global.get $rep1))
    (local.set $rep2 (global.get $rep2))
    (local.set $rep3 (global.get $rep3))
    (local.set $p (global.get $p))
    (local.set $range (global.get $range))
    (local.set $code (global.get $code))
    (local.set $in (global.get $in))
    (local.set $inEnd (global.get $inEnd))
    (local.set $stop (local.get $end))
    (if (i32.lt_u (local.get $n) (i32.sub (local.get $end) (local.get $o)))
      (then (local.set $stop (i32.add (local.get $o) (local.get $n)))))
    (block $done
      (loop $next
        (br_if $done (i32.ge_u (local.get $o) (local.get $stop)))
        (local.set $pos (i32.sub (local.get $o) (local.get $out)))
        (local.set $posState (i32.and (local.get $pos) (local.get $pbMask)))
        (local.set $a (i32.add (local.get $p) (i32.shl (i32.add (i32.shl (local.get $state) (i32.const 4)) (local.get $posState)) (i32.const 1))))
        (local.set $v (i32.load16_u (local.get $a)))
        (local.set $bound (i32.mul (i32.shr_u (local.get $range) (i32.const 11)) (local.get $v)))
        (if (i32.lt_u (local.get $code) (local.get $bound))
          (then
            (local.set $range (local.get $bound))
            (i32.store16 (local.get $a)
              (i32.add (local.get $v) (i32.shr_u (i32.sub (i32.const 2048) (local.get $v)) (i32.const 5))))
            (local.set $b (i32.const 0)))
          (else
            (local.set $range (i32.sub (local.get $range) (local.get $bound)))
            (local.set $code (i32.sub (local.get $code) (local.get $bound)))
            (i32.store16 (local.get $a) (i32.sub (local.get $v) (i32.shr_u (local.get $v) (i32.const 5))))
            (local.set $b (i32.const 1))))
        (if (i32.lt_u (local.get $range) (i32.const 0x1000000))
          (then
            (if (i32.ge_u (local.get $in) (local.get $inEnd))
              (then (unreachable)))
            (local.set $range (i32.shl (local.get $range) (i32.const 8)))
            (local.set $code (i32.or (i32.shl (local.get $code) (i32.const 8)) (i32.load8_u (local.get $in))))
            (local.set $in (i32.add (local.get $in) (i32.const 1)))))
        (if (i32.eqz (local.get $b))
          (then
            ;; A literal, coded with the probabilities chosen by the previous byte's high
            ;; lc bits and the position's low lp bits.
            (local.set $b (i32.const 0))
            (if (local.get $pos)
              (then (local.set $b (i32.load8_u (i32.sub (local.get $o) (i32.const 1))))))
            (local.set $base
              (i32.add (i32.const 1846)
                       (i32.mul (i32.const 0x300)
                                (i32.add (i32.shl (i32.and (local.get $pos) (local.get $lpMask))
                                                  (local.get $lc))
                                         (i32.shr_u (local.get $b)
                                                    (i32.sub (i32.const 8) (local.get $lc)))))))
            (local.set $sym (i32.const 1))
            (if (i32.ge_u (local.get $state) (i32.const 7))
              (then
                ;; After a match: the byte at the last distance guides the bits until one differs.
                (local.set $match (i32.load8_u (i32.sub (i32.sub (local.get $o) (local.get $rep0))
                                                        (i32.const 1))))
                (block $differs
                  (loop $matched
                    (local.set $mb (i32.and (i32.shr_u (local.get $match) (i32.const 7)) (i32.const 1)))
                    (local.set $match (i32.shl (local.get $match) (i32.const 1)))
                    (local.set $a (i32.add (local.get $p) (i32.shl (i32.add (local.get $base)
                                                 (i32.add (i32.shl (i32.add (local.get $mb) (i32.const 1)) (i32.const 8))
                                                          (local.get $sym))) (i32.const 1))))
                    (local.set $v (i32.load16_u (local.get $a)))
                    (local.set $bound (i32.mul (i32.shr_u (local.get $range) (i32.const 11)) (local.get $v)))
                    (if (i32.lt_u (local.get $code) (local.get $bound))
                      (then
                        (local.set $range (local.get $bound))
                        (i32.store16 (local.get $a)
                          (i32.add (local.get $v) (i32.shr_u (i32.sub (i32.const 2048) (local.get $v)) (i32.const 5))))
                        (local.set $b (i32.const 0)))
                      (else
                        (local.set $range (i32.sub (local.get $range) (local.get $bound)))
                        (local.set $code (i32.sub (local.get $code) (local.get $bound)))
                        (i32.store16 (local.get $a) (i32.sub (local.get $v) (i32.shr_u (local.get $v) (i32.const 5))))
                        (local.set $b (i32.const 1))))
                    (if (i32.lt_u (local.get $range) (i32.const 0x1000000))
                      (then
                        (if (i32.ge_u (local.get $in) (local.get $inEnd))
                          (then (unreachable)))
                        (local.set $range (i32.shl (local.get $range) (i32.const 8)))
                        (local.set $code (i32.or (i32.shl (local.get $code) (i32.const 8)) (i32.load8_u (local.get $in))))
                        (local.set $in (i32.add (local.get $in) (i32.const 1)))))
                    (local.set $sym (i32.or (i32.shl (local.get $sym) (i32.const 1)) (local.get $b)))
                    (br_if $differs (i32.ne (local.get $mb) (local.get $b)))
                    (br_if $matched (i32.lt_u (local.get $sym) (i32.const 0x100)))))))
            (block $byteDone
              (loop $plain
                (br_if $byteDone (i32.ge_u (local.get $sym) (i32.const 0x100)))
                (local.set $a (i32.add (local.get $p) (i32.shl (i32.add (local.get $base) (local.get $sym)) (i32.const 1))))
                (local.set $v (i32.load16_u (local.get $a)))
                (local.set $bound (i32.mul (i32.shr_u (local.get $range) (i32.const 11)) (local.get $v)))
                (if (i32.lt_u (local.get $code) (local.get $bound))
                  (then
                    (local.set $range (local.get $bound))
                    (i32.store16 (local.get $a)
                      (i32.add (local.get $v) (i32.shr_u (i32.sub (i32.const 2048) (local.get $v)) (i32.const 5))))
                    (local.set $b (i32.const 0)))
                  (else
                    (local.set $range (i32.sub (local.get $range) (local.get $bound)))
                    (local.set $code (i32.sub (local.get $code) (local.get $bound)))
                    (i32.store16 (local.get $a) (i32.sub (local.get $v) (i32.shr_u (local.get $v) (i32.const 5))))
                    (local.set $b (i32.const 1))))
                (if (i32.lt_u (local.get $range) (i32.const 0x1000000))
                  (then
                    (if (i32.ge_u (local.get $in) (local.get $inEnd))
                      (then (unreachable)))
                    (local.set $range (i32.shl (local.get $range) (i32.const 8)))
                    (local.set $code (i32.or (i32.shl (local.get $code) (i32.const 8)) (i32.load8_u (local.get $in))))
                    (local.set $in (i32.add (local.get $in) (i32.const 1)))))
                (local.set $sym (i32.or (i32.shl (local.get $sym) (i32.const 1)) (local.get $b)))
                (br $plain)))
            (i32.store8 (local.get $o) (local.get $sym))
            (local.set $o (i32.add (local.get $o) (i32.const 1)))
            (local.set $state
              (select (i32.const 0)
                      (select (i32.sub (local.get $state) (i32.const 3))
                              (i32.sub (local.get $state) (i32.const 6))
                              (i32.lt_u (local.get $state) (i32.const 10)))
                      (i32.lt_u (local.get $state) (i32.const 4))))
            (br $next)))
        ;; A match: the helpers (bit, tree, length...) decode it with the coder in globals.
        (global.set $range (local.get $range))
        (global.set $code (local.get $code))
        (global.set $in (local.get $in))
        (if (call $bit (i32.add (i32.const 192) (local.get $state)))
          (then
            ;; A repeat of one of the last four distances.
            (if (i32.eqz (local.get $pos))
              (then (return (i32.const -1))))
            (if (i32.eqz (call $bit (i32.add (i32.const 204) (local.get $state))))
              (then
                (if (i32.eqz (call $bit (i32.add (i32.const 240)
                                                 (i32.add (i32.shl (local.get $state) (i32.const 4))
                                                          (local.get $posState)))))
                  (then
                    ;; One byte at the last distance.
                    (local.set $state (select (i32.const 9) (i32.const 11)
                                              (i32.lt_u (local.get $state) (i32.const 7))))
                    (i32.store8 (local.get $o)
                      (i32.load8_u (i32.sub (i32.sub (local.get $o) (local.get $rep0)) (i32.const 1))))
                    (local.set $o (i32.add (local.get $o) (i32.const 1)))
                    (local.set $range (global.get $range))
                    (local.set $code (global.get $code))
                    (local.set $in (global.get $in))
                    (br $next))))
              (else
                (if (i32.eqz (call $bit (i32.add (i32.const 216) (local.get $state))))
                  (then (local.set $dist (local.get $rep1)))
                  (else
                    (if (i32.eqz (call $bit (i32.add (i32.const 228) (local.get $state))))
                      (then (local.set $dist (local.get $rep2)))
                      (else
                        (local.set $dist (local.get $rep3))
                        (local.set $rep3 (local.get $rep2))))
                    (local.set $rep2 (local.get $rep1))))
                (local.set $rep1 (local.get $rep0))
                (local.set $rep0 (local.get $dist))))
            (local.set $len (call $length (i32.const 1332) (local.get $posState)))
            (local.set $state (select (i32.const 8) (i32.const 11)
                                      (i32.lt_u (local.get $state) (i32.const 7)))))
          (else
            ;; A match at a new distance: length, then a 6-bit slot, then the distance's bits.
            (local.set $rep3 (local.get $rep2))
            (local.set $rep2 (local.get $rep1))
            (local.set $rep1 (local.get $rep0))
            (local.set $len (call $length (i32.const 818) (local.get $posState)))
            (local.set $state (select (i32.const 7) (i32.const 10)
                                      (i32.lt_u (local.get $state) (i32.const 7))))
            (local.set $slot
              (call $tree (i32.add (i32.const 432)
                                   (i32.shl (select (local.get $len) (i32.const 3)
                                                    (i32.lt_u (local.get $len) (i32.const 3)))
                                            (i32.const 6)))
                          (i32.const 6)))
            (if (i32.lt_u (local.get $slot) (i32.const 4))
              (then (local.set $rep0 (local.get $slot)))
              (else
                (local.set $nd (i32.sub (i32.shr_u (local.get $slot) (i32.const 1)) (i32.const 1)))
                (local.set $rep0 (i32.shl (i32.or (i32.const 2) (i32.and (local.get $slot) (i32.const 1)))
                                          (local.get $nd)))
                (if (i32.lt_u (local.get $slot) (i32.const 14))
                  (then
                    (local.set $rep0
                      (i32.add (local.get $rep0)
                               (call $reverse (i32.sub (i32.sub (i32.add (i32.const 688) (local.get $rep0))
                                                                (local.get $slot))
                                                       (i32.const 1))
                                              (local.get $nd)))))
                  (else
                    (local.set $rep0
                      (i32.add (local.get $rep0)
                               (i32.add (i32.shl (call $direct (i32.sub (local.get $nd) (i32.const 4)))
                                                 (i32.const 4))
                                        (call $reverse (i32.const 802) (i32.const 4)))))
;; The end marker (distance 2^32 - 1) before the last byte.
                    (if (i32.eq (local.get $rep0) (i32.const -1))
                      (then (return (i32.const -2))))))))))
        (local.set $range (global.get $range))
        (local.set $code (global.get $code))
        (local.set $in (global.get $in))
        (local.set $len (i32.add (local.get $len) (i32.const 2)))
        (if (i32.ge_u (local.get $rep0) (local.get $pos))
          (then (return (i32.const -1))))
        (if (i32.gt_u (local.get $len) (i32.sub (local.get $end) (local.get $o)))
          (then (local.set $len (i32.sub (local.get $end) (local.get $o)))))
        ;; Copy byte by byte: the source may overlap what is being written (a run).
        (local.set $b (i32.sub (i32.sub (local.get $o) (local.get $rep0)) (i32.const 1)))
        (local.set $len (i32.add (local.get $o) (local.get $len)))
        (loop $copy
          (i32.store8 (local.get $o) (i32.load8_u (local.get $b)))
          (local.set $o (i32.add (local.get $o) (i32.const 1)))
          (local.set $b (i32.add (local.get $b) (i32.const 1)))
          (br_if $copy (i32.lt_u (local.get $o) (local.get $len))))
        (br $next)))
    (global.set $range (local.get $range))
    (global.set $code (local.get $code))
    (global.set $in (local.get $in))
    (global.set $o (local.get $o))
    (global.set $state (local.get $state))
    (global.set $rep0 (local.get $rep0))
    (global.set $rep1 (local.get $rep1))
    (global.set $rep2 (local.get $rep2))
    (global.set $rep3 (local.get $rep3))
    (i32.sub (local.get $end) (local.get $o)))
)
