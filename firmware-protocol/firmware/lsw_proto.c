/*
 * lsw_proto.c - Loadstone wire protocol v1: checksum, COBS, encoders,
 * command parser and the host-side streaming decoder. See lsw_proto.h and
 * ../PROTOCOL.md. Plain C99, no heap, no stdio (numbers are formatted here so
 * that 8-bit targets with 16-bit int behave the same as the host).
 */
#include "lsw_proto.h"

#include <string.h>

/* ---- checksum --------------------------------------------------------- */

uint16_t lsw_crc16_update(uint16_t crc, const uint8_t *data, size_t n)
{
    size_t i;
    int bit;
    for (i = 0; i < n; i++) {
        crc = (uint16_t)(crc ^ ((uint16_t)data[i] << 8));
        for (bit = 0; bit < 8; bit++) {
            if (crc & 0x8000u) {
                crc = (uint16_t)((crc << 1) ^ 0x1021u);
            } else {
                crc = (uint16_t)(crc << 1);
            }
        }
    }
    return crc;
}

uint16_t lsw_crc16(const uint8_t *data, size_t n)
{
    return lsw_crc16_update(0xFFFFu, data, n);
}

/* ---- COBS ------------------------------------------------------------- */

size_t lsw_cobs_encode(const uint8_t *in, size_t n, uint8_t *out, size_t cap)
{
    size_t o = 1, code_at = 0, i;
    uint8_t code = 1;
    if (n == 0 || n > LSW_PAYLOAD_MAX || cap < n + 1) {
        return 0;
    }
    for (i = 0; i < n; i++) {
        if (in[i] != 0) {
            out[o++] = in[i];
            code++;
        }
        if (in[i] == 0 || code == 0xFF) {
            out[code_at] = code;
            code = 1;
            code_at = o;
            if (in[i] == 0 || i + 1 < n) {
                o++; /* room for the next code byte */
            }
        }
    }
    if (code_at < o) {
        out[code_at] = code;
    }
    return o;
}

int lsw_cobs_decode(const uint8_t *in, size_t n, uint8_t *out, size_t cap, size_t *out_len)
{
    size_t i = 0, o = 0, k;
    while (i < n) {
        uint8_t code = in[i++];
        if (code == 0 || i + (size_t)(code - 1) > n || o + (size_t)(code - 1) > cap) {
            return 0;
        }
        for (k = 1; k < code; k++) {
            if (in[i] == 0) {
                return 0;
            }
            out[o++] = in[i++];
        }
        if (code != 0xFF && i < n) {
            if (o >= cap) {
                return 0;
            }
            out[o++] = 0;
        }
    }
    *out_len = o;
    return 1;
}

/* ---- small text helpers ------------------------------------------------ */

typedef struct {
    char *p;
    size_t cap, len;
    int ok;
} sbuf;

static void sb_init(sbuf *b, char *p, size_t cap)
{
    b->p = p;
    b->cap = cap;
    b->len = 0;
    b->ok = cap > 0;
    if (b->ok) {
        p[0] = '\0';
    }
}

static void sb_char(sbuf *b, char c)
{
    if (!b->ok || b->len + 1 >= b->cap) {
        b->ok = 0;
        return;
    }
    b->p[b->len++] = c;
    b->p[b->len] = '\0';
}

static void sb_str(sbuf *b, const char *s)
{
    while (*s) {
        sb_char(b, *s++);
    }
}

static void sb_u32(sbuf *b, uint32_t v)
{
    char digits[10];
    int n = 0;
    do {
        digits[n++] = (char)('0' + (int)(v % 10u));
        v /= 10u;
    } while (v != 0);
    while (n > 0) {
        sb_char(b, digits[--n]);
    }
}

static void sb_i32(sbuf *b, int32_t v)
{
    if (v < 0) {
        sb_char(b, '-');
        sb_u32(b, (uint32_t)0 - (uint32_t)v);
    } else {
        sb_u32(b, (uint32_t)v);
    }
}

