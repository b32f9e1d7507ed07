/*
 * arduino_fake.h - just enough of the Arduino API to run loadstone_hx711.ino
 * on the host against a simulated HX711-class converter, encoder and serial
 * port (see sketch_sim.cpp). Host test code only; never part of a device build.
 */
#ifndef ARDUINO_FAKE_H
#define ARDUINO_FAKE_H

#include <stddef.h>
#include <stdint.h>

#define HIGH 1
#define LOW 0
#define INPUT 0
#define OUTPUT 1
#define INPUT_PULLUP 2
#define CHANGE 1

int digitalRead(uint8_t pin);
void digitalWrite(uint8_t pin, uint8_t level);
void pinMode(uint8_t pin, uint8_t mode);
void delayMicroseconds(unsigned int us);
unsigned long micros(void);
unsigned long millis(void);
void noInterrupts(void);
void interrupts(void);
int digitalPinToInterrupt(uint8_t pin);
void attachInterrupt(int irq, void (*isr)(void), int mode);

class FakeSerial {
public:
    void begin(unsigned long baud);
    int available();
    int read();
    size_t write(uint8_t b);
    size_t write(const uint8_t *buf, size_t n);
    int availableForWrite();
};

extern FakeSerial Serial;

#endif
