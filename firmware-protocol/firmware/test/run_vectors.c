/*
 * run_vectors.c - host test for lsw_proto.c.
 *
 * Usage: run_vectors VECTORS_DIR
 *
 * 1. Unit checks: CRC-16/CCITT-FALSE check value, COBS examples and round
 *    trips, the command parser, decoder robustness on pseudo-random bytes.
 * 2. Every *.vec file in VECTORS_DIR (format: vectors/README.md) is fed to the
 *    C decoder in its `mode` and `chunks`; records and counters must match
 *    exactly. Each `out` record is re-encoded with the C encoders and its text
 *    line (upper- or lower-case CRC) or binary frame must occur in the input.
 *
 * Prints one line per failure and "N passed, N failed"; exit 0 only if all pass.
 */
#define _POSIX_C_SOURCE 200809L

#include "lsw_proto.h"

#include <dirent.h>
#include <inttypes.h>
#include <stdio.h>
#include <stdlib.h>
#include <string.h>

#define MAX_INPUT 65536
#define MAX_OUTS 256
#define MAX_OUT_LEN 256
#define MAX_CHUNKS 64
#define MAX_FILES 512

static int passed, failed;

static void check(int ok, const char *what)
{
    if (ok) {
        passed++;
    } else {
        failed++;
        printf("FAIL %s\n", what);
    }
}

/* ---- unit checks ------------------------------------------------------- */

static void unit_crc(void)
{
    /* CRC-16/CCITT-FALSE check value 0x29B1 for "123456789": PROTOCOL.md and
     * the Williams/Cook CRC catalogue ("CRC-16/IBM-3740", alias CCITT-FALSE). */
    const uint8_t check_str[] = "123456789";
    check(lsw_crc16(check_str, 9) == 0x29B1, "crc: \"123456789\" gives 0x29B1");
    /* No data: the CRC is the initial value 0xFFFF (no final XOR). */
    check(lsw_crc16(check_str, 0) == 0xFFFF, "crc: empty input gives 0xFFFF");
    /* Incremental update equals one-shot. */
    check(lsw_crc16_update(lsw_crc16(check_str, 4), check_str + 4, 5) == 0x29B1,
          "crc: split update equals one-shot");
}

static int cobs_case(const uint8_t *in, size_t n, const uint8_t *want, size_t want_n)
{
    uint8_t enc[300], dec[300];
    size_t len = lsw_cobs_encode(in, n, enc, sizeof enc), dlen = 0;
    if (len != want_n || memcmp(enc, want, want_n) != 0) return 0;
    if (!lsw_cobs_decode(enc, len, dec, sizeof dec, &dlen)) return 0;
    return dlen == n && memcmp(dec, in, n) == 0;
}

