/*
 * sketch_sim.cpp - runs the real loadstone_hx711.ino on the host against a
 * simulated HX711-class converter (DOUT/PD_SCK/RATE per the HX711 datasheet:
 * DOUT low = conversion ready, bits shifted out MSB first on PD_SCK rising
 * edges, 25 pulses = channel A gain 128 next, 10 or 80 samples/s by RATE),
 * a quadrature encoder and a serial port. Everything the sketch sends is fed
 * to the C host decoder, so the checks read records, not bytes.
 *
 * Usage: sketch_sim   (prints failures and "N passed, N failed"; exit 0 if all pass)
 */
#include "arduino_fake.h"

#include <stdio.h>
#include <string.h>

#include "../loadstone_hx711/loadstone_hx711.ino"

/* ---- simulated world ------------------------------------------------------ */

static uint64_t now_us = 4294967295ull - 200000ull; /* micros() wraps 0.2 s into the run */
static int irq_off = 0;
static void (*isr_table[2])(void) = {0, 0};
static uint8_t enc_a = 0, enc_b = 0;

/* converter */
static int32_t hx_values[8] = {12345, -1, 8388607, -8388608, 0, 42, -4242, 777};
static size_t hx_next_value = 0;
static int hx_stalled = 0;
static uint64_t hx_ready_at = 0;
static int hx_pulses = -1;      /* -1: no conversion ready; 0..25 pulses seen */
static uint32_t hx_word = 0;
static uint8_t hx_dout = 1, hx_sck = 0, hx_rate_pin = 0;
static uint8_t sync_light = 0; /* level of the sync-light pin */
static uint64_t hx_sck_high_since = 0, hx_longest_high_us = 0;
static uint32_t hx_conversions = 0, hx_bad_reads = 0;

/* serial */
static uint8_t rx[1024];
static size_t rx_len = 0, rx_pos = 0;
static int tx_room = 63;
static uint8_t tx_log[65536];
static size_t tx_len = 0;

static void hx_update(void)
{
    if (hx_pulses < 0 && !hx_stalled && now_us >= hx_ready_at) {
        uint32_t v = (uint32_t)hx_values[hx_next_value++ % 8];
        hx_word = v & 0xFFFFFFul;
        hx_pulses = 0;
        hx_dout = 0;
    }
}

int digitalRead(uint8_t pin)
{
    now_us += 4; /* about what an 8-bit core spends */
    if (pin == PIN_HX_DOUT) {
        hx_update();
        return hx_pulses < 0 ? 1 : hx_dout;
    }
    if (pin == PIN_ENC_A) return enc_a;
    if (pin == PIN_ENC_B) return enc_b;
    return 0;
}

void digitalWrite(uint8_t pin, uint8_t level)
{
    now_us += 4;
    if (pin == PIN_SYNC_LIGHT) {
        sync_light = level;
    } else if (pin == PIN_HX_RATE) {
        if (level != hx_rate_pin) {
            /* output settling time after a rate change: 50 ms at 80/s, 400 ms at 10/s (HX711 datasheet) */
            hx_ready_at = now_us + (level ? 50000u : 400000u);
        }
        hx_rate_pin = level;
    } else if (pin == PIN_HX_SCK) {
        if (level && !hx_sck) {
            hx_sck_high_since = now_us;
            if (hx_pulses >= 0) {
                hx_pulses++;
                hx_dout = hx_pulses <= 24 ? (uint8_t)((hx_word >> (24 - hx_pulses)) & 1u) : 1;
            } else {
                hx_bad_reads++; /* clocked without a ready conversion */
            }
        } else if (!level && hx_sck) {
            uint64_t high = now_us - hx_sck_high_since;
            if (high > hx_longest_high_us) hx_longest_high_us = high;
            if (hx_pulses == 25) {
                hx_pulses = -1;
                hx_conversions++;
                /* the converter runs at its own fixed cadence, whenever it is read */
                do {
                    hx_ready_at += hx_rate_pin ? 12500u : 100000u;
                } while (hx_ready_at <= now_us);
            }
        }
        hx_sck = level;
    }
}