static size_t sb_done(sbuf *b)
{
    if (!b->ok || !lsw_body_valid(b->p, b->len)) {
        if (b->cap > 0) {
            b->p[0] = '\0';
        }
        return 0;
    }
    return b->len;
}

static int is_field_char(uint8_t c)
{
    return c >= 0x21 && c <= 0x7E;
}

static int is_upper(uint8_t c)
{
    return c >= 'A' && c <= 'Z';
}

static int hex_value(uint8_t c)
{
    if (c >= '0' && c <= '9') return c - '0';
    if (c >= 'A' && c <= 'F') return c - 'A' + 10;
    if (c >= 'a' && c <= 'f') return c - 'a' + 10;
    return -1;
}

static const char HEX_UPPER[] = "0123456789ABCDEF";

int lsw_body_valid(const char *body, size_t n)
{
    const uint8_t *s = (const uint8_t *)body;
    size_t i = 0, tag = 0;
    if (n == 0 || n > LSW_BODY_MAX) {
        return 0;
    }
    while (i < n && is_upper(s[i])) {
        i++;
        tag++;
    }
    if (tag == 0 || tag > 3) {
        return 0;
    }
    while (i < n) {
        size_t start;
        if (s[i] != ' ') {
            return 0;
        }
        i++;
        start = i;
        while (i < n && is_field_char(s[i])) {
            i++;
        }
        if (i == start) {
            return 0; /* empty field: double or trailing space */
        }
    }
    return 1;
}

/* Optional free text: single spaces between printable words. */
static void sb_opt(sbuf *b, const char *text)
{
    if (text != NULL && text[0] != '\0') {
        sb_char(b, ' ');
        sb_str(b, text);
    }
}

/* ---- body builders ------------------------------------------------------ */

size_t lsw_body_sample(char *out, size_t cap, const lsw_sample *s)
{
    sbuf b;
    sb_init(&b, out, cap);
    sb_str(&b, "S ");
    sb_u32(&b, s->seq);
    sb_char(&b, ' ');
    sb_u32(&b, s->time_us);
    sb_char(&b, ' ');
    sb_i32(&b, s->load);
    if (s->has_pos) {
        sb_char(&b, ' ');
        sb_i32(&b, s->pos);
    }
    return sb_done(&b);
}

size_t lsw_body_identity(char *out, size_t cap, const lsw_identity *id)
{
    sbuf b;
    sb_init(&b, out, cap);
    sb_str(&b, "I proto=");
    sb_u32(&b, id->proto);
    if (id->fw != NULL) {
        sb_str(&b, " fw=");
        sb_str(&b, id->fw);
    }
    if (id->adc != NULL) {
        sb_str(&b, " adc=");
        sb_str(&b, id->adc);
    }
    sb_str(&b, " rate=");
    sb_u32(&b, id->rate_hz);
    sb_str(&b, " ch=");
    sb_u32(&b, id->ch);
    if (id->cpm != 0) {
        sb_str(&b, " cpm=");
        sb_u32(&b, id->cpm);
    }
    sb_str(&b, " motor=");
    sb_u32(&b, id->motor);
    if (id->name != NULL) {
        sb_str(&b, " name=");
        sb_str(&b, id->name);
    }
    return sb_done(&b);
}

static size_t body_tag2(char *out, size_t cap, const char *tag, const char *first,
                        const char *second, const char *third)
{
    sbuf b;
    sb_init(&b, out, cap);
    if (first == NULL || first[0] == '\0') {
        return 0;
    }
    sb_str(&b, tag);
    sb_char(&b, ' ');
    sb_str(&b, first);
    sb_opt(&b, second);
    sb_opt(&b, third);
    return sb_done(&b);
}

size_t lsw_body_status(char *out, size_t cap, const char *code, const char *text)
{
    return body_tag2(out, cap, "T", code, text, NULL);
}

