package org.loadstone.units;

import static org.assertj.core.api.Assertions.assertThat;

import org.junit.jupiter.api.AfterEach;
import org.junit.jupiter.api.Test;

class SlowWorkTest {
  @AfterEach
  void unguard() {
    SlowWork.unguard();
    SlowWork.clearSeen();
  }

  @Test
  void workOnTheGuardedThreadIsRecordedAndReportedAndOnOtherThreadsNot() throws Exception {
    SlowWork.clearSeen();
    StringBuilder reported = new StringBuilder();
    SlowWork.guard(Thread.currentThread(), reported::append);
    Thread other = new Thread(() -> SlowWork.check("on another thread"));
    other.start();
    other.join();
    SlowWork.check("reading a run");
    assertThat(SlowWork.seen()).containsExactly("reading a run");
    assertThat(reported).hasToString("reading a run");
    SlowWork.unguard();
    SlowWork.check("after the guard");
    assertThat(SlowWork.seen()).containsExactly("reading a run");
  }
}
