package org.loadstone.device;

import java.io.IOException;
import java.nio.file.Files;
import java.nio.file.Path;
import java.util.concurrent.TimeUnit;
import org.junit.jupiter.api.Assumptions;

/**
 * A pseudo-terminal pair made by socat: bytes written to one end come out of the other, through
 * the kernel's tty layer, so the real jSerialComm path is exercised. Without socat the test is
 * skipped, except under CI where it fails (CI installs socat).
 */
public final class SocatPair implements AutoCloseable {
  private final Process process;
  private final Path dir;
  private final Path a;
  private final Path b;

  private SocatPair(Process process, Path dir) {
    this.process = process;
    this.dir = dir;
    this.a = dir.resolve("ttyA");
    this.b = dir.resolve("ttyB");
  }

  /** Starts socat and waits until both links exist. */
  public static SocatPair start() throws IOException, InterruptedException {
    boolean have = false;
    for (String d : System.getenv().getOrDefault("PATH", "/usr/bin").split(":")) {
      if (Files.isExecutable(Path.of(d, "socat"))) {
        have = true;
      }
    }
    if (!have && "true".equals(System.getenv("CI"))) {
      throw new AssertionError("socat is missing under CI: .ci/run must install it");
    }
    Assumptions.assumeTrue(have, "socat not installed: apt-get install -y socat");
    Path dir = Files.createTempDirectory("loadstone-pty");
    Process p = new ProcessBuilder("socat", "-b", "65536",
        "pty,raw,echo=0,link=" + dir.resolve("ttyA"),
        "pty,raw,echo=0,link=" + dir.resolve("ttyB"))
        .redirectErrorStream(true)
        .redirectOutput(dir.resolve("socat.log").toFile())
        .start();
    SocatPair pair = new SocatPair(p, dir);
    long until = System.nanoTime() + TimeUnit.SECONDS.toNanos(10);
    while (!(Files.exists(pair.a) && Files.exists(pair.b))) {
      if (System.nanoTime() > until || !p.isAlive()) {
        pair.close();
        throw new IOException("socat did not create the pty pair: "
            + Files.readString(dir.resolve("socat.log")));
      }
      Thread.sleep(20);
    }
    return pair;
  }

  /** @return the end a writer uses */
  public Path a() {
    return a;
  }

  /** @return the end the reader under test opens */
  public Path b() {
    return b;
  }

  /** Kills socat, as if the cable were pulled. */
  public void kill() throws InterruptedException {
    process.destroyForcibly();
    process.waitFor(5, TimeUnit.SECONDS);
  }

  @Override
  public void close() throws InterruptedException {
    kill();
    try (var s = Files.list(dir)) {
      s.forEach(f -> f.toFile().delete());
    } catch (IOException ignored) {
      // temp folder
    }
    dir.toFile().delete();
  }
}