size_t lsw_body_error(char *out, size_t cap, const char *code, const char *text)
{
    return body_tag2(out, cap, "E", code, text, NULL);
}

size_t lsw_body_ack(char *out, size_t cap, const char *command, const char *detail)
{
    return body_tag2(out, cap, "A", command, detail, NULL);
}

size_t lsw_body_refusal(char *out, size_t cap, const char *command, const char *reason,
                        const char *text)
{
    if (reason == NULL || reason[0] == '\0') {
        return 0;
    }
    return body_tag2(out, cap, "N", command, reason, text);
}

/* ---- whole records ------------------------------------------------------ */

size_t lsw_text_line(uint8_t *out, size_t cap, const char *body)
{
    size_t n = strlen(body);
    uint16_t crc;
    if (!lsw_body_valid(body, n) || cap < n + 8) {
        return 0;
    }
    crc = lsw_crc16((const uint8_t *)body, n);
    memcpy(out, body, n);
    out[n++] = ' ';
    out[n++] = '~';
    out[n++] = (uint8_t)HEX_UPPER[(crc >> 12) & 0xF];
    out[n++] = (uint8_t)HEX_UPPER[(crc >> 8) & 0xF];
    out[n++] = (uint8_t)HEX_UPPER[(crc >> 4) & 0xF];
    out[n++] = (uint8_t)HEX_UPPER[crc & 0xF];
    out[n++] = '\n';
    if (n < cap) {
        out[n] = 0;
    }
    return n;
}

static void put_le16(uint8_t *p, uint16_t v)
{
    p[0] = (uint8_t)(v & 0xFF);
    p[1] = (uint8_t)(v >> 8);
}

static void put_le32(uint8_t *p, uint32_t v)
{
    p[0] = (uint8_t)(v & 0xFF);
    p[1] = (uint8_t)((v >> 8) & 0xFF);
    p[2] = (uint8_t)((v >> 16) & 0xFF);
    p[3] = (uint8_t)(v >> 24);
}

static uint16_t get_le16(const uint8_t *p)
{
    return (uint16_t)(p[0] | ((uint16_t)p[1] << 8));
}

static uint32_t get_le32(const uint8_t *p)
{
    return (uint32_t)p[0] | ((uint32_t)p[1] << 8) | ((uint32_t)p[2] << 16) | ((uint32_t)p[3] << 24);
}

static int32_t u32_to_i32(uint32_t u)
{
    /* two's complement without implementation-defined conversion */
    if (u <= 0x7FFFFFFFul) {
        return (int32_t)u;
    }
    return (int32_t)(u - 0x80000000ul) - (int32_t)0x7FFFFFFFl - 1;
}

static size_t frame_payload(uint8_t *out, size_t cap, uint8_t *payload, size_t n)
{
    uint16_t crc = lsw_crc16(payload, n);
    size_t len;
    payload[n++] = (uint8_t)(crc >> 8);
    payload[n++] = (uint8_t)(crc & 0xFF);
    if (cap < 1) {
        return 0;
    }
    len = lsw_cobs_encode(payload, n, out, cap - 1);
    if (len == 0) {
        return 0;
    }
    out[len++] = 0x00;
    return len;
}

size_t lsw_frame_sample(uint8_t *out, size_t cap, const lsw_sample *s)
{
    uint8_t p[1 + 14 + 2];
    size_t n = 0;
    p[n++] = s->has_pos ? LSW_TYPE_SAMPLE_POS : LSW_TYPE_SAMPLE;
    put_le16(p + n, s->seq);
    n += 2;
    put_le32(p + n, s->time_us);
    n += 4;
    put_le32(p + n, (uint32_t)s->load);
    n += 4;
    if (s->has_pos) {
        put_le32(p + n, (uint32_t)s->pos);
        n += 4;
    }
    return frame_payload(out, cap, p, n);
}