static void unit_cobs(void)
{
    /* Examples from Cheshire & Baker's COBS scheme as tabulated in the
     * Wikipedia "Consistent Overhead Byte Stuffing" article (from memory). */
    static const uint8_t a[] = {0x00}, a_e[] = {0x01, 0x01};
    static const uint8_t b[] = {0x00, 0x00}, b_e[] = {0x01, 0x01, 0x01};
    static const uint8_t c[] = {0x00, 0x11, 0x00}, c_e[] = {0x01, 0x02, 0x11, 0x01};
    static const uint8_t d[] = {0x11, 0x22, 0x00, 0x33}, d_e[] = {0x03, 0x11, 0x22, 0x02, 0x33};
    static const uint8_t e[] = {0x11, 0x22, 0x33, 0x44}, e_e[] = {0x05, 0x11, 0x22, 0x33, 0x44};
    static const uint8_t f[] = {0x11, 0x00, 0x00, 0x00}, f_e[] = {0x02, 0x11, 0x01, 0x01, 0x01};
    uint8_t g[254], g_e[255], h[254], h_e[256], enc[300], dec[300];
    size_t i, dlen;
    uint32_t rng = 20260601u; /* fixed seed */
    int all_ok = 1;

    check(cobs_case(a, sizeof a, a_e, sizeof a_e), "cobs: 00");
    check(cobs_case(b, sizeof b, b_e, sizeof b_e), "cobs: 00 00");
    check(cobs_case(c, sizeof c, c_e, sizeof c_e), "cobs: 00 11 00");
    check(cobs_case(d, sizeof d, d_e, sizeof d_e), "cobs: 11 22 00 33");
    check(cobs_case(e, sizeof e, e_e, sizeof e_e), "cobs: 11 22 33 44");
    check(cobs_case(f, sizeof f, f_e, sizeof f_e), "cobs: 11 00 00 00");
    /* 01..FE (254 non-zero bytes): one full block, code FF, no trailing code. */
    g_e[0] = 0xFF;
    for (i = 0; i < 254; i++) {
        g[i] = (uint8_t)(i + 1);
        g_e[i + 1] = (uint8_t)(i + 1);
    }
    check(cobs_case(g, sizeof g, g_e, sizeof g_e), "cobs: 01..FE");
    /* 00 01..FD (254 bytes): code 01 for the zero, then 253 non-zero bytes under code FE. */
    h[0] = 0x00;
    h_e[0] = 0x01;
    h_e[1] = 0xFE;
    for (i = 1; i < 254; i++) {
        h[i] = (uint8_t)i;
        h_e[i + 1] = (uint8_t)i;
    }
    check(cobs_case(h, sizeof h, h_e, 255), "cobs: 00 01..FD");
    check(lsw_cobs_encode(g, 0, enc, sizeof enc) == 0, "cobs: empty input refused");
    check(!lsw_cobs_decode((const uint8_t *)"\x05\x11\x22", 3, dec, sizeof dec, &dlen),
          "cobs: overrunning code byte rejected");
    check(!lsw_cobs_decode((const uint8_t *)"\x03\x11\x00", 3, dec, sizeof dec, &dlen),
          "cobs: embedded zero rejected");

    /* Round trips of pseudo-random payloads, zero-heavy, lengths 1..254. */
    for (i = 0; i < 5000; i++) {
        uint8_t in[254];
        size_t n, k, len;
        rng = rng * 1664525u + 1013904223u;
        n = 1 + (rng >> 8) % 254;
        for (k = 0; k < n; k++) {
            rng = rng * 1664525u + 1013904223u;
            in[k] = (rng >> 24) < 64 ? 0 : (uint8_t)(rng >> 16);
        }
        len = lsw_cobs_encode(in, n, enc, sizeof enc);
        if (len == 0 || len > n + 1 + n / 254 || memchr(enc, 0, len) != NULL ||
            !lsw_cobs_decode(enc, len, dec, sizeof dec, &dlen) || dlen != n || memcmp(dec, in, n) != 0) {
            all_ok = 0;
            break;
        }
    }
    check(all_ok, "cobs: 5000 seeded random round trips (seed 20260601)");
}

static void expect_cmd(const char *line, lsw_parse_status want, lsw_cmd_kind kind, const char *word)
{
    lsw_command c;
    char what[160];
    lsw_parse_status st = lsw_parse_command(line, strlen(line), &c);
    int ok = st == want;
    if (ok && want == LSW_PARSE_OK) ok = c.kind == kind;
    if (ok && word != NULL) ok = strcmp(c.word, word) == 0;
    snprintf(what, sizeof what, "parser: \"%s\" -> %s (got %s)", line, lsw_parse_reason(want),
             lsw_parse_reason(st));
    check(ok, what);
}

static void with_crc(char *out, size_t cap, const char *body, int lower)
{
    uint16_t crc = lsw_crc16((const uint8_t *)body, strlen(body));
    snprintf(out, cap, lower ? "%s ~%04x" : "%s ~%04X", body, (unsigned)crc);
}

