/*
 * lsw_proto.h - Loadstone wire protocol v1 (see ../PROTOCOL.md).
 *
 * Plain C99, no heap, no Arduino headers. Used by the reference firmware
 * (encoders, command parser) and by the host-compiled tests (decoder).
 *
 * Conventions: every encoder writes into a caller buffer of `cap` bytes and
 * returns the number of bytes written, or 0 when the input breaks the
 * protocol grammar or the buffer is too small (nothing useful is written).
 * Text output is NUL-terminated when room allows; the NUL is not counted.
 */
#ifndef LSW_PROTO_H
#define LSW_PROTO_H

#include <stddef.h>
#include <stdint.h>

#ifdef __cplusplus
extern "C" {
#endif

#define LSW_PROTO_VERSION 1
#define LSW_LINE_MAX 200      /* text line, body and " ~CRC" included, line end excluded */
#define LSW_BODY_MAX 194      /* LSW_LINE_MAX minus " ~XXXX" */
#define LSW_PAYLOAD_MAX 254   /* binary payload: type + body + 2 CRC bytes */
#define LSW_FRAME_MAX 257     /* leading 0x00 is not added; COBS(254) = 255, + delimiter */
#define LSW_CANDIDATE_MAX 512 /* decoder candidate cap */
#define LSW_PING_TOKEN_MAX 8

#define LSW_TYPE_SAMPLE 0x01
#define LSW_TYPE_SAMPLE_POS 0x02
#define LSW_TYPE_MESSAGE 0x10

typedef enum { LSW_TEXT = 0, LSW_BINARY = 1 } lsw_encoding;

/* ---- checksum --------------------------------------------------------- */

/* CRC-16/CCITT-FALSE: poly 0x1021, init 0xFFFF, no reflection, no xorout. */
uint16_t lsw_crc16_update(uint16_t crc, const uint8_t *data, size_t n);
uint16_t lsw_crc16(const uint8_t *data, size_t n);

/* ---- COBS ------------------------------------------------------------- */

/* Encodes n bytes (n <= LSW_PAYLOAD_MAX) without the trailing delimiter.
 * Output never contains 0x00. Returns length, 0 if n is 0, too long or cap short. */
size_t lsw_cobs_encode(const uint8_t *in, size_t n, uint8_t *out, size_t cap);
/* Decodes n COBS bytes (no delimiter inside). Returns 1 and sets *out_len on
 * success; 0 if the input holds 0x00, a code byte overruns, or cap is short. */
int lsw_cobs_decode(const uint8_t *in, size_t n, uint8_t *out, size_t cap, size_t *out_len);

/* ---- records ---------------------------------------------------------- */

typedef struct {
    uint16_t seq;     /* wraps at 65536 */
    uint32_t time_us; /* device microseconds, wraps at 2^32 */
    int32_t load;     /* sign-extended converter counts */
    int32_t pos;      /* quadrature counts; meaningful when has_pos */
    uint8_t has_pos;  /* 1: sample carries position */
} lsw_sample;

typedef struct {
    uint32_t proto;   /* 1 */
    const char *fw;   /* e.g. "1.0.0" */
    const char *adc;  /* e.g. "hx711" */
    uint32_t rate_hz; /* nominal rate */
    uint32_t ch;      /* 1 or 2 */
    uint32_t cpm;     /* position counts per mm, 0 = key omitted */
    uint32_t motor;   /* 0 or 1 */
    const char *name; /* no spaces; NULL = key omitted */
} lsw_identity;

/* 1 if body follows `tag *( " " field )`, tag 1-3 of A-Z, field printable
 * ASCII 0x21..0x7E, and n <= LSW_BODY_MAX. */
int lsw_body_valid(const char *body, size_t n);

/* Body builders (text body, no " ~CRC", no line end). `text`/`detail` may be
 * NULL or "" (omitted); they may hold single spaces between words. */
size_t lsw_body_sample(char *out, size_t cap, const lsw_sample *s);
size_t lsw_body_identity(char *out, size_t cap, const lsw_identity *id);
size_t lsw_body_status(char *out, size_t cap, const char *code, const char *text);
size_t lsw_body_error(char *out, size_t cap, const char *code, const char *text);
size_t lsw_body_ack(char *out, size_t cap, const char *command, const char *detail);
size_t lsw_body_refusal(char *out, size_t cap, const char *command, const char *reason,
                        const char *text);

/* Whole records, ready to send. Text: `body ~XXXX\n` (upper-case CRC, LF).
 * Binary: COBS frame + 0x00 (no leading 0x00). */
size_t lsw_text_line(uint8_t *out, size_t cap, const char *body);
size_t lsw_frame_sample(uint8_t *out, size_t cap, const lsw_sample *s); /* type 0x01 / 0x02 */
size_t lsw_frame_message(uint8_t *out, size_t cap, const char *body);   /* type 0x10 */

/* Record in the chosen encoding: samples as `S ...` lines or 0x01/0x02
 * frames, everything else as lines or 0x10 frames. */
size_t lsw_put_sample(uint8_t *out, size_t cap, lsw_encoding enc, const lsw_sample *s);
size_t lsw_put_message(uint8_t *out, size_t cap, lsw_encoding enc, const char *body);
size_t lsw_put_identity(uint8_t *out, size_t cap, lsw_encoding enc, const lsw_identity *id);
size_t lsw_put_status(uint8_t *out, size_t cap, lsw_encoding enc, const char *code, const char *text);
size_t lsw_put_error(uint8_t *out, size_t cap, lsw_encoding enc, const char *code, const char *text);
size_t lsw_put_ack(uint8_t *out, size_t cap, lsw_encoding enc, const char *command, const char *detail);
size_t lsw_put_refusal(uint8_t *out, size_t cap, lsw_encoding enc, const char *command,
                       const char *reason, const char *text);

/* ---- converter and encoder helpers ------------------------------------ */

/* 24-bit two's complement converter word (HX711-class, MSB first) to counts:
 * 0x800000 -> -8388608, 0x7FFFFF -> 8388607. Bits above 23 are ignored. */
int32_t lsw_sign_extend24(uint32_t raw);
/* 4x quadrature decoding step for channel levels AB (bit 1 = A, bit 0 = B):
 * +1 forward (00 -> 01 -> 11 -> 10 -> 00), -1 backward, 0 for no change or a
 * skipped state (both channels changed: the step cannot be known). */
int8_t lsw_quad_step(uint8_t prev_ab, uint8_t now_ab);

/* ---- host commands (parsed on the device) ----------------------------- */

typedef enum {
    LSW_CMD_WHO, LSW_CMD_START, LSW_CMD_STOP, LSW_CMD_RATE,
    LSW_CMD_PING, LSW_CMD_HALT, LSW_CMD_MODE, LSW_CMD_LIGHT
} lsw_cmd_kind;

typedef enum {
    LSW_PARSE_OK = 0,
    LSW_PARSE_EMPTY,     /* blank line: ignore, no answer */
    LSW_PARSE_TOO_LONG,  /* over LSW_LINE_MAX: answer `E bad-command` */
    LSW_PARSE_MALFORMED, /* not `WORD *( " " arg )`: answer `E bad-command` */
    LSW_PARSE_CHECKSUM,  /* ` ~XXXX` present, CRC wrong: `N <word> checksum` */
    LSW_PARSE_UNKNOWN,   /* unknown command word: `N <word> bad-command` */
    LSW_PARSE_BAD_ARG    /* missing, extra or malformed argument: `N <word> bad-arg` */
} lsw_parse_status;

typedef struct {
    lsw_cmd_kind kind;
    char word[12];                        /* command word as an upper-case field, for A/N replies */
    uint32_t rate_hz;                     /* RATE */
    char token[LSW_PING_TOKEN_MAX + 1];   /* PING */
    lsw_encoding mode;                    /* MODE */
    uint8_t light_on;                     /* LIGHT: 1 = on, 0 = off */
} lsw_command;

/* Parses one command line (without LF; a trailing CR and trailing spaces are
 * dropped). Command words and MODE arguments are case-insensitive. On any
 * status but EMPTY/TOO_LONG/MALFORMED, out->word holds the command word
 * (upper case, at most 11 chars) for the refusal line. */
lsw_parse_status lsw_parse_command(const char *line, size_t len, lsw_command *out);
const char *lsw_parse_reason(lsw_parse_status st); /* "checksum", "bad-arg", ... */

/* ---- host-side streaming decoder --------------------------------------- */

typedef enum { LSW_FOLLOW_NONE = 0, LSW_FOLLOW_TEXT, LSW_FOLLOW_BINARY } lsw_follow;

typedef struct {
    uint32_t samples, messages, checksum_errors, resyncs, dropped, unknown;
} lsw_counters;

typedef enum { LSW_REC_SAMPLE = 0, LSW_REC_MESSAGE } lsw_rec_kind;

typedef struct {
    lsw_rec_kind kind;
    lsw_encoding encoding;          /* encoding it arrived in */
    lsw_sample sample;              /* LSW_REC_SAMPLE */
    char body[LSW_BODY_MAX + 1];    /* LSW_REC_MESSAGE, NUL-terminated */
    size_t body_len;
} lsw_record;

typedef void (*lsw_record_fn)(void *ctx, const lsw_record *rec);

typedef struct {
    uint8_t bytes[LSW_CANDIDATE_MAX];
    size_t len;
    uint8_t cut; /* this candidate already lost bytes to the cap */
} lsw_candidate;

typedef struct {
    lsw_candidate text, bin;
    lsw_follow follow;
    uint8_t have_seq;
    uint16_t last_seq;
    lsw_counters counters;
    lsw_record_fn on_record;
    void *ctx;
    lsw_record scratch;
} lsw_decoder;

/* start: LSW_FOLLOW_NONE ("auto"), TEXT or BINARY. on_record may be NULL. */
void lsw_decoder_init(lsw_decoder *d, lsw_follow start, lsw_record_fn on_record, void *ctx);
void lsw_decoder_feed(lsw_decoder *d, const uint8_t *data, size_t n);

#ifdef __cplusplus
}
#endif

#endif /* LSW_PROTO_H */