size_t lsw_frame_message(uint8_t *out, size_t cap, const char *body)
{
    uint8_t p[LSW_PAYLOAD_MAX];
    size_t n = strlen(body);
    if (!lsw_body_valid(body, n) || (body[0] == 'S' && (n == 1 || body[1] == ' '))) {
        return 0; /* 0x10 carries non-sample records only */
    }
    p[0] = LSW_TYPE_MESSAGE;
    memcpy(p + 1, body, n);
    return frame_payload(out, cap, p, n + 1);
}

size_t lsw_put_sample(uint8_t *out, size_t cap, lsw_encoding enc, const lsw_sample *s)
{
    char body[LSW_BODY_MAX + 1];
    if (enc == LSW_BINARY) {
        return lsw_frame_sample(out, cap, s);
    }
    if (lsw_body_sample(body, sizeof body, s) == 0) {
        return 0;
    }
    return lsw_text_line(out, cap, body);
}

size_t lsw_put_message(uint8_t *out, size_t cap, lsw_encoding enc, const char *body)
{
    return enc == LSW_BINARY ? lsw_frame_message(out, cap, body) : lsw_text_line(out, cap, body);
}

size_t lsw_put_identity(uint8_t *out, size_t cap, lsw_encoding enc, const lsw_identity *id)
{
    char body[LSW_BODY_MAX + 1];
    if (lsw_body_identity(body, sizeof body, id) == 0) return 0;
    return lsw_put_message(out, cap, enc, body);
}

size_t lsw_put_status(uint8_t *out, size_t cap, lsw_encoding enc, const char *code, const char *text)
{
    char body[LSW_BODY_MAX + 1];
    if (lsw_body_status(body, sizeof body, code, text) == 0) return 0;
    return lsw_put_message(out, cap, enc, body);
}

size_t lsw_put_error(uint8_t *out, size_t cap, lsw_encoding enc, const char *code, const char *text)
{
    char body[LSW_BODY_MAX + 1];
    if (lsw_body_error(body, sizeof body, code, text) == 0) return 0;
    return lsw_put_message(out, cap, enc, body);
}

size_t lsw_put_ack(uint8_t *out, size_t cap, lsw_encoding enc, const char *command, const char *detail)
{
    char body[LSW_BODY_MAX + 1];
    if (lsw_body_ack(body, sizeof body, command, detail) == 0) return 0;
    return lsw_put_message(out, cap, enc, body);
}

size_t lsw_put_refusal(uint8_t *out, size_t cap, lsw_encoding enc, const char *command,
                       const char *reason, const char *text)
{
    char body[LSW_BODY_MAX + 1];
    if (lsw_body_refusal(body, sizeof body, command, reason, text) == 0) return 0;
    return lsw_put_message(out, cap, enc, body);
}

/* ---- converter and encoder helpers ------------------------------------- */

int32_t lsw_sign_extend24(uint32_t raw)
{
    raw &= 0xFFFFFFul;
    return (int32_t)(raw ^ 0x800000ul) - (int32_t)0x800000l;
}

int8_t lsw_quad_step(uint8_t prev_ab, uint8_t now_ab)
{
    /* index previous AB << 2 | current AB; forward is 00 -> 01 -> 11 -> 10 -> 00 */
    static const int8_t step[16] = {0, 1, -1, 0, -1, 0, 0, 1, 1, 0, 0, -1, 0, -1, 1, 0};
    return step[((prev_ab & 3u) << 2) | (now_ab & 3u)];
}

/* ---- decimal parsing ---------------------------------------------------- */

/* Canonical decimal: "0" or [1-9][0-9]*, optional leading '-' when neg_ok
 * (but never "-0"). The magnitude may not exceed pos_max, or neg_max when
 * negative. */