static void unit_parser(void)
{
    char line[128];
    lsw_command c;

    expect_cmd("WHO", LSW_PARSE_OK, LSW_CMD_WHO, "WHO");
    expect_cmd("who\r", LSW_PARSE_OK, LSW_CMD_WHO, "WHO");
    expect_cmd("START", LSW_PARSE_OK, LSW_CMD_START, "START");
    expect_cmd("STOP ", LSW_PARSE_OK, LSW_CMD_STOP, "STOP");
    expect_cmd("HALT", LSW_PARSE_OK, LSW_CMD_HALT, "HALT");
    with_crc(line, sizeof line, "START", 0);
    expect_cmd(line, LSW_PARSE_OK, LSW_CMD_START, "START");
    with_crc(line, sizeof line, "MODE binary", 1);
    expect_cmd(line, LSW_PARSE_OK, LSW_CMD_MODE, "MODE");

    check(lsw_parse_command("RATE 80", 7, &c) == LSW_PARSE_OK && c.kind == LSW_CMD_RATE && c.rate_hz == 80,
          "parser: RATE 80 gives 80 Hz");
    check(lsw_parse_command("RATE 10", 7, &c) == LSW_PARSE_OK && c.rate_hz == 10, "parser: RATE 10 gives 10 Hz");
    check(lsw_parse_command("PING ab-7", 9, &c) == LSW_PARSE_OK && c.kind == LSW_CMD_PING &&
              strcmp(c.token, "ab-7") == 0, "parser: PING token kept");
    check(lsw_parse_command("PING 12345678", 13, &c) == LSW_PARSE_OK && strcmp(c.token, "12345678") == 0,
          "parser: PING 8-char token");
    check(lsw_parse_command("MODE binary", 11, &c) == LSW_PARSE_OK && c.mode == LSW_BINARY,
          "parser: MODE binary");
    check(lsw_parse_command("MODE TEXT", 9, &c) == LSW_PARSE_OK && c.mode == LSW_TEXT, "parser: MODE TEXT");

    /* bad checksum: the CRC of "STOP" with one bit flipped */
    snprintf(line, sizeof line, "STOP ~%04X", (unsigned)(lsw_crc16((const uint8_t *)"STOP", 4) ^ 1u));
    expect_cmd(line, LSW_PARSE_CHECKSUM, LSW_CMD_STOP, "STOP");
    expect_cmd("RATE 80 ~0000", LSW_PARSE_CHECKSUM, LSW_CMD_RATE, "RATE");

    expect_cmd("RATE", LSW_PARSE_BAD_ARG, LSW_CMD_RATE, "RATE");
    expect_cmd("RATE 8x", LSW_PARSE_BAD_ARG, LSW_CMD_RATE, "RATE");
    expect_cmd("RATE 080", LSW_PARSE_BAD_ARG, LSW_CMD_RATE, "RATE");
    expect_cmd("RATE -10", LSW_PARSE_BAD_ARG, LSW_CMD_RATE, "RATE");
    expect_cmd("RATE 99999999999", LSW_PARSE_BAD_ARG, LSW_CMD_RATE, "RATE");
    expect_cmd("RATE 10 80", LSW_PARSE_BAD_ARG, LSW_CMD_RATE, "RATE");
    expect_cmd("PING", LSW_PARSE_BAD_ARG, LSW_CMD_PING, "PING");
    expect_cmd("PING 123456789", LSW_PARSE_BAD_ARG, LSW_CMD_PING, "PING");
    expect_cmd("MODE hex", LSW_PARSE_BAD_ARG, LSW_CMD_MODE, "MODE");
    expect_cmd("WHO now", LSW_PARSE_BAD_ARG, LSW_CMD_WHO, "WHO");

    check(lsw_parse_command("LIGHT on", 8, &c) == LSW_PARSE_OK && c.kind == LSW_CMD_LIGHT &&
              c.light_on == 1 && strcmp(c.word, "LIGHT") == 0, "parser: LIGHT on");
    check(lsw_parse_command("light OFF", 9, &c) == LSW_PARSE_OK && c.kind == LSW_CMD_LIGHT &&
              c.light_on == 0, "parser: light OFF, any letter case");
    with_crc(line, sizeof line, "LIGHT on", 0);
    expect_cmd(line, LSW_PARSE_OK, LSW_CMD_LIGHT, "LIGHT");
    expect_cmd("LIGHT", LSW_PARSE_BAD_ARG, LSW_CMD_LIGHT, "LIGHT");
    expect_cmd("LIGHT dim", LSW_PARSE_BAD_ARG, LSW_CMD_LIGHT, "LIGHT");
    expect_cmd("LIGHT on off", LSW_PARSE_BAD_ARG, LSW_CMD_LIGHT, "LIGHT");

    expect_cmd("FLY", LSW_PARSE_UNKNOWN, LSW_CMD_WHO, "FLY");
    expect_cmd("tare 5", LSW_PARSE_UNKNOWN, LSW_CMD_WHO, "TARE");
    expect_cmd("", LSW_PARSE_EMPTY, LSW_CMD_WHO, NULL);
    expect_cmd("\r", LSW_PARSE_EMPTY, LSW_CMD_WHO, NULL);
    expect_cmd("W#O", LSW_PARSE_MALFORMED, LSW_CMD_WHO, NULL);
    expect_cmd("RATE  80", LSW_PARSE_MALFORMED, LSW_CMD_WHO, NULL);
    expect_cmd("WHO ~ZZZZ", LSW_PARSE_MALFORMED, LSW_CMD_WHO, NULL);
    memset(line, 'A', sizeof line);
    check(lsw_parse_command(line, LSW_LINE_MAX + 1, &c) == LSW_PARSE_TOO_LONG, "parser: 201-byte line too long");
}