void pinMode(uint8_t, uint8_t) {}
void delayMicroseconds(unsigned int us) { now_us += us; }
unsigned long micros(void) { return (unsigned long)(uint32_t)now_us; }
unsigned long millis(void) { return (unsigned long)(now_us / 1000u); }
void noInterrupts(void) { irq_off++; }
void interrupts(void) { irq_off = 0; }
int digitalPinToInterrupt(uint8_t pin) { return pin == 2 ? 0 : pin == 3 ? 1 : -1; }
void attachInterrupt(int irq, void (*isr)(void), int) { if (irq == 0 || irq == 1) isr_table[irq] = isr; }

FakeSerial Serial;
void FakeSerial::begin(unsigned long) {}
int FakeSerial::available() { return (int)(rx_len - rx_pos); }
int FakeSerial::read() { return rx_pos < rx_len ? rx[rx_pos++] : -1; }
size_t FakeSerial::write(uint8_t b) { return write(&b, 1); }
size_t FakeSerial::write(const uint8_t *buf, size_t n)
{
    if (tx_len + n > sizeof tx_log) n = sizeof tx_log - tx_len;
    memcpy(tx_log + tx_len, buf, n);
    tx_len += n;
    return n;
}
int FakeSerial::availableForWrite() { return tx_room; }

/* Moves the encoder by `steps` 4x counts (negative = backwards), one edge at a time. */
static void encoder_move(int steps)
{
    static const uint8_t gray[4] = {0, 1, 3, 2};
    static int phase = 0;
    while (steps != 0) {
        uint8_t before, after;
        before = gray[phase];
        phase = (phase + (steps > 0 ? 1 : 3)) % 4;
        after = gray[phase];
        enc_a = (after >> 1) & 1u;
        enc_b = after & 1u;
        if (((before ^ after) & 2u) && isr_table[0]) isr_table[0]();
        if (((before ^ after) & 1u) && isr_table[1]) isr_table[1]();
        steps += steps > 0 ? -1 : 1;
    }
}

/* ---- host side ------------------------------------------------------------- */

#define MAX_RECS 512
static lsw_record recs[MAX_RECS];
static size_t nrecs = 0;
static lsw_decoder dec;
static size_t tx_decoded = 0;

static void on_record(void *, const lsw_record *r)
{
    if (nrecs < MAX_RECS) recs[nrecs++] = *r;
}

static void pump(void)
{
    lsw_decoder_feed(&dec, tx_log + tx_decoded, tx_len - tx_decoded);
    tx_decoded = tx_len;
}

static void run_for_us(uint64_t us)
{
    uint64_t end = now_us + us;
    while (now_us < end) {
        loop();
        now_us += 20;
    }
    pump();
}

static void host_send(const char *line)
{
    size_t n = strlen(line);
    memcpy(rx + rx_len, line, n);
    rx_len += n;
    run_for_us(5000);
}

static int passed = 0, failed = 0;

static void check(int ok, const char *what)
{
    if (ok) {
        passed++;
    } else {
        failed++;
        printf("FAIL sketch: %s\n", what);
    }
}

static long find_message(size_t from, const char *body)
{
    size_t i;
    for (i = from; i < nrecs; i++) {
        if (recs[i].kind == LSW_REC_MESSAGE && strcmp(recs[i].body, body) == 0) return (long)i;
    }
    return -1;
}

static int has_message(size_t from, const char *body)
{
    return find_message(from, body) >= 0;
}

static int value_index(int32_t v)
{
    int i;
    for (i = 0; i < 8; i++) {
        if (hx_values[i] == v) return i;
    }
    return -1;
}