static int parse_dec(const uint8_t *s, size_t n, int neg_ok, uint32_t pos_max, uint32_t neg_max,
                     int *neg, uint32_t *mag)
{
    size_t i = 0;
    uint32_t v = 0, limit;
    *neg = 0;
    if (n > 0 && s[0] == '-') {
        if (!neg_ok) return 0;
        *neg = 1;
        i = 1;
    }
    if (i >= n) return 0;
    if (s[i] == '0' && (n - i > 1 || *neg)) return 0;
    limit = *neg ? neg_max : pos_max;
    for (; i < n; i++) {
        uint32_t d;
        if (s[i] < '0' || s[i] > '9') return 0;
        d = (uint32_t)(s[i] - '0');
        if (v > (limit - d) / 10u) return 0;
        v = v * 10u + d;
    }
    *mag = v;
    return 1;
}

static int parse_u(const uint8_t *s, size_t n, uint32_t max, uint32_t *out)
{
    int neg;
    return parse_dec(s, n, 0, max, 0, &neg, out);
}

static int parse_i32(const uint8_t *s, size_t n, int32_t *out)
{
    int neg;
    uint32_t mag;
    if (!parse_dec(s, n, 1, 0x7FFFFFFFul, 0x80000000ul, &neg, &mag)) return 0;
    *out = neg ? u32_to_i32((uint32_t)0 - mag) : (int32_t)mag;
    return 1;
}

/* Splits a valid body into at most max fields after the tag. Returns the
 * field count, or max + 1 when there are more. */
static size_t split_fields(const uint8_t *s, size_t n, const uint8_t **f, size_t *fl, size_t max)
{
    size_t i = 0, count = 0;
    while (i < n && s[i] != ' ') i++;
    while (i < n) {
        size_t start = ++i;
        while (i < n && s[i] != ' ') i++;
        if (count == max) return max + 1;
        f[count] = s + start;
        fl[count] = i - start;
        count++;
    }
    return count;
}

/* Interprets a CRC-valid body. Returns 1 record, 0 malformed, 2 unknown tag. */
static int body_to_record(const uint8_t *s, size_t n, int allow_sample, lsw_record *r)
{
    const uint8_t *f[4];
    size_t fl[4], nf;
    uint32_t seq, t;
    if (!lsw_body_valid((const char *)s, n)) return 0;
    if (s[0] == 'S' && (n == 1 || s[1] == ' ')) {
        if (!allow_sample) return 0;
        nf = split_fields(s, n, f, fl, 4);
        if (nf < 3 || nf > 4) return 0;
        if (!parse_u(f[0], fl[0], 65535ul, &seq)) return 0;
        if (!parse_u(f[1], fl[1], 0xFFFFFFFFul, &t)) return 0;
        if (!parse_i32(f[2], fl[2], &r->sample.load)) return 0;
        r->sample.has_pos = (uint8_t)(nf == 4);
        r->sample.pos = 0;
        if (nf == 4 && !parse_i32(f[3], fl[3], &r->sample.pos)) return 0;
        r->sample.seq = (uint16_t)seq;
        r->sample.time_us = t;
        r->kind = LSW_REC_SAMPLE;
        return 1;
    }
    if (n >= 1 && (n == 1 || s[1] == ' ') &&
        (s[0] == 'I' || s[0] == 'T' || s[0] == 'E' || s[0] == 'A' || s[0] == 'N')) {
        memcpy(r->body, s, n);
        r->body[n] = '\0';
        r->body_len = n;
        r->kind = LSW_REC_MESSAGE;
        return 1;
    }
    return 2;
}

/* ---- command parser ----------------------------------------------------- */

static char to_upper(char c)
{
    return (c >= 'a' && c <= 'z') ? (char)(c - 'a' + 'A') : c;
}

static int word_is(const char *w, size_t n, const char *name)
{
    size_t i;
    for (i = 0; i < n; i++) {
        if (name[i] == '\0' || to_upper(w[i]) != name[i]) return 0;
    }
    return name[n] == '\0';
}