static void unit_encoders(void)
{
    uint8_t out[300];
    char body[LSW_BODY_MAX + 1];
    lsw_sample s = {41, 1234567ul, -8388607l - 1, 1500, 1};
    size_t n;
    /* Refusals of bodies that break the grammar. */
    check(lsw_put_status(out, sizeof out, LSW_TEXT, "two  spaces", NULL) == 0, "encoder: double space refused");
    check(lsw_put_ack(out, sizeof out, LSW_TEXT, "", NULL) == 0, "encoder: empty command refused");
    check(lsw_put_refusal(out, sizeof out, LSW_BINARY, "RATE", NULL, NULL) == 0, "encoder: refusal needs a reason");
    check(lsw_frame_message(out, sizeof out, "S 1 2 3") == 0, "encoder: sample body refused in a 0x10 frame");
    check(lsw_put_sample(out, 10, LSW_TEXT, &s) == 0, "encoder: short buffer refused");
    n = lsw_put_sample(out, sizeof out, LSW_TEXT, &s);
    check(n > 0 && memcmp(out, "S 41 1234567 -8388608 1500 ~", 28) == 0 && out[n - 1] == '\n',
          "encoder: PROTOCOL.md example sample line");
    check(lsw_body_refusal(body, sizeof body, "RATE", "unsupported", NULL) > 0 &&
              strcmp(body, "N RATE unsupported") == 0, "encoder: refusal body");
}

static void unit_converter(void)
{
    /* HX711 datasheet: output is 24-bit two's complement, 800000h at minimum
     * and 7FFFFFh at maximum input. */
    check(lsw_sign_extend24(0x800000ul) == -8388607l - 1, "sign-extend: 800000h -> -8388608");
    check(lsw_sign_extend24(0x7FFFFFul) == 8388607l, "sign-extend: 7FFFFFh -> 8388607");
    check(lsw_sign_extend24(0xFFFFFFul) == -1, "sign-extend: FFFFFFh -> -1");
    check(lsw_sign_extend24(0x000000ul) == 0, "sign-extend: 0 -> 0");
    check(lsw_sign_extend24(0x1000001ul) == 1, "sign-extend: bits above 23 ignored");
}

