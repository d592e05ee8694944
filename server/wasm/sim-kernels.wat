;; Hot kernels of the Hadamard-basis QAOA layer in WebAssembly with 128-bit SIMD: one v128 holds
;; one amplitude (re, im), and H is real, so a butterfly is one f64x2.add and one f64x2.sub.
;; Same algorithm and pass plan as shared/engine/statevector/hadamard-kernels.ts (the JS oracle).
;; Written once with a small generator for the repetitive radix-8 body; edit this file directly.
;; All addresses are byte offsets into the imported (shared) memory; amplitude x of a state at S
;; is the 16 bytes at S + 16x. Phase tables hold 32 bytes per entry: (c, c, s, −s), so that
;; amp·(c − i s) = (c, c)·(re, im) + (s, −s)·(im, re).
(module
  (import "env" "memory" (memory 1 65536 shared))

  ;; Unnormalised Walsh–Hadamard butterflies over bytes [start, end) on `bits` qubits, the lowest
  ;; with partner distance d bytes (a multiple of 16); three qubits at a time, then two or one.
  (func $wht (export "wht") (param $start i32) (param $end i32) (param $d i32) (param $bits i32)
    (local $h i32) (local $h2 i32) (local $h3 i32) (local $h4 i32) (local $h5 i32) (local $h6 i32) (local $h7 i32)
    (local $span i32) (local $base i32) (local $i i32) (local $stop i32)
    (local $x0 v128) (local $x1 v128) (local $x2 v128) (local $x3 v128) (local $x4 v128) (local $x5 v128) (local $x6 v128) (local $x7 v128)
    (local $s01 v128) (local $d01 v128) (local $s23 v128) (local $d23 v128) (local $s45 v128) (local $d45 v128) (local $s67 v128) (local $d67 v128)
    (local.set $h (local.get $d))
    ;; radix 8: 3 qubit(s) per walk over the range
    (block $done8 (loop $next8
      (br_if $done8 (i32.lt_u (local.get $bits) (i32.const 3)))
      (local.set $h2 (i32.shl (local.get $h) (i32.const 1))) (local.set $h3 (i32.add (local.get $h2) (local.get $h)))
      (local.set $h4 (i32.shl (local.get $h) (i32.const 2))) (local.set $h5 (i32.add (local.get $h4) (local.get $h)))
      (local.set $h6 (i32.add (local.get $h4) (local.get $h2))) (local.set $h7 (i32.add (local.get $h6) (local.get $h)))
      (local.set $span (i32.shl (local.get $h) (i32.const 3)))
      (local.set $base (local.get $start))
      (block $bd (loop $bl
        (br_if $bd (i32.ge_u (local.get $base) (local.get $end)))
        (local.set $i (local.get $base))
        (local.set $stop (i32.add (local.get $base) (local.get $h)))
        (loop $il
          (local.set $x0 (v128.load (local.get $i)))
          (local.set $x1 (v128.load (i32.add (local.get $i) (local.get $h))))
          (local.set $x2 (v128.load (i32.add (local.get $i) (local.get $h2))))
          (local.set $x3 (v128.load (i32.add (local.get $i) (local.get $h3))))
          (local.set $x4 (v128.load (i32.add (local.get $i) (local.get $h4))))
          (local.set $x5 (v128.load (i32.add (local.get $i) (local.get $h5))))
          (local.set $x6 (v128.load (i32.add (local.get $i) (local.get $h6))))
          (local.set $x7 (v128.load (i32.add (local.get $i) (local.get $h7))))
          (local.set $s01 (f64x2.add (local.get $x0) (local.get $x1))) (local.set $d01 (f64x2.sub (local.get $x0) (local.get $x1)))
          (local.set $s23 (f64x2.add (local.get $x2) (local.get $x3))) (local.set $d23 (f64x2.sub (local.get $x2) (local.get $x3)))
          (local.set $s45 (f64x2.add (local.get $x4) (local.get $x5))) (local.set $d45 (f64x2.sub (local.get $x4) (local.get $x5)))
          (local.set $s67 (f64x2.add (local.get $x6) (local.get $x7))) (local.set $d67 (f64x2.sub (local.get $x6) (local.get $x7)))
          (local.set $x0 (f64x2.add (local.get $s01) (local.get $s23))) (local.set $x1 (f64x2.add (local.get $d01) (local.get $d23)))
          (local.set $x2 (f64x2.sub (local.get $s01) (local.get $s23))) (local.set $x3 (f64x2.sub (local.get $d01) (local.get $d23)))
          (local.set $x4 (f64x2.add (local.get $s45) (local.get $s67))) (local.set $x5 (f64x2.add (local.get $d45) (local.get $d67)))
          (local.set $x6 (f64x2.sub (local.get $s45) (local.get $s67))) (local.set $x7 (f64x2.sub (local.get $d45) (local.get $d67)))
          (v128.store (local.get $i) (f64x2.add (local.get $x0) (local.get $x4)))
          (v128.store (i32.add (local.get $i) (local.get $h)) (f64x2.add (local.get $x1) (local.get $x5)))
          (v128.store (i32.add (local.get $i) (local.get $h2)) (f64x2.add (local.get $x2) (local.get $x6)))
          (v128.store (i32.add (local.get $i) (local.get $h3)) (f64x2.add (local.get $x3) (local.get $x7)))
          (v128.store (i32.add (local.get $i) (local.get $h4)) (f64x2.sub (local.get $x0) (local.get $x4)))
          (v128.store (i32.add (local.get $i) (local.get $h5)) (f64x2.sub (local.get $x1) (local.get $x5)))
          (v128.store (i32.add (local.get $i) (local.get $h6)) (f64x2.sub (local.get $x2) (local.get $x6)))
          (v128.store (i32.add (local.get $i) (local.get $h7)) (f64x2.sub (local.get $x3) (local.get $x7)))
          (local.set $i (i32.add (local.get $i) (i32.const 16)))
          (br_if $il (i32.lt_u (local.get $i) (local.get $stop))))
        (local.set $base (i32.add (local.get $base) (local.get $span)))
        (br $bl)))
      (local.set $h (local.get $span))
      (local.set $bits (i32.sub (local.get $bits) (i32.const 3)))
      (br $next8)))
    ;; radix 4: 2 qubit(s) per walk over the range
    (block $done4 (loop $next4
      (br_if $done4 (i32.lt_u (local.get $bits) (i32.const 2)))
      (local.set $h2 (i32.shl (local.get $h) (i32.const 1))) (local.set $h3 (i32.add (local.get $h2) (local.get $h)))
      (local.set $h4 (i32.shl (local.get $h) (i32.const 2))) (local.set $h5 (i32.add (local.get $h4) (local.get $h)))
      (local.set $h6 (i32.add (local.get $h4) (local.get $h2))) (local.set $h7 (i32.add (local.get $h6) (local.get $h)))
      (local.set $span (i32.shl (local.get $h) (i32.const 2)))
      (local.set $base (local.get $start))
      (block $bd (loop $bl
        (br_if $bd (i32.ge_u (local.get $base) (local.get $end)))
        (local.set $i (local.get $base))
        (local.set $stop (i32.add (local.get $base) (local.get $h)))
        (loop $il
          (local.set $x0 (v128.load (local.get $i)))
          (local.set $x1 (v128.load (i32.add (local.get $i) (local.get $h))))
          (local.set $x2 (v128.load (i32.add (local.get $i) (local.get $h2))))
          (local.set $x3 (v128.load (i32.add (local.get $i) (local.get $h3))))
          (local.set $s01 (f64x2.add (local.get $x0) (local.get $x1))) (local.set $d01 (f64x2.sub (local.get $x0) (local.get $x1)))
          (local.set $s23 (f64x2.add (local.get $x2) (local.get $x3))) (local.set $d23 (f64x2.sub (local.get $x2) (local.get $x3)))
          (v128.store (local.get $i) (f64x2.add (local.get $s01) (local.get $s23)))
          (v128.store (i32.add (local.get $i) (local.get $h)) (f64x2.add (local.get $d01) (local.get $d23)))
          (v128.store (i32.add (local.get $i) (local.get $h2)) (f64x2.sub (local.get $s01) (local.get $s23)))
          (v128.store (i32.add (local.get $i) (local.get $h3)) (f64x2.sub (local.get $d01) (local.get $d23)))
          (local.set $i (i32.add (local.get $i) (i32.const 16)))
          (br_if $il (i32.lt_u (local.get $i) (local.get $stop))))
        (local.set $base (i32.add (local.get $base) (local.get $span)))
        (br $bl)))
      (local.set $h (local.get $span))
      (local.set $bits (i32.sub (local.get $bits) (i32.const 2)))
      (br $next4)))
    ;; radix 2: 1 qubit(s) per walk over the range
    (block $done2 (loop $next2
      (br_if $done2 (i32.lt_u (local.get $bits) (i32.const 1)))
      (local.set $h2 (i32.shl (local.get $h) (i32.const 1))) (local.set $h3 (i32.add (local.get $h2) (local.get $h)))
      (local.set $h4 (i32.shl (local.get $h) (i32.const 2))) (local.set $h5 (i32.add (local.get $h4) (local.get $h)))
      (local.set $h6 (i32.add (local.get $h4) (local.get $h2))) (local.set $h7 (i32.add (local.get $h6) (local.get $h)))
      (local.set $span (i32.shl (local.get $h) (i32.const 1)))
      (local.set $base (local.get $start))
      (block $bd (loop $bl
        (br_if $bd (i32.ge_u (local.get $base) (local.get $end)))
        (local.set $i (local.get $base))
        (local.set $stop (i32.add (local.get $base) (local.get $h)))
        (loop $il
          (local.set $x0 (v128.load (local.get $i))) (local.set $x1 (v128.load (i32.add (local.get $i) (local.get $h))))
          (v128.store (local.get $i) (f64x2.add (local.get $x0) (local.get $x1)))
          (v128.store (i32.add (local.get $i) (local.get $h)) (f64x2.sub (local.get $x0) (local.get $x1)))
          (local.set $i (i32.add (local.get $i) (i32.const 16)))
          (br_if $il (i32.lt_u (local.get $i) (local.get $stop))))
        (local.set $base (i32.add (local.get $base) (local.get $span)))
        (br $bl)))
      (local.set $h (local.get $span))
      (local.set $bits (i32.sub (local.get $bits) (i32.const 1)))
      (br $next2)))
  )

  ;; Weight phase on `count` amplitudes at p whose indices are base + k (k's bits disjoint from
  ;; base's): entry bw + popcount(k) of the table at wtab.
  (func $weightPhase (export "weightPhase") (param $p i32) (param $count i32) (param $bw i32) (param $wtab i32)
    (local $k i32) (local $t i32) (local $v v128)
    (block $done (loop $next
      (br_if $done (i32.ge_u (local.get $k) (local.get $count)))
      (local.set $t (i32.add (local.get $wtab) (i32.shl (i32.add (local.get $bw) (i32.popcnt (local.get $k))) (i32.const 5))))
      (local.set $v (v128.load (local.get $p)))
      (v128.store (local.get $p) (f64x2.add
        (f64x2.mul (v128.load (local.get $t)) (local.get $v))
        (f64x2.mul (v128.load offset=16 (local.get $t))
          (i8x16.shuffle 8 9 10 11 12 13 14 15 0 1 2 3 4 5 6 7 (local.get $v) (local.get $v)))))
      (local.set $p (i32.add (local.get $p) (i32.const 16)))
      (local.set $k (i32.add (local.get $k) (i32.const 1)))
      (br $next))))

  ;; Cost phase on `count` amplitudes at p: level index from idx (u16, or u32 when wide), table tab.
  (func $levelPhase (export "levelPhase") (param $p i32) (param $count i32) (param $idx i32) (param $wide i32) (param $tab i32)
    (local $k i32) (local $t i32) (local $v v128) (local $l i32)
    (block $done (loop $next
      (br_if $done (i32.ge_u (local.get $k) (local.get $count)))
      (if (local.get $wide)
        (then (local.set $l (i32.load (i32.add (local.get $idx) (i32.shl (local.get $k) (i32.const 2))))))
        (else (local.set $l (i32.load16_u (i32.add (local.get $idx) (i32.shl (local.get $k) (i32.const 1)))))))
      (local.set $t (i32.add (local.get $tab) (i32.shl (local.get $l) (i32.const 5))))
      (local.set $v (v128.load (local.get $p)))
      (v128.store (local.get $p) (f64x2.add
        (f64x2.mul (v128.load (local.get $t)) (local.get $v))
        (f64x2.mul (v128.load offset=16 (local.get $t))
          (i8x16.shuffle 8 9 10 11 12 13 14 15 0 1 2 3 4 5 6 7 (local.get $v) (local.get $v)))))
      (local.set $p (i32.add (local.get $p) (i32.const 16)))
      (local.set $k (i32.add (local.get $k) (i32.const 1)))
      (br $next))))

  ;; Low sweep over blocks [from, to) of 2^low amplitudes of the state at s: cost phase (idx ≥ 0:
  ;; index array of the state, byte offset), transform of qubits 0…low−1, and when wtab ≥ 0 the
  ;; weight phase and the second transform (whole mixer in one pass, low = n).
  (func (export "lowSweep") (param $s i32) (param $low i32) (param $wtab i32) (param $idx i32) (param $wide i32) (param $tab i32) (param $from i32) (param $to i32)
    (local $b i32) (local $start i32) (local $len i32) (local $count i32)
    (local.set $count (i32.shl (i32.const 1) (local.get $low)))
    (local.set $len (i32.shl (local.get $count) (i32.const 4)))
    (local.set $b (local.get $from))
    (block $done (loop $next
      (br_if $done (i32.ge_u (local.get $b) (local.get $to)))
      (local.set $start (i32.add (local.get $s) (i32.mul (local.get $b) (local.get $len))))
      (if (i32.ge_s (local.get $idx) (i32.const 0))
        (then (call $levelPhase (local.get $start) (local.get $count)
          (i32.add (local.get $idx) (i32.shl (i32.mul (local.get $b) (local.get $count)) (select (i32.const 2) (i32.const 1) (local.get $wide))))
          (local.get $wide) (local.get $tab))))
      (call $wht (local.get $start) (i32.add (local.get $start) (local.get $len)) (i32.const 16) (local.get $low))
      (if (i32.ge_s (local.get $wtab) (i32.const 0))
        (then
          (call $weightPhase (local.get $start) (local.get $count) (i32.popcnt (i32.mul (local.get $b) (local.get $count))) (local.get $wtab))
          (call $wht (local.get $start) (i32.add (local.get $start) (local.get $len)) (i32.const 16) (local.get $low))))
      (local.set $b (i32.add (local.get $b) (i32.const 1)))
      (br $next))))

  ;; Tile sweep over qubits lo…hi−1, tiles [from, to): 2^(hi−lo) rows (2^lo amplitudes apart) of
  ;; 2^run amplitudes copied to scratch, transformed (and when wtab ≥ 0: weight phase, transform
  ;; again), copied back. Same tiling as the JS highSweep / whtHighSweep.
  (func (export "highSweep") (param $s i32) (param $lo i32) (param $hi i32) (param $run i32) (param $wtab i32) (param $scratch i32) (param $from i32) (param $to i32)
    (local $tile i32) (local $runBytes i32) (local $rows i32) (local $rowStride i32) (local $tileBytes i32)
    (local $baseIdx i32) (local $src i32) (local $j i32) (local $w0 i32) (local $midBits i32)
    (local.set $runBytes (i32.shl (i32.const 16) (local.get $run)))
    (local.set $rows (i32.shl (i32.const 1) (i32.sub (local.get $hi) (local.get $lo))))
    (local.set $rowStride (i32.shl (i32.const 16) (local.get $lo)))
    (local.set $tileBytes (i32.mul (local.get $rows) (local.get $runBytes)))
    (local.set $midBits (i32.sub (local.get $lo) (local.get $run)))
    (local.set $tile (local.get $from))
    (block $done (loop $next
      (br_if $done (i32.ge_u (local.get $tile) (local.get $to)))
      (local.set $baseIdx (i32.or
        (i32.shl (i32.shr_u (local.get $tile) (local.get $midBits)) (local.get $hi))
        (i32.shl (i32.and (local.get $tile) (i32.sub (i32.shl (i32.const 1) (local.get $midBits)) (i32.const 1))) (local.get $run))))
      (local.set $src (i32.add (local.get $s) (i32.shl (local.get $baseIdx) (i32.const 4))))
      (local.set $j (i32.const 0))
      (block $cd (loop $cl
        (br_if $cd (i32.ge_u (local.get $j) (local.get $rows)))
        (memory.copy (i32.add (local.get $scratch) (i32.mul (local.get $j) (local.get $runBytes)))
          (i32.add (local.get $src) (i32.mul (local.get $j) (local.get $rowStride))) (local.get $runBytes))
        (local.set $j (i32.add (local.get $j) (i32.const 1)))
        (br $cl)))
      (call $wht (local.get $scratch) (i32.add (local.get $scratch) (local.get $tileBytes)) (local.get $runBytes) (i32.sub (local.get $hi) (local.get $lo)))
      (if (i32.ge_s (local.get $wtab) (i32.const 0))
        (then
          (local.set $w0 (i32.popcnt (local.get $baseIdx)))
          (local.set $j (i32.const 0))
          (block $pd (loop $pl
            (br_if $pd (i32.ge_u (local.get $j) (local.get $rows)))
            (call $weightPhase (i32.add (local.get $scratch) (i32.mul (local.get $j) (local.get $runBytes)))
              (i32.shl (i32.const 1) (local.get $run)) (i32.add (local.get $w0) (i32.popcnt (local.get $j))) (local.get $wtab))
            (local.set $j (i32.add (local.get $j) (i32.const 1)))
            (br $pl)))
          (call $wht (local.get $scratch) (i32.add (local.get $scratch) (local.get $tileBytes)) (local.get $runBytes) (i32.sub (local.get $hi) (local.get $lo)))))
      (local.set $j (i32.const 0))
      (block $bd (loop $bl
        (br_if $bd (i32.ge_u (local.get $j) (local.get $rows)))
        (memory.copy (i32.add (local.get $src) (i32.mul (local.get $j) (local.get $rowStride)))
          (i32.add (local.get $scratch) (i32.mul (local.get $j) (local.get $runBytes))) (local.get $runBytes))
        (local.set $j (i32.add (local.get $j) (i32.const 1)))
        (br $bl)))
      (local.set $tile (i32.add (local.get $tile) (i32.const 1)))
      (br $next))))
)