const char *lsw_parse_reason(lsw_parse_status st)
{
    switch (st) {
    case LSW_PARSE_OK: return "ok";
    case LSW_PARSE_EMPTY: return "empty";
    case LSW_PARSE_CHECKSUM: return "checksum";
    case LSW_PARSE_BAD_ARG: return "bad-arg";
    case LSW_PARSE_UNKNOWN:
    case LSW_PARSE_TOO_LONG:
    case LSW_PARSE_MALFORMED:
    default: return "bad-command";
    }
}

lsw_parse_status lsw_parse_command(const char *line, size_t len, lsw_command *out)
{
    const char *s = line;
    const char *args[3];
    size_t arg_len[3], nargs = 0, i, wl;
    int crc_given = 0;
    uint16_t crc_sent = 0;

    memset(out, 0, sizeof *out);
    while (len > 0 && (s[len - 1] == '\r' || s[len - 1] == ' ')) len--;
    if (len == 0) return LSW_PARSE_EMPTY;
    if (len > LSW_LINE_MAX) return LSW_PARSE_TOO_LONG;

    /* optional " ~XXXX" */
    if (len >= 7 && s[len - 6] == ' ' && s[len - 5] == '~') {
        int ok = 1;
        for (i = len - 4; i < len; i++) {
            int h = hex_value((uint8_t)s[i]);
            if (h < 0) { ok = 0; break; }
            crc_sent = (uint16_t)((crc_sent << 4) | (uint16_t)h);
        }
        if (!ok) return LSW_PARSE_MALFORMED;
        crc_given = 1;
        len -= 6;
    }

    /* command word: letters only, 1..11 */
    for (wl = 0; wl < len && s[wl] != ' '; wl++) {
        char c = to_upper(s[wl]);
        if (c < 'A' || c > 'Z' || wl >= sizeof out->word - 1) return LSW_PARSE_MALFORMED;
        out->word[wl] = c;
    }
    if (wl == 0) return LSW_PARSE_MALFORMED;
    out->word[wl] = '\0';

    for (i = wl; i < len;) {
        size_t start = ++i;
        while (i < len && s[i] != ' ') {
            if (!is_field_char((uint8_t)s[i])) return LSW_PARSE_MALFORMED;
            i++;
        }
        if (i == start) return LSW_PARSE_MALFORMED;
        if (nargs < 3) {
            args[nargs] = s + start;
            arg_len[nargs] = i - start;
        }
        nargs++;
    }

    if (crc_given && lsw_crc16((const uint8_t *)s, len) != crc_sent) return LSW_PARSE_CHECKSUM;

    if (word_is(s, wl, "WHO") || word_is(s, wl, "START") || word_is(s, wl, "STOP") ||
        word_is(s, wl, "HALT")) {
        out->kind = word_is(s, wl, "WHO") ? LSW_CMD_WHO
                  : word_is(s, wl, "START") ? LSW_CMD_START
                  : word_is(s, wl, "STOP") ? LSW_CMD_STOP : LSW_CMD_HALT;
        return nargs == 0 ? LSW_PARSE_OK : LSW_PARSE_BAD_ARG;
    }
    if (word_is(s, wl, "RATE")) {
        out->kind = LSW_CMD_RATE;
        if (nargs != 1 || !parse_u((const uint8_t *)args[0], arg_len[0], 0xFFFFFFFFul, &out->rate_hz)) {
            return LSW_PARSE_BAD_ARG;
        }
        return LSW_PARSE_OK;
    }
    if (word_is(s, wl, "PING")) {
        out->kind = LSW_CMD_PING;
        if (nargs != 1 || arg_len[0] > LSW_PING_TOKEN_MAX) return LSW_PARSE_BAD_ARG;
        memcpy(out->token, args[0], arg_len[0]);
        out->token[arg_len[0]] = '\0';
        return LSW_PARSE_OK;
    }
    if (word_is(s, wl, "LIGHT")) {
        out->kind = LSW_CMD_LIGHT;
        if (nargs != 1) return LSW_PARSE_BAD_ARG;
        if (word_is(args[0], arg_len[0], "ON")) {
            out->light_on = 1;
        } else if (word_is(args[0], arg_len[0], "OFF")) {
            out->light_on = 0;
        } else {
            return LSW_PARSE_BAD_ARG;
        }
        return LSW_PARSE_OK;
    }
    if (word_is(s, wl, "MODE")) {
        out->kind = LSW_CMD_MODE;
        if (nargs != 1) return LSW_PARSE_BAD_ARG;
        if (word_is(args[0], arg_len[0], "TEXT")) {
            out->mode = LSW_TEXT;
        } else if (word_is(args[0], arg_len[0], "BINARY")) {
            out->mode = LSW_BINARY;
        } else {
            return LSW_PARSE_BAD_ARG;
        }
        return LSW_PARSE_OK;
    }
    return LSW_PARSE_UNKNOWN;
}

