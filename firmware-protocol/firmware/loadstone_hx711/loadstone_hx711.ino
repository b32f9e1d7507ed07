/*
 * loadstone_hx711 - reference firmware for the Loadstone wire protocol v1.
 *
 * A load cell on an HX711-class 24-bit bridge converter, optional quadrature
 * encoder on the crosshead, samples to the host as text lines or COBS frames
 * (../../PROTOCOL.md). Build notes and wiring: ../README.md. The protocol code
 * is lsw_proto.c / lsw_proto.h, copied into this folder before building
 * (`make -C ../test sketch`).
 *
 * Safety: keep hands clear of the press, never load the cell beyond its rated
 * capacity. This firmware's STOP only stops the data; it does not replace the
 * press's mechanical limits or its emergency stop.
 */
#include "lsw_proto.h"

/* ---- configuration -------------------------------------------------------- */

static const uint8_t PIN_HX_DOUT = 4;   /* HX711 DOUT (data out of the converter) */
static const uint8_t PIN_HX_SCK = 5;    /* HX711 PD_SCK (clock into the converter) */
static const uint8_t PIN_HX_RATE = 6;   /* HX711 RATE: LOW = 10 samples/s, HIGH = 80 samples/s */
static const uint8_t PIN_ENC_A = 2;     /* encoder channel A, interrupt-capable */
static const uint8_t PIN_ENC_B = 3;     /* encoder channel B, interrupt-capable */
static const uint8_t PIN_SYNC_LIGHT = 7; /* sync light: an LED (with its resistor) the camera sees */

#define HAS_ENCODER 1                   /* 0: load only (ch=1, samples without position) */
#define HAS_SYNC_LIGHT 1                /* 0: no LED fitted, LIGHT is refused (N LIGHT no-light) */
#define CHECK_TX_ROOM 1                 /* 0 for cores whose Serial.availableForWrite() is always 0 */
static const uint32_t ENCODER_COUNTS_PER_MM = 400; /* 4x counts per mm of crosshead travel */
static const char DEVICE_NAME[] = "bench-press";
static const char FIRMWARE_VERSION[] = "1.0.0";
static const unsigned long BAUD = 115200;

/* ---- state ----------------------------------------------------------------- */

static lsw_encoding encoding = LSW_TEXT;
static uint8_t streaming = 0;
static uint8_t frame_lead_zero = 0;   /* send one 0x00 before the next binary frame */
static uint32_t rate_hz = 80;
static uint16_t seq = 0;
static uint8_t overrange = 0;
static uint8_t lost_samples = 0;      /* a sample did not fit the transmit buffer */
static unsigned long last_conversion_ms = 0;
static unsigned long last_timeout_report_ms = 0;

static char line_buf[LSW_LINE_MAX + 1];
static size_t line_len = 0;
static uint8_t line_overflow = 0;

static uint8_t tx[LSW_FRAME_MAX + 8];

#if HAS_ENCODER
static volatile int32_t encoder_count = 0;
static volatile uint8_t encoder_state = 0;

static void encoder_isr()
{
    uint8_t now = (uint8_t)((digitalRead(PIN_ENC_A) << 1) | digitalRead(PIN_ENC_B));
    encoder_count += lsw_quad_step(encoder_state, now); /* 4x decoding */
    encoder_state = now;
}

static int32_t encoder_read()
{
    int32_t v;
    noInterrupts();
    v = encoder_count;
    interrupts();
    return v;
}
#endif

/* ---- output ------------------------------------------------------------------ */

static void send(size_t n)
{
    if (n == 0) {
        return;
    }
    if (encoding == LSW_BINARY && frame_lead_zero) {
        Serial.write((uint8_t)0x00);
        frame_lead_zero = 0;
    }
    Serial.write(tx, n);
}

