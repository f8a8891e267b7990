;; Copies rows of CSV bytes, each followed by the bytes of its own suffix (bucket label and index cells),
;; from an input region into an output region of this module's memory: bucket's hot loop of whole-row
;; output (src/bins/csv-rows.ts), where a JavaScript copy costs about five times as much per row.
;;
;; gather(n, firsts, lasts, ks, table, none, base, out) -> the end of the output
;;   row i is the input bytes [firsts[i] - base, lasts[i] - base) (i32 arrays at `firsts` and `lasts`);
;;   its suffix is entry ks[i] of the table at `table` (i32 pairs: offset, length), entry `none` when
;;   ks[i] is negative. Bytes are moved eight at a time: a copy may write up to 7 bytes past its end, which
;;   the next copy overwrites, and read up to 7 bytes past its source (the caller leaves room for both).
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
    (local.get $out)))