/* ---- decoder ------------------------------------------------------------ */

enum { CLS_MALFORMED = 0, CLS_RECORD, CLS_UNKNOWN, CLS_BAD_CRC };

/* One text line without its LF (a single trailing CR is allowed). */
static int classify_text(const uint8_t *s, size_t n, lsw_record *r)
{
    size_t i, body_n;
    uint16_t crc = 0;
    int res;
    if (n > 0 && s[n - 1] == '\r') n--;
    if (n < 7 || n > LSW_LINE_MAX) return CLS_MALFORMED;
    if (s[n - 6] != ' ' || s[n - 5] != '~') return CLS_MALFORMED;
    for (i = n - 4; i < n; i++) {
        int h = hex_value(s[i]);
        if (h < 0) return CLS_MALFORMED;
        crc = (uint16_t)((crc << 4) | (uint16_t)h);
    }
    body_n = n - 6;
    if (!lsw_body_valid((const char *)s, body_n)) return CLS_MALFORMED;
    if (lsw_crc16(s, body_n) != crc) return CLS_BAD_CRC;
    res = body_to_record(s, body_n, 1, r);
    r->encoding = LSW_TEXT;
    return res == 1 ? CLS_RECORD : res == 2 ? CLS_UNKNOWN : CLS_MALFORMED;
}

/* One COBS frame without its 0x00 delimiter. */
static int classify_binary(const uint8_t *s, size_t n, lsw_record *r)
{
    uint8_t p[LSW_PAYLOAD_MAX];
    size_t pn, body_n;
    uint8_t type;
    int crc_ok, shaped;
    if (!lsw_cobs_decode(s, n, p, sizeof p, &pn) || pn < 3) return CLS_MALFORMED;
    type = p[0];
    body_n = pn - 3;
    crc_ok = lsw_crc16(p, pn - 2) == (uint16_t)(((uint16_t)p[pn - 2] << 8) | p[pn - 1]);
    shaped = (type == LSW_TYPE_SAMPLE && body_n == 10) || (type == LSW_TYPE_SAMPLE_POS && body_n == 14) ||
             (type == LSW_TYPE_MESSAGE && lsw_body_valid((const char *)p + 1, body_n));
    r->encoding = LSW_BINARY;
    if (!crc_ok) return shaped ? CLS_BAD_CRC : CLS_MALFORMED;
    if (type != LSW_TYPE_SAMPLE && type != LSW_TYPE_SAMPLE_POS && type != LSW_TYPE_MESSAGE) {
        return CLS_UNKNOWN;
    }
    if (!shaped) return CLS_MALFORMED;
    if (type == LSW_TYPE_MESSAGE) {
        int res = body_to_record(p + 1, body_n, 0, r);
        return res == 1 ? CLS_RECORD : res == 2 ? CLS_UNKNOWN : CLS_MALFORMED;
    }
    r->kind = LSW_REC_SAMPLE;
    r->sample.seq = get_le16(p + 1);
    r->sample.time_us = get_le32(p + 3);
    r->sample.load = u32_to_i32(get_le32(p + 7));
    r->sample.has_pos = (uint8_t)(type == LSW_TYPE_SAMPLE_POS);
    r->sample.pos = type == LSW_TYPE_SAMPLE_POS ? u32_to_i32(get_le32(p + 11)) : 0;
    return CLS_RECORD;
}