static void send_identity()
{
    lsw_identity id;
    id.proto = LSW_PROTO_VERSION;
    id.fw = FIRMWARE_VERSION;
    id.adc = "hx711";
    id.rate_hz = rate_hz;
#if HAS_ENCODER
    id.ch = 2;
    id.cpm = ENCODER_COUNTS_PER_MM;
#else
    id.ch = 1;
    id.cpm = 0;
#endif
    id.motor = 0;
    id.name = DEVICE_NAME;
    send(lsw_put_identity(tx, sizeof tx, encoding, &id));
}

static void send_status(const char *code)
{
    send(lsw_put_status(tx, sizeof tx, encoding, code, NULL));
}

static void send_error(const char *code)
{
    send(lsw_put_error(tx, sizeof tx, encoding, code, NULL));
}

static void send_ack(const char *command, const char *detail)
{
    send(lsw_put_ack(tx, sizeof tx, encoding, command, detail));
}

static void send_refusal(const char *command, const char *reason)
{
    send(lsw_put_refusal(tx, sizeof tx, encoding, command, reason, NULL));
}

/* ---- HX711-class converter ------------------------------------------------------ */

static uint8_t hx_ready()
{
    return digitalRead(PIN_HX_DOUT) == LOW;
}

/* One clock pulse. Interrupts are held off only while PD_SCK is high: a high
 * phase over 60 us would put the converter into power-down. */
static uint8_t hx_pulse()
{
    uint8_t bit;
    noInterrupts();
    digitalWrite(PIN_HX_SCK, HIGH);
    delayMicroseconds(1);
    bit = (uint8_t)digitalRead(PIN_HX_DOUT);
    digitalWrite(PIN_HX_SCK, LOW);
    interrupts();
    delayMicroseconds(1);
    return bit;
}

/* Reads a finished conversion: 24 bits MSB first, then a 25th pulse that
 * selects channel A, gain 128, for the next conversion. */
static int32_t hx_read()
{
    uint32_t raw = 0;
    uint8_t i;
    for (i = 0; i < 24; i++) {
        raw = (raw << 1) | hx_pulse();
    }
    (void)hx_pulse();
    return lsw_sign_extend24(raw);
}

static void set_rate(uint32_t hz)
{
    rate_hz = hz;
    digitalWrite(PIN_HX_RATE, hz == 80 ? HIGH : LOW);
    last_conversion_ms = millis(); /* the converter settles after a rate change */
}

static unsigned long timeout_ms()
{
    return 5ul * 1000ul / rate_hz + 100ul; /* five periods plus settling margin */
}

static void poll_converter()
{
    lsw_sample s;
    size_t n;
    unsigned long now_ms = millis();

    if (!hx_ready()) {
        if (streaming && now_ms - last_conversion_ms > timeout_ms() &&
            now_ms - last_timeout_report_ms > 1000ul) {
            send_error("adc-timeout");
            last_timeout_report_ms = now_ms;
        }
        return;
    }
    s.time_us = (uint32_t)micros();
    s.load = hx_read();
    last_conversion_ms = now_ms;
    if (!streaming) {
        return;
    }

    /* the converter clips at its full-scale codes */
    if (s.load == 8388607l || s.load == -8388607l - 1) {
        if (!overrange) {
            send_status("overrange");
        }
        overrange = 1;
    } else {
        overrange = 0;
    }

    s.seq = seq++;
#if HAS_ENCODER
    s.has_pos = 1;
    s.pos = encoder_read();
#else
    s.has_pos = 0;
    s.pos = 0;
#endif
    n = lsw_put_sample(tx, sizeof tx, encoding, &s);
#if CHECK_TX_ROOM
    if ((size_t)Serial.availableForWrite() < n + 1) {
        lost_samples = 1; /* skipped, never queued: the host sees the gap in seq */
        return;
    }
#endif
    send(n);
    if (lost_samples) {
        send_error("overflow");
        lost_samples = 0;
    }
}

/* ---- commands ---------------------------------------------------------------------- */

