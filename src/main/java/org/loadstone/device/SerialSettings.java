package org.loadstone.device;

/**
 * How to open a serial port. Immutable; use {@link #builder()} or a preset.
 *
 * @param baud bits per second (USB CDC boards ignore it)
 * @param resetWaitMs time to wait after opening, for boards that reset when the port opens
 * @param readTimeoutMs longest a read waits for data
 */
public record SerialSettings(int baud, int resetWaitMs, int readTimeoutMs) {
  /** 115 200 baud, no reset wait, 100 ms read timeout. */
  public static final SerialSettings DEFAULT = new SerialSettings(115_200, 0, 100);

  /** For boards that reset when the port opens (many Arduino-style boards): waits 2 s. */
  public static final SerialSettings RESETTING_BOARD = new SerialSettings(115_200, 2000, 100);

  /** The slowest serial speed accepted, baud. */
  public static final int MIN_BAUD = 300;
  /** The fastest serial speed accepted, baud. */
  public static final int MAX_BAUD = 4_000_000;
  /** The longest wait after opening, ms. */
  public static final int MAX_RESET_WAIT_MS = 30_000;

  public SerialSettings {
    if (baud < MIN_BAUD || baud > MAX_BAUD) {
      throw new IllegalArgumentException("baud must be 300…4000000, was " + baud);
    }
    if (resetWaitMs < 0 || resetWaitMs > MAX_RESET_WAIT_MS) {
      throw new IllegalArgumentException("reset wait must be 0…30000 ms, was " + resetWaitMs);
    }
    if (readTimeoutMs < 1 || readTimeoutMs > 10_000) {
      throw new IllegalArgumentException("read timeout must be 1…10000 ms, was " + readTimeoutMs);
    }
  }

  /** @return a builder starting from {@link #DEFAULT} */
  public static Builder builder() {
    return new Builder(DEFAULT);
  }

  /** @return a builder starting from these settings */
  public Builder toBuilder() {
    return new Builder(this);
  }

  /** Builder for {@link SerialSettings}. */
  public static final class Builder {
    private int baud;
    private int resetWaitMs;
    private int readTimeoutMs;

    private Builder(SerialSettings s) {
      baud = s.baud;
      resetWaitMs = s.resetWaitMs;
      readTimeoutMs = s.readTimeoutMs;
    }

    /** @param v bits per second */
    public Builder baud(int v) {
      baud = v;
      return this;
    }

    /** @param v milliseconds to wait after opening */
    public Builder resetWaitMs(int v) {
      resetWaitMs = v;
      return this;
    }

    /** @param v longest a read waits, ms */
    public Builder readTimeoutMs(int v) {
      readTimeoutMs = v;
      return this;
    }

    /** @return the settings, validated */
    public SerialSettings build() {
      return new SerialSettings(baud, resetWaitMs, readTimeoutMs);
    }
  }
}
