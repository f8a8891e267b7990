;; Counts instants into periods, in WebAssembly, straight from the record kernel's output (structurals.wat):
;; for each whole record the kernel wrote, the time field's bytes are read as an ISO 8601 date-time with a
;; UTC designator or an offset (YYYY-MM-DD[T ]HH:MM:SS[.f…](Z|±HH:MM), what the JavaScript lane of
;; src/time/iso-bytes.ts reads as an instant, with the same checks), its period found in a table of period
;; starts, and that period's count raised by one. A record it cannot count so (any other shape, a field
;; begun in an earlier span (only in a record longer than a span: the reader begins each span at a record),
;; an instant outside the table, an offset not yet noted) stops it; the caller
;; hands that record to the ordinary path and calls again from the next one.
;; Compiled by `npm run wasm` into instant-tally-wasm.ts; test/wasm holds it to src/time/iso-bytes.ts.
;;
;; It shares the kernel's memory (imported): input bytes from 0, OUTPUT blocks from 65728 (end, fields, then
;; start and end of each wanted field, absolute offsets: input byte i is `base` + i), and its own area
;; TALLY, from 5,242,880 (page 80):
;;   +0 f64 lo, +8 f64 hi      the period of the last instant counted, [lo, hi)
;;   +16 i32 its index          +20 i32 P, the periods in the table
;;   +24 i32 least index counted in this call, +28 its record; +32 greatest index, +36 its record
;;   +40 i32 why it stopped: 0 every record counted, 1 not an instant it reads, 2 outside the table,
;;       3 an offset not noted yet, 4 a record whose field count is not `width`
;;   +44 i32 offsets noted (0 to 4; 5: every offset is taken), +48 i32 × 4 the noted offsets (minutes)
;;   +64 f64 the instant outside the table (why 2)
;;   +72 i32 × 3 the date memo: bytes 0–3, 4–7 and 8–9 of the last date read, +84 i32 its day number
;;   +128 f64 STARTS[P + 1]: period i is [STARTS[i], STARTS[i + 1]), P at most 32,767
;;   +262,272 f64 COUNTS[P]
(module
  (import "kernel" "memory" (memory 89))

  ;; Counts the records from..n-1 of OUTPUT (`stride` i32 each; the time field's start at byte `field` of
  ;; a block; each as wide as `width` fields, unless it is -1); returns the first it did not count (n when
  ;; it counted them all), why at TALLY+40.
  (func (export "tally") (param $from i32) (param $n i32) (param $stride i32) (param $field i32) (param $base i32) (param $width i32) (result i32)
    (local $o i32) (local $step i32) (local $s i32) (local $e i32) (local $why i32)
    (local $days i32) (local $clock i32) (local $p i32) (local $c i32) (local $j i32) (local $bad i32)
    (local $y i32) (local $mo i32) (local $d i32) (local $h i32) (local $mi i32) (local $se i32) (local $off i32)
    (local $a i32) (local $b i32) (local $w i32) (local $k i32) (local $nk i32) (local $dim i32)
    (local $ms f64) (local $lo f64) (local $hi f64) (local $idx i32) (local $np i32) (local $l i32) (local $r i32) (local $mid i32)
    (local $minIdx i32) (local $minRec i32) (local $maxIdx i32) (local $maxRec i32)
    (local $ma i32) (local $mb i32) (local $mw i32) (local $mdays i32) (local $run f64) (local $x i64)
    (local.set $lo (f64.load (i32.const 5242880)))
    (local.set $hi (f64.load (i32.const 5242888)))
    (local.set $idx (i32.load (i32.const 5242896)))
    (local.set $np (i32.load (i32.const 5242900)))
    (local.set $minIdx (i32.const 0x7fffffff))
    (local.set $maxIdx (i32.const -1))
    (local.set $nk (i32.load (i32.const 5242924)))
    (local.set $ma (i32.load (i32.const 5242952)))
    (local.set $mb (i32.load (i32.const 5242956)))
    (local.set $mw (i32.load (i32.const 5242960)))
    (local.set $mdays (i32.load (i32.const 5242964)))
    (local.set $step (i32.shl (local.get $stride) (i32.const 2)))
    (local.set $o (i32.add (i32.add (i32.const 65728) (local.get $field)) (i32.mul (local.get $from) (local.get $step))))
    (block $stop
      (loop $next
        (br_if $stop (i32.ge_u (local.get $from) (local.get $n)))
        ;; A record not as wide as the header (when `width` is not -1) is not a whole row: why 4.
        (local.set $why (i32.const 4))
        (br_if $stop (i32.and (i32.ge_s (local.get $width) (i32.const 0))
                              (i32.ne (i32.load offset=4 (i32.sub (local.get $o) (local.get $field))) (local.get $width))))
        (local.set $why (i32.const 1))
        (local.set $s (i32.sub (i32.load (local.get $o)) (local.get $base)))
        (local.set $e (i32.sub (i32.load offset=4 (local.get $o)) (local.get $base)))
        ;; A field begun in an earlier span (a record longer than the span) is no longer in the input; a value
        ;; under 20 bytes is no instant.
        (br_if $stop (i32.lt_s (local.get $s) (i32.const 0)))
        (br_if $stop (i32.lt_s (i32.sub (local.get $e) (local.get $s)) (i32.const 20)))
        ;; The date: the memo's day number when its ten bytes are the last date's.
        (local.set $a (i32.load align=1 (local.get $s)))
        (local.set $b (i32.load offset=4 align=1 (local.get $s)))
        (local.set $w (i32.load16_u offset=8 align=1 (local.get $s)))
        (if (i32.and (i32.and (i32.eq (local.get $a) (local.get $ma)) (i32.eq (local.get $b) (local.get $mb)))
                     (i32.eq (local.get $w) (local.get $mw)))
          (then (local.set $days (local.get $mdays)))
          (else
            (br_if $stop (i32.ne (i32.load8_u offset=4 (local.get $s)) (i32.const 45)))
            (br_if $stop (i32.ne (i32.load8_u offset=7 (local.get $s)) (i32.const 45)))
            ;; (c - 48) as unsigned is 0–9 for an ASCII digit and larger for any other byte.
            (local.set $c (i32.sub (i32.load8_u (local.get $s)) (i32.const 48)))
            (local.set $bad (i32.gt_u (local.get $c) (i32.const 9)))
            (local.set $y (i32.mul (local.get $c) (i32.const 1000)))
            (local.set $c (i32.sub (i32.load8_u offset=1 (local.get $s)) (i32.const 48)))
            (local.set $bad (i32.or (local.get $bad) (i32.gt_u (local.get $c) (i32.const 9))))
            (local.set $y (i32.add (local.get $y) (i32.mul (local.get $c) (i32.const 100))))
            (local.set $c (i32.sub (i32.load8_u offset=2 (local.get $s)) (i32.const 48)))
            (local.set $bad (i32.or (local.get $bad) (i32.gt_u (local.get $c) (i32.const 9))))
            (local.set $y (i32.add (local.get $y) (i32.mul (local.get $c) (i32.const 10))))
            (local.set $c (i32.sub (i32.load8_u offset=3 (local.get $s)) (i32.const 48)))
            (local.set $bad (i32.or (local.get $bad) (i32.gt_u (local.get $c) (i32.const 9))))
            (local.set $y (i32.add (local.get $y) (local.get $c)))
            (local.set $c (i32.sub (i32.load8_u offset=5 (local.get $s)) (i32.const 48)))
            (local.set $bad (i32.or (local.get $bad) (i32.gt_u (local.get $c) (i32.const 9))))
            (local.set $mo (i32.mul (local.get $c) (i32.const 10)))
            (local.set $c (i32.sub (i32.load8_u offset=6 (local.get $s)) (i32.const 48)))
            (local.set $bad (i32.or (local.get $bad) (i32.gt_u (local.get $c) (i32.const 9))))
            (local.set $mo (i32.add (local.get $mo) (local.get $c)))
            (local.set $c (i32.sub (i32.load8_u offset=8 (local.get $s)) (i32.const 48)))
            (local.set $bad (i32.or (local.get $bad) (i32.gt_u (local.get $c) (i32.const 9))))
            (local.set $d (i32.mul (local.get $c) (i32.const 10)))
            (local.set $c (i32.sub (i32.load8_u offset=9 (local.get $s)) (i32.const 48)))
            (local.set $bad (i32.or (local.get $bad) (i32.gt_u (local.get $c) (i32.const 9))))
            (local.set $d (i32.add (local.get $d) (local.get $c)))
            (br_if $stop (local.get $bad))
            (br_if $stop (i32.or (i32.lt_u (local.get $mo) (i32.const 1)) (i32.gt_u (local.get $mo) (i32.const 12))))
            (br_if $stop (i32.lt_u (local.get $d) (i32.const 1)))
            ;; Days in the month: 30 or 31 by the month, February 28 or 29 (Gregorian leap years).
            (local.set $dim
              (if (result i32) (i32.eq (local.get $mo) (i32.const 2))
                (then
                  (i32.add (i32.const 28)
                    (i32.and
                      (i32.eqz (i32.and (local.get $y) (i32.const 3)))
                      (i32.or (i32.ne (i32.rem_u (local.get $y) (i32.const 100)) (i32.const 0))
                              (i32.eqz (i32.rem_u (local.get $y) (i32.const 400)))))))
                ;; 31 days when (month xor (month > 7)) is odd (1, 3, 5, 7, 8, 10, 12), else 30.
                (else
                  (i32.add (i32.const 30)
                    (i32.and (i32.xor (local.get $mo) (i32.gt_u (local.get $mo) (i32.const 7))) (i32.const 1))))))
            (br_if $stop (i32.gt_u (local.get $d) (local.get $dim)))
            ;; Day number from the civil date (days from civil, H. Hinnant), the year moved up one 400-year
            ;; era so that the arithmetic stays unsigned for years 0000–9999.
            (if (i32.le_u (local.get $mo) (i32.const 2)) (then (local.set $y (i32.sub (local.get $y) (i32.const 1)))))
            (local.set $y (i32.add (local.get $y) (i32.const 400)))
            (local.set $j (i32.div_u (local.get $y) (i32.const 400)))
            (local.set $y (i32.sub (local.get $y) (i32.mul (local.get $j) (i32.const 400))))
            (local.set $days
              (i32.sub
                (i32.add
                  (i32.mul (i32.sub (local.get $j) (i32.const 1)) (i32.const 146097))
                  (i32.add
                    (i32.sub
                      (i32.add (i32.mul (local.get $y) (i32.const 365)) (i32.shr_u (local.get $y) (i32.const 2)))
                      (i32.div_u (local.get $y) (i32.const 100)))
                    (i32.add
                      (i32.div_u
                        (i32.add (i32.mul (i32.const 153) (i32.rem_u (i32.add (local.get $mo) (i32.const 9)) (i32.const 12))) (i32.const 2))
                        (i32.const 5))
                      (i32.sub (local.get $d) (i32.const 1)))))
                (i32.const 719468)))
            (local.set $ma (local.get $a))
            (local.set $mb (local.get $b))
            (local.set $mw (local.get $w))
            (local.set $mdays (local.get $days))))
        ;; The clock: [T t space]HH:MM:SS, hours 00–23, minutes and seconds 00–59 (leap seconds are not read
        ;; here). Its eight bytes after the separator are read as one little-endian word x: the colons are
        ;; bytes 2 and 5; each of the six digit bytes b is an ASCII digit when neither b + 0x46 nor b - 0x30
        ;; has bit 7 set (the lowest byte that is not one sets it in its own byte, whatever carries it sends
        ;; higher); then 10 × v + (v >> 8), v the digits' values, holds HH in byte 0, MM in 3 and SS in 6.
        (local.set $c (i32.load8_u offset=10 (local.get $s)))
        (br_if $stop (i32.eqz (i32.or (i32.or (i32.eq (local.get $c) (i32.const 84)) (i32.eq (local.get $c) (i32.const 116)))
                                      (i32.eq (local.get $c) (i32.const 32)))))
        (local.set $x (i64.load offset=11 align=1 (local.get $s)))
        (br_if $stop (i64.ne (i64.and (local.get $x) (i64.const 0x0000ff0000ff0000)) (i64.const 0x00003a00003a0000)))
        (local.set $x (i64.and (local.get $x) (i64.const 0xffff00ffff00ffff)))
        (br_if $stop (i64.ne (i64.and
                               (i64.or (i64.add (local.get $x) (i64.const 0x4646004646004646))
                                       (i64.sub (local.get $x) (i64.const 0x3030003030003030)))
                               (i64.const 0x8080008080008080))
                             (i64.const 0)))
        (local.set $x (i64.sub (local.get $x) (i64.const 0x3030003030003030)))
        (local.set $x (i64.add (i64.mul (local.get $x) (i64.const 10)) (i64.shr_u (local.get $x) (i64.const 8))))
        (local.set $h (i32.and (i32.wrap_i64 (local.get $x)) (i32.const 255)))
        (local.set $mi (i32.and (i32.wrap_i64 (i64.shr_u (local.get $x) (i64.const 24))) (i32.const 255)))
        (local.set $se (i32.and (i32.wrap_i64 (i64.shr_u (local.get $x) (i64.const 48))) (i32.const 255)))
        (br_if $stop (i32.or (i32.gt_u (local.get $h) (i32.const 23))
                             (i32.or (i32.gt_u (local.get $mi) (i32.const 59)) (i32.gt_u (local.get $se) (i32.const 59)))))
        (local.set $clock
          (i32.add (i32.add (i32.mul (local.get $h) (i32.const 3600000)) (i32.mul (local.get $mi) (i32.const 60000)))
                   (i32.mul (local.get $se) (i32.const 1000))))
        ;; A fraction (. or , then digits): its first three digits are milliseconds, the rest dropped.
        (local.set $p (i32.add (local.get $s) (i32.const 19)))
        (local.set $c (i32.load8_u (local.get $p)))
        (if (i32.or (i32.eq (local.get $c) (i32.const 46)) (i32.eq (local.get $c) (i32.const 44)))
          (then
            (local.set $j (i32.add (local.get $p) (i32.const 1)))
            (block $digits
              (loop $digit
                (br_if $digits (i32.ge_u (local.get $j) (local.get $e)))
                (br_if $digits (i32.gt_u (i32.sub (i32.load8_u (local.get $j)) (i32.const 48)) (i32.const 9)))
                (local.set $j (i32.add (local.get $j) (i32.const 1)))
                (br $digit)))
            (local.set $k (i32.sub (i32.sub (local.get $j) (local.get $p)) (i32.const 1)))
            (br_if $stop (i32.eqz (local.get $k)))
            (local.set $clock (i32.add (local.get $clock)
              (i32.mul (i32.sub (i32.load8_u offset=1 (local.get $p)) (i32.const 48)) (i32.const 100))))
            (if (i32.gt_u (local.get $k) (i32.const 1))
              (then (local.set $clock (i32.add (local.get $clock)
                (i32.mul (i32.sub (i32.load8_u offset=2 (local.get $p)) (i32.const 48)) (i32.const 10))))))
            (if (i32.gt_u (local.get $k) (i32.const 2))
              (then (local.set $clock (i32.add (local.get $clock)
                (i32.sub (i32.load8_u offset=3 (local.get $p)) (i32.const 48))))))
            (local.set $p (local.get $j))))
        ;; The designator: Z (or z) last, or ±HH:MM last; nothing (a wall-clock time) is not an instant.
        (br_if $stop (i32.ge_u (local.get $p) (local.get $e)))
        (local.set $c (i32.load8_u (local.get $p)))
        (local.set $off (i32.const 0))
        (if (i32.or (i32.eq (local.get $c) (i32.const 90)) (i32.eq (local.get $c) (i32.const 122)))
          (then (br_if $stop (i32.ne (i32.add (local.get $p) (i32.const 1)) (local.get $e))))
          (else
            (br_if $stop (i32.eqz (i32.or (i32.eq (local.get $c) (i32.const 43)) (i32.eq (local.get $c) (i32.const 45)))))
            (br_if $stop (i32.ne (i32.add (local.get $p) (i32.const 6)) (local.get $e)))
            (br_if $stop (i32.ne (i32.load8_u offset=3 (local.get $p)) (i32.const 58)))
            (local.set $h (i32.sub (i32.load8_u offset=1 (local.get $p)) (i32.const 48)))
            (local.set $j (i32.sub (i32.load8_u offset=2 (local.get $p)) (i32.const 48)))
            (local.set $mi (i32.sub (i32.load8_u offset=4 (local.get $p)) (i32.const 48)))
            (local.set $se (i32.sub (i32.load8_u offset=5 (local.get $p)) (i32.const 48)))
            (br_if $stop (i32.or (i32.or (i32.gt_u (local.get $h) (i32.const 2)) (i32.gt_u (local.get $j) (i32.const 9)))
                                 (i32.or (i32.gt_u (local.get $mi) (i32.const 5)) (i32.gt_u (local.get $se) (i32.const 9)))))
            (local.set $h (i32.add (i32.mul (local.get $h) (i32.const 10)) (local.get $j)))
            (br_if $stop (i32.gt_u (local.get $h) (i32.const 23)))
            (local.set $off (i32.add (i32.mul (local.get $h) (i32.const 60)) (i32.add (i32.mul (local.get $mi) (i32.const 10)) (local.get $se))))
            (if (i32.eq (local.get $c) (i32.const 45)) (then (local.set $off (i32.sub (i32.const 0) (local.get $off)))))
            ;; An offset other than zero is taken once the caller has noted it (or notes no more offsets).
            (if (i32.and (i32.ne (local.get $off) (i32.const 0)) (i32.lt_u (local.get $nk) (i32.const 5)))
              (then
                (local.set $why (i32.const 3))
                (local.set $k (i32.const 0))
                (block $known
                  (loop $look
                    (br_if $stop (i32.ge_u (local.get $k) (local.get $nk)))
                    (br_if $known (i32.eq (i32.load offset=5242928 (i32.shl (local.get $k) (i32.const 2))) (local.get $off)))
                    (local.set $k (i32.add (local.get $k) (i32.const 1)))
                    (br $look)))
                (local.set $why (i32.const 1))))))
        (local.set $ms
          (f64.sub
            (f64.add (f64.mul (f64.convert_i32_s (local.get $days)) (f64.const 86400000)) (f64.convert_i32_s (local.get $clock)))
            (f64.convert_i32_s (i32.mul (local.get $off) (i32.const 60000)))))
        ;; The period: the last one's while the instant stays in it, else found by bisection of STARTS.
        (if (i32.eqz (i32.and (f64.ge (local.get $ms) (local.get $lo)) (f64.lt (local.get $ms) (local.get $hi))))
          (then
            (local.set $why (i32.const 2))
            (f64.store (i32.const 5242944) (local.get $ms))
            (br_if $stop (i32.eqz (local.get $np)))
            (br_if $stop (f64.lt (local.get $ms) (f64.load (i32.const 5243008))))
            (br_if $stop (f64.ge (local.get $ms) (f64.load offset=5243008 (i32.shl (local.get $np) (i32.const 3)))))
            (local.set $l (i32.const 0))
            (local.set $r (local.get $np))
            (block $found
              (loop $halve
                (br_if $found (i32.le_u (i32.sub (local.get $r) (local.get $l)) (i32.const 1)))
                (local.set $mid (i32.shr_u (i32.add (local.get $l) (local.get $r)) (i32.const 1)))
                (if (f64.le (f64.load offset=5243008 (i32.shl (local.get $mid) (i32.const 3))) (local.get $ms))
                  (then (local.set $l (local.get $mid)))
                  (else (local.set $r (local.get $mid))))
                (br $halve)))
            ;; The rows counted in the last period go into its count (kept in a local while they run on:
            ;; a count in memory, raised row after row, would chain each row to the last store).
            (local.set $k (i32.add (i32.const 5505152) (i32.shl (local.get $idx) (i32.const 3))))
            (f64.store (local.get $k) (f64.add (f64.load (local.get $k)) (local.get $run)))
            (local.set $run (f64.const 0))
            (local.set $idx (local.get $l))
            (local.set $lo (f64.load offset=5243008 (i32.shl (local.get $idx) (i32.const 3))))
            (local.set $hi (f64.load offset=5243016 (i32.shl (local.get $idx) (i32.const 3))))))
        (local.set $run (f64.add (local.get $run) (f64.const 1)))
        (if (i32.lt_s (local.get $idx) (local.get $minIdx))
          (then (local.set $minIdx (local.get $idx)) (local.set $minRec (local.get $from))))
        (if (i32.gt_s (local.get $idx) (local.get $maxIdx))
          (then (local.set $maxIdx (local.get $idx)) (local.set $maxRec (local.get $from))))
        (local.set $from (i32.add (local.get $from) (i32.const 1)))
        (local.set $o (i32.add (local.get $o) (local.get $step)))
        (br $next))
      (local.set $why (i32.const 0)))
    (if (f64.gt (local.get $run) (f64.const 0))
      (then
        (local.set $k (i32.add (i32.const 5505152) (i32.shl (local.get $idx) (i32.const 3))))
        (f64.store (local.get $k) (f64.add (f64.load (local.get $k)) (local.get $run)))))
    (i32.store (i32.const 5242952) (local.get $ma))
    (i32.store (i32.const 5242956) (local.get $mb))
    (i32.store (i32.const 5242960) (local.get $mw))
    (i32.store (i32.const 5242964) (local.get $mdays))
    (f64.store (i32.const 5242880) (local.get $lo))
    (f64.store (i32.const 5242888) (local.get $hi))
    (i32.store (i32.const 5242896) (local.get $idx))
    (i32.store (i32.const 5242904) (local.get $minIdx))
    (i32.store (i32.const 5242908) (local.get $minRec))
    (i32.store (i32.const 5242912) (local.get $maxIdx))
    (i32.store (i32.const 5242916) (local.get $maxRec))
    (i32.store (i32.const 5242920) (local.get $why))
    (local.get $from))
)