static void unit_quadrature(void)
{
    /* 4x decoding of a Gray-code quadrature signal (common practice): one full
     * forward cycle 00 01 11 10 00 is +4, the reverse -4; a skipped state
     * (both channels changed) and no change count 0. */
    static const uint8_t fwd[5] = {0, 1, 3, 2, 0};
    int i, sum_f = 0, sum_b = 0, skipped = 0, still = 0;
    for (i = 0; i < 4; i++) {
        sum_f += lsw_quad_step(fwd[i], fwd[i + 1]);
        sum_b += lsw_quad_step(fwd[i + 1], fwd[i]);
    }
    for (i = 0; i < 4; i++) {
        skipped += lsw_quad_step((uint8_t)i, (uint8_t)(i ^ 3)) != 0;
        still += lsw_quad_step((uint8_t)i, (uint8_t)i) != 0;
    }
    check(sum_f == 4, "quadrature: forward cycle counts +4");
    check(sum_b == -4, "quadrature: backward cycle counts -4");
    check(skipped == 0 && still == 0, "quadrature: skipped states and no change count 0");
}

/* Decoder robustness: seeded random bytes never break it, and a valid record
 * after the noise is still delivered. */
typedef struct {
    size_t count;
    lsw_record last;
} sink;

static void sink_fn(void *ctx, const lsw_record *r)
{
    sink *k = (sink *)ctx;
    k->count++;
    k->last = *r;
}

static void unit_robust(void)
{
    static lsw_decoder d;
    sink k;
    uint8_t buf[1024], line[64];
    uint32_t rng = 7u; /* fixed seed */
    int round, ok = 1;
    lsw_sample s = {123, 456, -789, 0, 0};
    size_t n;
    for (round = 0; round < 300 && ok; round++) {
        size_t i, len;
        memset(&k, 0, sizeof k);
        lsw_decoder_init(&d, (lsw_follow)(round % 3), sink_fn, &k);
        for (i = 0; i < sizeof buf; i++) {
            rng = rng * 1103515245u + 12345u;
            buf[i] = (uint8_t)(rng >> 16);
            if ((rng >> 28) == 0) buf[i] = (uint8_t)((rng & 0x100) ? '\n' : 0);
        }
        for (i = 0; i < sizeof buf; i += len) {
            rng = rng * 1103515245u + 12345u;
            len = 1 + (rng >> 20) % 97;
            if (i + len > sizeof buf) len = sizeof buf - i;
            lsw_decoder_feed(&d, buf + i, len);
        }
        n = lsw_put_sample(line, sizeof line, LSW_TEXT, &s);
        lsw_decoder_feed(&d, (const uint8_t *)"\n", 1);
        k.count = 0;
        lsw_decoder_feed(&d, line, n);
        ok = k.count == 1 && k.last.kind == LSW_REC_SAMPLE && k.last.sample.seq == 123 &&
             k.last.sample.load == -789 && !k.last.sample.has_pos;
    }
    check(ok, "decoder: 300 rounds of seeded random bytes, then a valid line still decodes");
}

/* ---- vectors ------------------------------------------------------------ */

typedef struct {
    char name[256];
    lsw_follow mode;
    size_t chunks[MAX_CHUNKS], nchunks;
    uint8_t input[MAX_INPUT];
    size_t input_len;
    char want[MAX_OUTS][MAX_OUT_LEN];
    size_t nwant;
    long counters[6];
    int have_counters;
    char got[MAX_OUTS][MAX_OUT_LEN];
    size_t ngot;
    int overflow;
} vec;

static const char *COUNTER_NAMES[6] = {"samples", "messages", "checksum_errors", "resyncs", "dropped", "unknown"};

static void format_record(const lsw_record *r, char *out, size_t cap)
{
    if (r->kind == LSW_REC_SAMPLE) {
        char pos[16];
        if (r->sample.has_pos) {
            snprintf(pos, sizeof pos, "%" PRId32, r->sample.pos);
        } else {
            strcpy(pos, "-");
        }
        snprintf(out, cap, "sample %u %" PRIu32 " %" PRId32 " %s", (unsigned)r->sample.seq, r->sample.time_us,
                 r->sample.load, pos);
    } else {
        snprintf(out, cap, "message %s", r->body);
    }
}