void lsw_decoder_init(lsw_decoder *d, lsw_follow start, lsw_record_fn on_record, void *ctx)
{
    memset(d, 0, sizeof *d);
    d->follow = start;
    d->on_record = on_record;
    d->ctx = ctx;
}

static void deliver(lsw_decoder *d, int cls, lsw_follow enc)
{
    lsw_record *r = &d->scratch;
    d->text.len = 0;
    d->text.cut = 0;
    d->bin.len = 0;
    d->bin.cut = 0;
    d->follow = enc;
    if (cls == CLS_UNKNOWN) {
        d->counters.unknown++;
        return;
    }
    if (r->kind == LSW_REC_SAMPLE) {
        if (d->have_seq) {
            d->counters.dropped += (uint16_t)(r->sample.seq - d->last_seq - 1u);
        }
        d->have_seq = 1;
        d->last_seq = r->sample.seq;
        d->counters.samples++;
    } else {
        if (r->body[0] == 'I') {
            d->have_seq = 0; /* device restarted: sequence starts afresh */
        }
        d->counters.messages++;
    }
    if (d->on_record != NULL) {
        d->on_record(d->ctx, r);
    }
}

/* Evaluates a finished candidate: whole, then every later start offset. */
static void evaluate(lsw_decoder *d, lsw_candidate *c, lsw_follow enc)
{
    size_t k;
    int whole = CLS_MALFORMED;
    int empty = enc == LSW_FOLLOW_TEXT ? (c->len == 0 || (c->len == 1 && c->bytes[0] == '\r'))
                                       : c->len == 0;
    if (!empty) {
        for (k = 0; k < c->len; k++) {
            int cls = enc == LSW_FOLLOW_TEXT ? classify_text(c->bytes + k, c->len - k, &d->scratch)
                                             : classify_binary(c->bytes + k, c->len - k, &d->scratch);
            if (k == 0) whole = cls;
            if (cls == CLS_RECORD || cls == CLS_UNKNOWN) {
                deliver(d, cls, enc);
                return;
            }
        }
        if (d->follow == enc) {
            if (whole == CLS_BAD_CRC) {
                d->counters.checksum_errors++;
            } else {
                d->counters.resyncs++;
            }
        }
    }
    c->len = 0;
    c->cut = 0;
}

static void append(lsw_decoder *d, lsw_candidate *c, lsw_follow enc, uint8_t b)
{
    if (c->len == LSW_CANDIDATE_MAX) {
        memmove(c->bytes, c->bytes + 1, LSW_CANDIDATE_MAX - 1);
        c->len--;
        if (!c->cut && d->follow == enc) {
            d->counters.resyncs++;
        }
        c->cut = 1;
    }
    c->bytes[c->len++] = b;
}

void lsw_decoder_feed(lsw_decoder *d, const uint8_t *data, size_t n)
{
    size_t i;
    for (i = 0; i < n; i++) {
        uint8_t b = data[i];
        if (b == '\n') {
            append(d, &d->bin, LSW_FOLLOW_BINARY, b);
            evaluate(d, &d->text, LSW_FOLLOW_TEXT);
        } else if (b == 0x00) {
            append(d, &d->text, LSW_FOLLOW_TEXT, b);
            evaluate(d, &d->bin, LSW_FOLLOW_BINARY);
        } else {
            append(d, &d->text, LSW_FOLLOW_TEXT, b);
            append(d, &d->bin, LSW_FOLLOW_BINARY, b);
        }
    }
}