static size_t count_samples(size_t from, lsw_encoding enc)
{
    size_t i, n = 0;
    for (i = from; i < nrecs; i++) n += recs[i].kind == LSW_REC_SAMPLE && recs[i].encoding == enc;
    return n;
}

int main(void)
{
    size_t mark, i, n;
    int ok;
    char crc_line[64];

    lsw_decoder_init(&dec, LSW_FOLLOW_NONE, on_record, NULL);
    setup();
    run_for_us(20000);
    check(nrecs >= 2 && recs[0].kind == LSW_REC_MESSAGE &&
              strcmp(recs[0].body, "I proto=1 fw=1.0.0 adc=hx711 rate=80 ch=2 cpm=400 motor=0 name=bench-press") == 0,
          "boot sends the identity first");
    check(has_message(0, "T ready"), "boot sends T ready");
    check(count_samples(0, LSW_TEXT) == 0, "no samples before START");

    /* START at 80 samples/s, encoder moving */
    mark = nrecs;
    host_send("START\r\n");
    check(has_message(mark, "A START") && has_message(mark, "T streaming"), "START acknowledged");
    encoder_move(10);
    run_for_us(200000);
    encoder_move(-3);
    run_for_us(200000);
    n = count_samples(mark, LSW_TEXT);
    check(n >= 30 && n <= 34, "80 samples/s: about 32 samples in 0.4 s");
    ok = 1;
    {
        size_t k = 0;
        uint32_t prev_t = 0;
        int32_t prev_load = 0;
        for (i = mark; i < nrecs; i++) {
            const lsw_sample *s;
            if (recs[i].kind != LSW_REC_SAMPLE) continue;
            s = &recs[i].sample;
            if (s->seq != k || value_index(s->load) < 0 || !s->has_pos) ok = 0;
            if (k > 0 && value_index(s->load) != (value_index(prev_load) + 1) % 8) ok = 0;
            prev_load = s->load;
            if (k > 0) {
                uint32_t gap_us = s->time_us - prev_t; /* modulo 2^32: valid across the wrap */
                if (gap_us < 12300u || gap_us > 12700u) ok = 0;
            }
            prev_t = s->time_us;
            k++;
        }
    }
    check(ok, "samples carry consecutive seq, the converter's signed counts and 12.5 ms spacing across the micros() wrap");
    check(recs[nrecs - 1].kind == LSW_REC_SAMPLE && recs[nrecs - 1].sample.pos == 7,
          "position follows the encoder (+10 -3 = 7)");
    check(has_message(mark, "T overrange"), "full-scale code 7FFFFFh reported as T overrange");
    check(dec.counters.dropped == 0 && dec.counters.resyncs == 0 && dec.counters.checksum_errors == 0,
          "host decoder sees no loss");
    check(hx_longest_high_us < 60, "PD_SCK high phase stays under 60 us");
    check(hx_bad_reads == 0, "converter is only clocked when DOUT is low");

    /* commands */
    mark = nrecs;
    host_send("RATE 20\n");
    check(has_message(mark, "N RATE unsupported"), "RATE 20 refused as unsupported");
    host_send("RATE x\n");
    check(has_message(mark, "N RATE bad-arg"), "RATE x refused as bad-arg");
    snprintf(crc_line, sizeof crc_line, "STOP ~%04X\n", (unsigned)(lsw_crc16((const uint8_t *)"STOP", 4) ^ 0x10u));
    host_send(crc_line);
    check(has_message(mark, "N STOP checksum"), "STOP with a wrong CRC refused as checksum");
    host_send("FLY\n");
    check(has_message(mark, "N FLY bad-command"), "unknown command refused as bad-command");
    host_send("PING k7\n");
    check(has_message(mark, "A PING k7"), "PING echoes its token");
    host_send("HALT\n");
    check(has_message(mark, "N HALT no-motor"), "HALT refused: no motor");
    host_send("RATE  80\n");
    check(has_message(mark, "E bad-command"), "malformed line answered E bad-command");

    /* sync light */
    mark = nrecs;
    check(sync_light == 0, "sync light off after power-up");
    host_send("LIGHT on\n");
    check(has_message(mark, "A LIGHT on") && sync_light == 1, "LIGHT on lights the sync LED and is acknowledged");
    host_send("LIGHT off\n");
    check(has_message(mark, "A LIGHT off") && sync_light == 0, "LIGHT off darkens it");
    host_send("LIGHT dim\n");
    check(has_message(mark, "N LIGHT bad-arg") && sync_light == 0, "LIGHT dim refused, the LED left alone");

    /* RATE 10 */
    mark = nrecs;
    snprintf(crc_line, sizeof crc_line, "RATE 10 ~%04X\n", (unsigned)lsw_crc16((const uint8_t *)"RATE 10", 7));
    host_send(crc_line);
    check(has_message(mark, "A RATE 10") && hx_rate_pin == 0, "RATE 10 with a good CRC drives the RATE pin low");
    run_for_us(1400000);
    n = count_samples(mark, LSW_TEXT);
    check(n >= 9 && n <= 12, "10 samples/s after 400 ms settling: about 10 samples in 1.4 s");
    host_send("WHO\n");
    check(has_message(mark, "I proto=1 fw=1.0.0 adc=hx711 rate=10 ch=2 cpm=400 motor=0 name=bench-press") &&
              has_message(mark, "A WHO"), "WHO answers identity (rate=10) then A WHO");
    host_send("RATE 80\n");

    /* MODE binary */
    mark = nrecs;
    host_send("MODE binary\n");
    {
        long at = find_message(mark, "A MODE binary");
        uint8_t ack[32];
        size_t an = lsw_put_ack(ack, sizeof ack, LSW_TEXT, "MODE", "binary"), k;
        int lead_zero = 0;
        check(at >= 0 && recs[at].encoding == LSW_TEXT, "MODE binary acknowledged in text");
        run_for_us(300000);
        for (k = 0; an > 0 && k + an < tx_len; k++) {
            if (memcmp(tx_log + k, ack, an) == 0) lead_zero = tx_log[k + an] == 0x00;
        }
        check(lead_zero, "first binary frame after the acknowledgement is preceded by 0x00");
    }
    check(count_samples(mark, LSW_BINARY) >= 18, "samples arrive as binary frames after MODE binary");
    check(dec.follow == LSW_FOLLOW_BINARY, "host decoder follows binary");
    host_send("PING b1\n");
    {
        long at = find_message(mark, "A PING b1");
        check(at >= 0 && recs[at].encoding == LSW_BINARY, "acknowledgements come as 0x10 frames in binary mode");
    }

    /* transmit buffer full: samples skipped, E overflow, gap seen by the host */
    mark = nrecs;
    {
        uint32_t before = dec.counters.dropped;
        tx_room = 5;
        run_for_us(50000);
        tx_room = 63;
        run_for_us(50000);
        check(has_message(mark, "E overflow") && dec.counters.dropped > before,
              "a full transmit buffer costs samples, reports E overflow, and the host counts the gap");
    }

    /* converter stops answering */
    mark = nrecs;
    hx_stalled = 1;
    run_for_us(1500000);
    check(has_message(mark, "E adc-timeout"), "no conversion while streaming reports E adc-timeout");
    hx_stalled = 0;

    mark = nrecs;
    host_send("MODE text\n");
    host_send("STOP\n");
    run_for_us(100000);
    check(has_message(mark, "A STOP") && has_message(mark, "T stopped"), "STOP acknowledged");
    {
        size_t after_stop = nrecs;
        run_for_us(200000);
        check(count_samples(after_stop, LSW_TEXT) + count_samples(after_stop, LSW_BINARY) == 0,
              "no samples after STOP");
    }
    check(hx_conversions > 60, "converter was read throughout");
    printf("%d passed, %d failed\n", passed, failed);
    return failed == 0 ? 0 : 1;
}
