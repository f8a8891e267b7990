;; The records of delimited text, found with WebAssembly SIMD: delimiters (the comma, tab, semicolon, pipe
;; or another ASCII byte), double quotes (34), line feeds (10) and carriage returns (13) are found sixteen
;; bytes at a time, and walked into records.
;; For each record the kernel writes where it ends, how many fields it has and the bounds of the fields
;; the caller wants. Two walks: `records` for text the caller knows holds no quote, and `quotedRecords`,
;; which also reads a field enclosed in quotes (RFC 4180 §2.5) when it holds no quote and no line break
;; (delimiters inside are text, §2.6): its bounds are those of the text between the quotes. Any other
;; quote (doubled, §2.7; inside an unquoted field; text after a closing quote) and a line break inside
;; quotes stop it at the start of the record, which the caller's scanner then reads (it counts the lines
;; a record spans and undoes doubled quotes). The two share their record logic line for line; they are
;; kept apart because the quote handling, even never entered, slowed the walk of quote-free text by a
;; quarter (31 against 39 ms per 80 MB of the benchmark's file, V8 in Node 20).
;; A third export, `firstOther`, finds the first record written whose field count is not the header's.
;; Compiled by `npm run wasm` into structurals-wasm.ts; test/wasm checks the two agree
;; and holds the kernel to a plain JavaScript model.
;;
;; Memory (89 pages of 64 KiB, never grown, so JavaScript views of it stay valid; the 9 pages after the
;; first 80 are TALLY, the area of src/rebin/instant-tally.wat, which reads INPUT and OUTPUT in place):
;;   [0, 65552)          INPUT: up to SPAN = 65536 bytes to scan, the byte after them, and slack
;;   [65600, 65632)      STATE: i32 record start, field start, field number, LF to skip, wanted slot, status,
;;                       quote state (0 outside quotes, 1 inside, 2 just after a closing quote)
;;   [65664, 65728)      CARRY: the wanted bounds already found of a record that runs on into the next call
;;   [65728, 5242880)    OUTPUT: one block of `stride` i32 per record: end, fields, then start and end of
;;                       each wanted field in field order
;; Offsets in STATE and OUTPUT are absolute: input byte i is at `base` + i in the caller's buffer.
(module
  (memory (export "memory") 89)

  ;; Walks quote-free input[0, length) into records, fields split at byte `delim`; returns how many it
  ;; wrote. A record unfinished at `length` is carried in STATE to the next call. Stops early, with
  ;; status 1, at a CR that is the input's last byte when `ahead` is 0 (no byte follows in the caller's buffer, so CR or CRLF cannot be told yet), and with
  ;; status 2 once a record ends at or past `stop`. Reads up to 15 bytes of slack past `length`, and the
  ;; byte at `length` when `ahead` is 1.
  (func (export "records") (param $length i32) (param $base i32) (param $want i32) (param $stride i32)
        (param $stop i32) (param $ahead i32) (param $delim i32) (result i32)
    (local $p i32) (local $m i32) (local $v v128) (local $left i32) (local $s i32) (local $abs i32) (local $c i32)
    (local $rec i32) (local $field i32) (local $f i32) (local $skip i32) (local $slot i32)
    (local $o i32) (local $n i32) (local $end i32) (local $status i32)
    (local $eol v128) (local $breaks i32) (local $last i32) (local $below i32)
    ;; The highest wanted field: past it, a record's delimiters are only counted (see below).
    (local.set $last (i32.sub (i32.const 31) (i32.clz (local.get $want))))
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
        (local.set $eol
          (v128.or (i8x16.eq (local.get $v) (i8x16.splat (i32.const 10))) (i8x16.eq (local.get $v) (i8x16.splat (i32.const 13)))))
        (local.set $breaks (i8x16.bitmask (local.get $eol)))
        (local.set $m
          (i8x16.bitmask (v128.or (i8x16.eq (local.get $v) (i8x16.splat (local.get $delim))) (local.get $eol))))
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
            ;; Past the last wanted field every structural byte before the line break is a delimiter:
            ;; they are counted a block at a time (the records of a file whose wanted fields come
            ;; first then cost one step for those fields and one for the line break).
            (if (i32.gt_s (local.get $f) (local.get $last))
              (then
                (if (i32.eqz (i32.and (local.get $m) (local.get $breaks)))
                  (then
                    (local.set $f (i32.add (local.get $f) (i32.popcnt (local.get $m))))
                    (br $bits)))
                (local.set $below (i32.and (local.get $m) (local.get $breaks)))
                (local.set $below (i32.sub (i32.and (local.get $below) (i32.sub (i32.const 0) (local.get $below))) (i32.const 1)))
                (local.set $f (i32.add (local.get $f) (i32.popcnt (i32.and (local.get $m) (local.get $below)))))
                (local.set $m (i32.and (local.get $m) (i32.xor (local.get $below) (i32.const -1))))))
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

  ;; What `records` does, for input[0, length) that may hold quotes (quote state carried in STATE too).
  ;; Stops early, with status 1, at a CR or a quote inside quotes that is
  ;; the input's last byte when `ahead` is 0 (no byte follows in the caller's buffer, so CR or CRLF, a
  ;; closing or a doubled quote, cannot be told yet); with status 2 once a record ends at or past `stop`;
  ;; with status 3 at a quote or a quoted line break it leaves to the caller (STATE's record start then
  ;; says where that record begins). Reads up to 15 bytes of slack past `length`, and the
  ;; byte at `length` when `ahead` is 1.
  (func (export "quotedRecords") (param $length i32) (param $base i32) (param $want i32) (param $stride i32)
        (param $stop i32) (param $ahead i32) (param $delim i32) (result i32)
    (local $p i32) (local $m i32) (local $v v128) (local $left i32) (local $s i32) (local $abs i32) (local $c i32)
    (local $rec i32) (local $field i32) (local $f i32) (local $skip i32) (local $slot i32)
    (local $o i32) (local $n i32) (local $end i32) (local $status i32) (local $inq i32) (local $nb i32) (local $fe i32) (local $quoted i32) (local $qv v128)
    (local.set $rec (i32.load (i32.const 65600)))
    (local.set $field (i32.load (i32.const 65604)))
    (local.set $f (i32.load (i32.const 65608)))
    (local.set $skip (i32.load (i32.const 65612)))
    (local.set $slot (i32.load (i32.const 65616)))
    (local.set $inq (i32.load (i32.const 65624)))
    (local.set $o (i32.const 65728))
    ;; The bounds a record carried over from the last call had found, back in its block.
    (memory.copy (i32.const 65736) (i32.const 65664) (i32.shl (local.get $slot) (i32.const 3)))
    (block $exit
      (loop $block
        (br_if $exit (i32.ge_u (local.get $p) (local.get $length)))
        (local.set $v (v128.load align=1 (local.get $p)))
        (local.set $qv (i8x16.eq (local.get $v) (i8x16.splat (i32.const 34))))
        (local.set $m
          (i8x16.bitmask
            (v128.or
              (v128.or
                (i8x16.eq (local.get $v) (i8x16.splat (local.get $delim)))
                (i8x16.eq (local.get $v) (i8x16.splat (i32.const 10))))
              (v128.or
                (i8x16.eq (local.get $v) (i8x16.splat (i32.const 13)))
                (local.get $qv)))))
        ;; Whether quotes matter in this block: it holds one, or starts inside or just after a quoted
        ;; field. Blocks of plain fields (the common case) then pay one test per structural byte.
        (local.set $quoted (i32.or (v128.any_true (local.get $qv)) (local.get $inq)))
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
            (local.set $fe (local.get $abs))
            ;; Quotes, and whatever comes inside or just after a quoted field: one test keeps them off
            ;; the path of plain fields.
            (if (local.get $quoted)
              (then
                (if (i32.eq (local.get $c) (i32.const 34))
                  (then
                    (if (i32.eq (local.get $inq) (i32.const 1))
                      (then
                        ;; A quote inside quotes closes the field when a delimiter or a line break follows.
                        (if (i32.and (i32.ge_u (i32.add (local.get $s) (i32.const 1)) (local.get $length)) (i32.eqz (local.get $ahead)))
                          (then
                            (local.set $status (i32.const 1))
                            (br $exit)))
                        (local.set $nb (i32.load8_u (i32.add (local.get $s) (i32.const 1))))
                        (if (i32.or
                              (i32.or (i32.eq (local.get $nb) (local.get $delim)) (i32.eq (local.get $nb) (i32.const 10)))
                              (i32.eq (local.get $nb) (i32.const 13)))
                          (then
                            (local.set $inq (i32.const 2))
                            (br $bit)))
                        (local.set $status (i32.const 3))
                        (br $exit)))
                    ;; A quote that opens a field: its text starts after it.
                    (if (i32.and (i32.eqz (local.get $inq)) (i32.eq (local.get $abs) (local.get $field)))
                      (then
                        (local.set $inq (i32.const 1))
                        (local.set $field (i32.add (local.get $abs) (i32.const 1)))
                        (br $bit)))
                    (local.set $status (i32.const 3))
                    (br $exit)))
                ;; Inside quotes a delimiter is text; a line break is left to the caller.
                (if (i32.eq (local.get $inq) (i32.const 1))
                  (then
                    (br_if $bit (i32.eq (local.get $c) (local.get $delim)))
                    (local.set $status (i32.const 3))
                    (br $exit)))
                ;; Just after a closing quote: the field's text ends before it.
                (if (local.get $inq)
                  (then
                    (local.set $fe (i32.sub (local.get $abs) (i32.const 1)))
                    (local.set $inq (i32.const 0))))))
            ;; A field ends here (before its closing quote, if any): keep its bounds when the caller wants it.
            (if (i32.lt_u (local.get $f) (i32.const 32))
              (then
                (if (i32.and (i32.shr_u (local.get $want) (local.get $f)) (i32.const 1))
                  (then
                    (i32.store offset=8 (i32.add (local.get $o) (i32.shl (local.get $slot) (i32.const 3))) (local.get $field))
                    (i32.store offset=12 (i32.add (local.get $o) (i32.shl (local.get $slot) (i32.const 3))) (local.get $fe))
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
    (i32.store (i32.const 65624) (local.get $inq))
    (local.get $n))

  ;; The first of the records from..n-1 in OUTPUT (blocks of `stride` i32, a record's field count second)
  ;; whose field count is not `width`, or n when there is none. The caller takes the records before it as
  ;; they stand and reads that one again itself (a ragged row, or a blank line): one pass over the counts
  ;; here instead of a JavaScript check per record.
  (func (export "firstOther") (param $from i32) (param $n i32) (param $stride i32) (param $width i32) (result i32)
    (local $o i32) (local $step i32)
    (local.set $step (i32.shl (local.get $stride) (i32.const 2)))
    (local.set $o (i32.add (i32.const 65732) (i32.mul (local.get $from) (local.get $step))))
    (block $done
      (loop $next
        (br_if $done (i32.ge_u (local.get $from) (local.get $n)))
        (br_if $done (i32.ne (i32.load (local.get $o)) (local.get $width)))
        (local.set $from (i32.add (local.get $from) (i32.const 1)))
        (local.set $o (i32.add (local.get $o) (local.get $step)))
        (br $next)))
    (local.get $from))
)