static void vec_sink(void *ctx, const lsw_record *r)
{
    vec *v = (vec *)ctx;
    if (v->ngot >= MAX_OUTS) {
        v->overflow = 1;
        return;
    }
    format_record(r, v->got[v->ngot++], MAX_OUT_LEN);
}

static int hexdig(int c)
{
    if (c >= '0' && c <= '9') return c - '0';
    if (c >= 'A' && c <= 'F') return c - 'A' + 10;
    if (c >= 'a' && c <= 'f') return c - 'a' + 10;
    return -1;
}

static int add_byte(vec *v, int b)
{
    if (v->input_len >= MAX_INPUT) return 0;
    v->input[v->input_len++] = (uint8_t)b;
    return 1;
}

/* Parses one directive line; returns NULL or an error text. */
static const char *parse_directive(vec *v, char *line)
{
    size_t n = strlen(line);
    while (n > 0 && (line[n - 1] == '\n' || line[n - 1] == '\r')) line[--n] = '\0';
    if (n == 0 || line[0] == '#') return NULL;
    if (strncmp(line, "mode ", 5) == 0) {
        const char *m = line + 5;
        if (strcmp(m, "auto") == 0) v->mode = LSW_FOLLOW_NONE;
        else if (strcmp(m, "text") == 0) v->mode = LSW_FOLLOW_TEXT;
        else if (strcmp(m, "binary") == 0) v->mode = LSW_FOLLOW_BINARY;
        else return "bad mode";
        return NULL;
    }
    if (strncmp(line, "chunks ", 7) == 0) {
        char *p = line + 7, *end;
        v->nchunks = 0;
        while (*p) {
            long c = strtol(p, &end, 10);
            if (end == p || c <= 0 || v->nchunks >= MAX_CHUNKS) return "bad chunks";
            v->chunks[v->nchunks++] = (size_t)c;
            p = end;
            while (*p == ' ') p++;
        }
        return v->nchunks ? NULL : "empty chunks";
    }
    if (strncmp(line, "in hex ", 7) == 0) {
        const char *p = line + 7;
        while (*p) {
            int hi, lo;
            if (*p == ' ') { p++; continue; }
            hi = hexdig(p[0]);
            lo = p[1] ? hexdig(p[1]) : -1;
            if (hi < 0 || lo < 0 || (p[2] != ' ' && p[2] != '\0')) return "bad hex";
            if (!add_byte(v, hi * 16 + lo)) return "input too long";
            p += 2;
        }
        return NULL;
    }
    if (strncmp(line, "in text ", 8) == 0) {
        const char *p = line + 8;
        while (*p) {
            int b = (unsigned char)*p++;
            if (b == '\\') {
                int e = (unsigned char)*p++;
                if (e == 'n') b = '\n';
                else if (e == 'r') b = '\r';
                else if (e == '\\') b = '\\';
                else if (e == 'x' && hexdig(p[0]) >= 0 && p[1] && hexdig(p[1]) >= 0) {
                    b = hexdig(p[0]) * 16 + hexdig(p[1]);
                    p += 2;
                } else return "bad escape";
            }
            if (!add_byte(v, b)) return "input too long";
        }
        return NULL;
    }
    if (strncmp(line, "out ", 4) == 0) {
        if (v->nwant >= MAX_OUTS || n - 4 >= MAX_OUT_LEN) return "too many outs";
        strcpy(v->want[v->nwant++], line + 4);
        return NULL;
    }
    if (strncmp(line, "counters ", 9) == 0) {
        char *tok = strtok(line + 9, " ");
        int i;
        for (i = 0; i < 6; i++) v->counters[i] = 0;
        for (; tok != NULL; tok = strtok(NULL, " ")) {
            char *eq = strchr(tok, '=');
            int found = 0;
            if (eq == NULL) return "bad counter";
            *eq = '\0';
            for (i = 0; i < 6; i++) {
                if (strcmp(tok, COUNTER_NAMES[i]) == 0) {
                    v->counters[i] = strtol(eq + 1, NULL, 10);
                    found = 1;
                }
            }
            if (!found) return "unknown counter";
        }
        v->have_counters = 1;
        return NULL;
    }
    return "unknown directive";
}

