;; The records of a quote-free stretch of delimited text, found with WebAssembly SIMD: delimiters (the
;; comma, tab, semicolon, pipe or another ASCII byte), line feeds (10) and carriage returns (13) are found
;; sixteen bytes at a time, and walked into records.
;; For each record the kernel writes where it ends, how many fields it has and the bounds of the fields
;; the caller wants. Compiled by `npm run wasm` into structurals-wasm.ts; test/wasm checks the two agree
;; and holds the kernel to a plain JavaScript model.
;;
;; Memory (80 pages of 64 KiB, never grown, so JavaScript views of it stay valid):
;;   [0, 65552)          INPUT: up to SPAN = 65536 bytes to scan, the byte after them, and slack
;;   [65600, 65632)      STATE: i32 record start, field start, field number, LF to skip, wanted slot, status
;;   [65664, 65728)      CARRY: the wanted bounds already found of a record that runs on into the next call
;;   [65728, ...)        OUTPUT: one block of `stride` i32 per record: end, fields, then start and end of
;;                       each wanted field in field order
;; Offsets in STATE and OUTPUT are absolute: input byte i is at `base` + i in the caller's buffer.
(module
  (memory (export "memory") 80)

  ;; Walks input[0, length) into records, fields split at byte `delim`; returns how many it wrote. A record unfinished at `length` is
  ;; carried in STATE to the next call. Stops early, with status 1, at a CR that is the input's last byte
  ;; when `ahead` is 0 (no byte follows in the caller's buffer, so CR or CRLF cannot be told yet), and with
  ;; status 2 once a record ends at or past `stop`. Reads up to 15 bytes of slack past `length`, and the
  ;; byte at `length` when `ahead` is 1.
  (func (export "records") (param $length i32) (param $base i32) (param $want i32) (param $stride i32)
        (param $stop i32) (param $ahead i32) (param $delim i32) (result i32)
    (local $p i32) (local $m i32) (local $v v128) (local $left i32) (local $s i32) (local $abs i32) (local $c i32)
    (local $rec i32) (local $field i32) (local $f i32) (local $skip i32) (local $slot i32)
    (local $o i32) (local $n i32) (local $end i32) (local $status i32)
    (local.set $rec (i32.load (i32.const 65600)))
    (local.set $field (i32.load (i32.const 65604)))
    (local.set $f (i32.load (i32.const 65608)))
    (local.set $skip (i32.load (i32.const 65612)))
    (local.set $slot (i32.load (i32.const 65616)))
    (local.set $o (i32.const 65728))
    ;; The bounds a record carried over from the last call had found, back in its block.
    (memory.copy (i32.const 65736) (i32.const 65664) (i32.shl (local.get $slot) (i32.const 3)))
    (block $exit
      (loop $block
        (br_if $exit (i32.ge_u (local.get $p) (local.get $length)))
        (local.set $v (v128.load align=1 (local.get $p)))
        (local.set $m
          (i8x16.bitmask
            (v128.or
              (v128.or
                (i8x16.eq (local.get $v) (i8x16.splat (local.get $delim)))
                (i8x16.eq (local.get $v) (i8x16.splat (i32.const 10))))
              (i8x16.eq (local.get $v) (i8x16.splat (i32.const 13))))))
        ;; The last block: keep only the bits of bytes before `length`.
        (local.set $left (i32.sub (local.get $length) (local.get $p)))
        (if (i32.lt_u (local.get $left) (i32.const 16))
          (then
            (local.set $m
              (i32.and (local.get $m) (i32.sub (i32.shl (i32.const 1) (local.get $left)) (i32.const 1))))))
        ;; Each structural byte, lowest first.
        (block $bits
          (loop $bit
            (br_if $bits (i32.eqz (local.get $m)))
            (local.set $s (i32.add (local.get $p) (i32.ctz (local.get $m))))
            (local.set $m (i32.and (local.get $m) (i32.sub (local.get $m) (i32.const 1))))
            (local.set $abs (i32.add (local.get $base) (local.get $s)))
            ;; The LF of a CRLF whose CR already ended a record.
            (br_if $bit (i32.eq (local.get $abs) (local.get $skip)))
            (local.set $c (i32.load8_u (local.get $s)))
            ;; A field ends here: keep its bounds when the caller wants it.
            (if (i32.lt_u (local.get $f) (i32.const 32))
              (then
                (if (i32.and (i32.shr_u (local.get $want) (local.get $f)) (i32.const 1))
                  (then
                    (i32.store offset=8 (i32.add (local.get $o) (i32.shl (local.get $slot) (i32.const 3))) (local.get $field))
                    (i32.store offset=12 (i32.add (local.get $o) (i32.shl (local.get $slot) (i32.const 3))) (local.get $abs))
                    (local.set $slot (i32.add (local.get $slot) (i32.const 1)))))))
            (local.set $f (i32.add (local.get $f) (i32.const 1)))
            (if (i32.eq (local.get $c) (local.get $delim))
              (then
                (local.set $field (i32.add (local.get $abs) (i32.const 1)))
                (br $bit)))
            ;; A line break ends the record.
            (local.set $end (i32.add (local.get $abs) (i32.const 1)))
            (if (i32.eq (local.get $c) (i32.const 13))
              (then
                (if (i32.and (i32.ge_u (i32.add (local.get $s) (i32.const 1)) (local.get $length)) (i32.eqz (local.get $ahead)))
                  (then
                    (local.set $status (i32.const 1))
                    (br $exit)))
                (if (i32.eq (i32.load8_u (i32.add (local.get $s) (i32.const 1))) (i32.const 10))
                  (then
                    (local.set $skip (local.get $end))
                    (local.set $end (i32.add (local.get $end) (i32.const 1)))))))
            (i32.store (local.get $o) (local.get $end))
            (i32.store offset=4 (local.get $o) (local.get $f))
            (local.set $n (i32.add (local.get $n) (i32.const 1)))
            (local.set $o (i32.add (local.get $o) (i32.shl (local.get $stride) (i32.const 2))))
            (local.set $rec (local.get $end))
            (local.set $field (local.get $end))
            (local.set $f (i32.const 0))
            (local.set $slot (i32.const 0))
            (if (i32.ge_s (local.get $rec) (local.get $stop))
              (then
                (local.set $status (i32.const 2))
                (br $exit)))
            (br $bit)))
        (local.set $p (i32.add (local.get $p) (i32.const 16)))
        (br $block)))
    (memory.copy (i32.const 65664) (i32.add (local.get $o) (i32.const 8)) (i32.shl (local.get $slot) (i32.const 3)))
    (i32.store (i32.const 65600) (local.get $rec))
    (i32.store (i32.const 65604) (local.get $field))
    (i32.store (i32.const 65608) (local.get $f))
    (i32.store (i32.const 65612) (local.get $skip))
    (i32.store (i32.const 65616) (local.get $slot))
    (i32.store (i32.const 65620) (local.get $status))
    (local.get $n))
)
