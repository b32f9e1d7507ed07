package org.loadstone.sim;

import static org.assertj.core.api.Assertions.assertThat;

import java.lang.management.ManagementFactory;
import org.junit.jupiter.api.Assumptions;
import org.junit.jupiter.api.Test;

class AllocationTest {
  private long sum;

  @Test
  void producingSamplesAllocatesNothingPerSample() {
    java.lang.management.ThreadMXBean bean = ManagementFactory.getThreadMXBean();
    Assumptions.assumeTrue(bean instanceof com.sun.management.ThreadMXBean,
        "needs a JVM that counts allocated bytes per thread");
    com.sun.management.ThreadMXBean mx = (com.sun.management.ThreadMXBean) bean;
    SimulatedFrame f = SimulatedFrame.builder().scenario(Scenario.PANEL_BOARD).rateHz(50_000)
        .crossheadRate_mm_per_s(2).seed(3).build();
    SampleSink sink = (seq, us, load, pos) -> sum += seq + us + load + pos;
    SampleBlock block = new SampleBlock(10_000);
    for (int i = 0; i < 200_000; i++) {
      f.next(sink); // warm up
    }
    long id = Thread.currentThread().getId();
    long before = mx.getThreadAllocatedBytes(id);
    for (int i = 0; i < 1_000_000; i++) {
      f.next(sink);
    }
    for (int i = 0; i < 100; i++) {
      f.fill(block, 10_000);
    }
    long allocated = mx.getThreadAllocatedBytes(id) - before;
    // 2 000 000 samples (40 s at 50 000 /s, through failure and crushing); even one 16-byte
    // object per sample would be 32 MB
    assertThat(allocated).isLessThan(64 * 1024);
    assertThat(sum).isNotZero();
  }
}