static int contains(const uint8_t *hay, size_t hn, const uint8_t *needle, size_t nn)
{
    size_t i;
    if (nn == 0 || nn > hn) return 0;
    for (i = 0; i + nn <= hn; i++) {
        if (memcmp(hay + i, needle, nn) == 0) return 1;
    }
    return 0;
}

/* Re-encodes one expected `out` record; 1 if its text line (either CRC case,
 * without line end) or its binary frame occurs in the input. */
static int reencoded_in_input(const vec *v, const char *want)
{
    uint8_t text[300], bin[300];
    size_t tn = 0, bn = 0, i;
    if (strncmp(want, "sample ", 7) == 0) {
        lsw_sample s;
        unsigned long seq, t;
        long load, pos = 0;
        char pos_s[32];
        if (sscanf(want + 7, "%lu %lu %ld %31s", &seq, &t, &load, pos_s) != 4) return 0;
        s.seq = (uint16_t)seq;
        s.time_us = (uint32_t)t;
        s.load = (int32_t)load;
        s.has_pos = strcmp(pos_s, "-") != 0;
        if (s.has_pos) pos = strtol(pos_s, NULL, 10);
        s.pos = (int32_t)pos;
        tn = lsw_put_sample(text, sizeof text, LSW_TEXT, &s);
        bn = lsw_put_sample(bin, sizeof bin, LSW_BINARY, &s);
    } else if (strncmp(want, "message ", 8) == 0) {
        tn = lsw_put_message(text, sizeof text, LSW_TEXT, want + 8);
        bn = lsw_put_message(bin, sizeof bin, LSW_BINARY, want + 8);
    }
    if (tn < 2 || bn == 0) return 0;
    tn--; /* drop LF: CR LF inputs are legal */
    if (contains(v->input, v->input_len, bin, bn) || contains(v->input, v->input_len, text, tn)) return 1;
    for (i = tn - 4; i < tn; i++) {
        if (text[i] >= 'A' && text[i] <= 'F') text[i] = (uint8_t)(text[i] - 'A' + 'a');
    }
    return contains(v->input, v->input_len, text, tn);
}

/* Runs the vector's input through a fresh decoder in the given chunking and
 * compares records and counters; prints each difference. 1 if all match. */
static int decode_and_compare(vec *v, const size_t *chunks, size_t nchunks, const char *file, const char *how)
{
    static lsw_decoder d;
    size_t i, at, ci = 0;
    long got_counters[6];
    int ok = 1;

    v->ngot = 0;
    v->overflow = 0;
    lsw_decoder_init(&d, v->mode, vec_sink, v);
    for (at = 0; at < v->input_len;) {
        size_t len = nchunks ? chunks[ci++ % nchunks] : v->input_len;
        if (at + len > v->input_len) len = v->input_len - at;
        lsw_decoder_feed(&d, v->input + at, len);
        at += len;
    }
    if (v->overflow || v->ngot != v->nwant) {
        printf("  %s%s: %lu records decoded, %lu expected\n", file, how, (unsigned long)v->ngot,
               (unsigned long)v->nwant);
        ok = 0;
    }
    for (i = 0; i < v->ngot && i < v->nwant; i++) {
        if (strcmp(v->got[i], v->want[i]) != 0) {
            printf("  %s%s: record %lu is \"%s\", expected \"%s\"\n", file, how, (unsigned long)i + 1,
                   v->got[i], v->want[i]);
            ok = 0;
        }
    }
    got_counters[0] = (long)d.counters.samples;
    got_counters[1] = (long)d.counters.messages;
    got_counters[2] = (long)d.counters.checksum_errors;
    got_counters[3] = (long)d.counters.resyncs;
    got_counters[4] = (long)d.counters.dropped;
    got_counters[5] = (long)d.counters.unknown;
    for (i = 0; i < 6; i++) {
        if (got_counters[i] != v->counters[i]) {
            printf("  %s%s: %s=%ld, expected %ld\n", file, how, COUNTER_NAMES[i], got_counters[i], v->counters[i]);
            ok = 0;
        }
    }
    return ok;
}

