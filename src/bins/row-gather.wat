;; Copies rows of CSV bytes, each followed by the bytes of its own suffix (bucket label and index cells),
;; from an input region into an output region of this module's memory: bucket's hot loop of whole-row
;; output (src/bins/csv-rows.ts), where a JavaScript copy costs about five times as much per row.
;;
;; gather(n, firsts, lasts, ks, table, none, base, out) -> the end of the output
;;   row i is the input bytes [firsts[i] - base, lasts[i] - base) (i32 arrays at `firsts` and `lasts`);
;;   its suffix is entry ks[i] of the table at `table` (i32 pairs: offset, length), entry `none` when
;;   ks[i] is negative. Bytes are moved eight at a time: a copy may write up to 7 bytes past its end, which
;;   the next copy overwrites, and read up to 7 bytes past its source (the caller leaves room for both).
;;
;; formulas(n, firsts, lasts, base, flags) -> how many rows it flagged
;;   for rows of quote-free, comma-separated bytes laid out as for gather: flags[i] (a byte) is set to 1
;;   when a byte of row i that starts a field (the row's first byte, or one after a ',') is one of
;;   = + - @ TAB, the first bytes of a formula-like cell (OWASP CSV Injection; an unquoted field holds no
;;   CR or LF). One sweep of sixteen bytes at a time over the input from the first row to the end of the
;;   last: a field start is a byte after ',', LF or CR (a row's first byte follows the line end before it;
;;   bytes between rows, such as rejected rows, belong to no row and are passed over). The first row's
;;   first byte is read alone, its predecessor not being the batch's. Reads up to 15 bytes past the end.
(module
  (memory (export "memory") 1)
  (func (export "gather") (param $n i32) (param $firsts i32) (param $lasts i32) (param $ks i32)
        (param $table i32) (param $none i32) (param $base i32) (param $out i32) (result i32)
    (local $i i32) (local $src i32) (local $end i32) (local $k i32) (local $entry i32)
    (block $done
      (loop $rows
        (br_if $done (i32.ge_u (local.get $i) (local.get $n)))
        ;; the row
        (local.set $src (i32.sub (i32.load (i32.add (local.get $firsts) (i32.shl (local.get $i) (i32.const 2)))) (local.get $base)))
        (local.set $end (i32.add (local.get $out)
          (i32.sub (i32.sub (i32.load (i32.add (local.get $lasts) (i32.shl (local.get $i) (i32.const 2)))) (local.get $base)) (local.get $src))))
        (block $rowDone
          (loop $row
            (br_if $rowDone (i32.ge_u (local.get $out) (local.get $end)))
            (i64.store align=1 (local.get $out) (i64.load align=1 (local.get $src)))
            (local.set $out (i32.add (local.get $out) (i32.const 8)))
            (local.set $src (i32.add (local.get $src) (i32.const 8)))
            (br $row)))
        (local.set $out (local.get $end))
        ;; its suffix
        (local.set $k (i32.load (i32.add (local.get $ks) (i32.shl (local.get $i) (i32.const 2)))))
        (if (i32.lt_s (local.get $k) (i32.const 0)) (then (local.set $k (local.get $none))))
        (local.set $entry (i32.add (local.get $table) (i32.shl (local.get $k) (i32.const 3))))
        (local.set $src (i32.load (local.get $entry)))
        (local.set $end (i32.add (local.get $out) (i32.load offset=4 (local.get $entry))))
        (block $sufDone
          (loop $suf
            (br_if $sufDone (i32.ge_u (local.get $out) (local.get $end)))
            (i64.store align=1 (local.get $out) (i64.load align=1 (local.get $src)))
            (local.set $out (i32.add (local.get $out) (i32.const 8)))
            (local.set $src (i32.add (local.get $src) (i32.const 8)))
            (br $suf)))
        (local.set $out (local.get $end))
        (local.set $i (i32.add (local.get $i) (i32.const 1)))
        (br $rows)))
    (local.get $out))
  (func $isFormulaStart (param $b i32) (result i32)
    (i32.or (i32.or (i32.eq (local.get $b) (i32.const 61)) (i32.eq (local.get $b) (i32.const 43)))
            (i32.or (i32.or (i32.eq (local.get $b) (i32.const 45)) (i32.eq (local.get $b) (i32.const 64)))
                    (i32.eq (local.get $b) (i32.const 9)))))
  (func (export "formulas") (param $n i32) (param $firsts i32) (param $lasts i32) (param $base i32) (param $flags i32) (result i32)
    (local $j i32) (local $start i32) (local $end i32) (local $m i32) (local $pos i32) (local $r i32)
    (local $count i32) (local $rem i32) (local $v v128) (local $p v128)
    (if (i32.eqz (local.get $n)) (then (return (i32.const 0))))
    (memory.fill (local.get $flags) (i32.const 0) (local.get $n))
    (local.set $start (i32.sub (i32.load (local.get $firsts)) (local.get $base)))
    (local.set $end (i32.sub (i32.load (i32.add (local.get $lasts) (i32.shl (i32.sub (local.get $n) (i32.const 1)) (i32.const 2)))) (local.get $base)))
    (local.set $j (local.get $start))
    (block $done
      (loop $scan
        (br_if $done (i32.ge_s (local.get $j) (local.get $end)))
        (local.set $v (v128.load align=1 (local.get $j)))
        (local.set $p (v128.load align=1 (i32.sub (local.get $j) (i32.const 1))))
        (local.set $m (i8x16.bitmask (v128.and
          (v128.or (v128.or (i8x16.eq (local.get $p) (i8x16.splat (i32.const 44)))
                            (i8x16.eq (local.get $p) (i8x16.splat (i32.const 10))))
                   (i8x16.eq (local.get $p) (i8x16.splat (i32.const 13))))
          (v128.or (v128.or (v128.or (i8x16.eq (local.get $v) (i8x16.splat (i32.const 61)))
                                     (i8x16.eq (local.get $v) (i8x16.splat (i32.const 43))))
                            (v128.or (i8x16.eq (local.get $v) (i8x16.splat (i32.const 45)))
                                     (i8x16.eq (local.get $v) (i8x16.splat (i32.const 64)))))
                   (i8x16.eq (local.get $v) (i8x16.splat (i32.const 9)))))))
        (if (i32.eq (local.get $j) (local.get $start))
          (then (local.set $m (i32.or (i32.and (local.get $m) (i32.const -2))
                                      (call $isFormulaStart (i32.load8_u (local.get $j)))))))
        (local.set $rem (i32.sub (local.get $end) (local.get $j)))
        (if (i32.lt_s (local.get $rem) (i32.const 16))
          (then (local.set $m (i32.and (local.get $m) (i32.sub (i32.shl (i32.const 1) (local.get $rem)) (i32.const 1))))))
        (block $bitsDone
          (loop $bits
            (br_if $bitsDone (i32.eqz (local.get $m)))
            (local.set $pos (i32.add (i32.add (local.get $j) (i32.ctz (local.get $m))) (local.get $base)))
            ;; the row holding the byte: the first row ending after it, when that row starts at or before it
            (block $found
              (loop $advance
                (br_if $found (i32.ge_u (local.get $r) (local.get $n)))
                (br_if $found (i32.gt_s (i32.load (i32.add (local.get $lasts) (i32.shl (local.get $r) (i32.const 2)))) (local.get $pos)))
                (local.set $r (i32.add (local.get $r) (i32.const 1)))
                (br $advance)))
            (if (i32.lt_u (local.get $r) (local.get $n))
              (then
                (if (i32.le_s (i32.load (i32.add (local.get $firsts) (i32.shl (local.get $r) (i32.const 2)))) (local.get $pos))
                  (then
                    (if (i32.eqz (i32.load8_u (i32.add (local.get $flags) (local.get $r))))
                      (then
                        (i32.store8 (i32.add (local.get $flags) (local.get $r)) (i32.const 1))
                        (local.set $count (i32.add (local.get $count) (i32.const 1)))))))))
            (local.set $m (i32.and (local.get $m) (i32.sub (local.get $m) (i32.const 1))))
            (br $bits)))
        (local.set $j (i32.add (local.get $j) (i32.const 16)))
        (br $scan)))
    (local.get $count)))