static void handle_line(const char *line, size_t len)
{
    lsw_command c;
    char detail[12];
    lsw_parse_status st = lsw_parse_command(line, len, &c);

    switch (st) {
    case LSW_PARSE_EMPTY:
        return;
    case LSW_PARSE_TOO_LONG:
    case LSW_PARSE_MALFORMED:
        send_error("bad-command");
        return;
    case LSW_PARSE_CHECKSUM:
    case LSW_PARSE_UNKNOWN:
    case LSW_PARSE_BAD_ARG:
        send_refusal(c.word, lsw_parse_reason(st));
        return;
    case LSW_PARSE_OK:
        break;
    }

    switch (c.kind) {
    case LSW_CMD_WHO:
        send_identity();
        send_ack("WHO", NULL);
        break;
    case LSW_CMD_START:
        streaming = 1;
        last_conversion_ms = millis();
        send_ack("START", NULL);
        send_status("streaming");
        break;
    case LSW_CMD_STOP:
        streaming = 0;
        send_ack("STOP", NULL);
        send_status("stopped");
        break;
    case LSW_CMD_RATE:
        if (c.rate_hz != 10 && c.rate_hz != 80) {
            send_refusal("RATE", "unsupported");
            break;
        }
        set_rate(c.rate_hz);
        detail[0] = c.rate_hz == 10 ? '1' : '8';
        detail[1] = '0';
        detail[2] = '\0';
        send_ack("RATE", detail);
        break;
    case LSW_CMD_PING:
        send_ack("PING", c.token);
        break;
    case LSW_CMD_HALT:
        send_refusal("HALT", "no-motor"); /* this board drives no crosshead */
        break;
    case LSW_CMD_LIGHT:
#if HAS_SYNC_LIGHT
        /* switched before the acknowledgement is queued, so the light is on by the time the
           host reads A LIGHT on: the instant lies between the last sample before the
           acknowledgement and the acknowledgement */
        digitalWrite(PIN_SYNC_LIGHT, c.light_on ? HIGH : LOW);
        send_ack("LIGHT", c.light_on ? "on" : "off");
#else
        send_refusal("LIGHT", "no-light");
#endif
        break;
    case LSW_CMD_MODE:
        /* acknowledged in the old encoding, everything after in the new one */
        send_ack("MODE", c.mode == LSW_BINARY ? "binary" : "text");
        if (c.mode == LSW_BINARY && encoding != LSW_BINARY) {
            frame_lead_zero = 1;
        }
        encoding = c.mode;
        break;
    }
}

static void poll_serial()
{
    while (Serial.available() > 0) {
        int b = Serial.read();
        if (b < 0) {
            return;
        }
        if (b == '\n') {
            if (line_overflow) {
                send_error("bad-command");
            } else {
                handle_line(line_buf, line_len);
            }
            line_len = 0;
            line_overflow = 0;
        } else if (line_len < LSW_LINE_MAX + 1) {
            line_buf[line_len++] = (char)b;
        } else {
            line_overflow = 1;
        }
    }
}

/* ---- Arduino entry points ------------------------------------------------------------ */

void setup()
{
    pinMode(PIN_HX_DOUT, INPUT);
    pinMode(PIN_HX_SCK, OUTPUT);
    digitalWrite(PIN_HX_SCK, LOW); /* a high clock over 60 us powers the converter down */
    pinMode(PIN_HX_RATE, OUTPUT);
    set_rate(80);
#if HAS_SYNC_LIGHT
    pinMode(PIN_SYNC_LIGHT, OUTPUT);
    digitalWrite(PIN_SYNC_LIGHT, LOW);
#endif
#if HAS_ENCODER
    pinMode(PIN_ENC_A, INPUT_PULLUP);
    pinMode(PIN_ENC_B, INPUT_PULLUP);
    encoder_state = (uint8_t)((digitalRead(PIN_ENC_A) << 1) | digitalRead(PIN_ENC_B));
    attachInterrupt(digitalPinToInterrupt(PIN_ENC_A), encoder_isr, CHANGE);
    attachInterrupt(digitalPinToInterrupt(PIN_ENC_B), encoder_isr, CHANGE);
#endif
    Serial.begin(BAUD);
    send_identity();
    send_status("ready");
}

void loop()
{
    poll_serial();
    poll_converter();
}