static void run_vector(const char *dir, const char *file)
{
    static vec v;
    char path[1024], buf[4096], what[600];
    const char *err = NULL;
    FILE *fp;
    size_t i;
    int ok;

    memset(&v, 0, sizeof v);
    snprintf(v.name, sizeof v.name, "%s", file);
    snprintf(path, sizeof path, "%s/%s", dir, file);
    fp = fopen(path, "r");
    if (fp == NULL) {
        snprintf(what, sizeof what, "%s: cannot open", file);
        check(0, what);
        return;
    }
    if (fgets(buf, sizeof buf, fp) == NULL || buf[0] != '#') err = "does not start with a # comment";
    while (err == NULL) {
        size_t bl = strlen(buf);
        if (bl == sizeof buf - 1 && buf[bl - 1] != '\n') {
            err = "line longer than 4094 characters";
            break;
        }
        err = parse_directive(&v, buf);
        if (err == NULL && fgets(buf, sizeof buf, fp) == NULL) break;
    }
    fclose(fp);
    if (err == NULL && !v.have_counters) err = "no counters line";
    if (err != NULL) {
        snprintf(what, sizeof what, "%s: %s", file, err);
        check(0, what);
        return;
    }

    ok = decode_and_compare(&v, v.chunks, v.nchunks, file, "");
    snprintf(what, sizeof what, "%s: decode", file);
    check(ok, what);

    /* The result must not depend on how the bytes are split (STYLE.md: feed
     * decoders one byte at a time and in odd chunks, as a serial port does). */
    {
        static const size_t one[1] = {1}, odd[4] = {2, 3, 5, 13};
        ok = decode_and_compare(&v, one, 1, file, " (1-byte chunks)") &&
             decode_and_compare(&v, odd, 4, file, " (chunks 2 3 5 13)");
        snprintf(what, sizeof what, "%s: chunking does not change the result", file);
        check(ok, what);
    }

    ok = 1;
    for (i = 0; i < v.nwant; i++) {
        if (!reencoded_in_input(&v, v.want[i])) {
            printf("  %s: re-encoded \"%s\" not found in the input\n", file, v.want[i]);
            ok = 0;
        }
    }
    snprintf(what, sizeof what, "%s: re-encode", file);
    check(ok, what);
}

static int cmp_names(const void *a, const void *b)
{
    return strcmp(*(const char *const *)a, *(const char *const *)b);
}

int main(int argc, char **argv)
{
    DIR *dir;
    struct dirent *e;
    static char names[MAX_FILES][256];
    char *sorted[MAX_FILES];
    size_t n = 0, i;

    if (argc != 2) {
        fprintf(stderr, "usage: %s VECTORS_DIR\n", argv[0]);
        return 2;
    }
    unit_crc();
    unit_cobs();
    unit_parser();
    unit_encoders();
    unit_converter();
    unit_quadrature();
    unit_robust();

    dir = opendir(argv[1]);
    if (dir == NULL) {
        printf("FAIL cannot open vectors folder %s\n", argv[1]);
        failed++;
    } else {
        while ((e = readdir(dir)) != NULL && n < MAX_FILES) {
            size_t len = strlen(e->d_name);
            if (len > 4 && len < sizeof names[0] && strcmp(e->d_name + len - 4, ".vec") == 0) {
                strcpy(names[n], e->d_name);
                sorted[n] = names[n];
                n++;
            }
        }
        closedir(dir);
        qsort(sorted, n, sizeof sorted[0], cmp_names);
        if (n == 0) {
            printf("FAIL no .vec files in %s\n", argv[1]);
            failed++;
        }
        for (i = 0; i < n; i++) run_vector(argv[1], sorted[i]);
        printf("%lu vector files\n", (unsigned long)n);
    }
    printf("%d passed, %d failed\n", passed, failed);
    return failed == 0 ? 0 : 1;
}
