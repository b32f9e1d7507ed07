package org.loadstone.acquire;

import static org.assertj.core.api.Assertions.assertThat;

import java.nio.file.Path;
import java.time.LocalDate;
import java.util.Optional;
import org.junit.jupiter.api.Test;
import org.loadstone.device.FrameSampleSource;
import org.loadstone.device.SimTransport;
import org.loadstone.protocol.DeviceMessage;
import org.loadstone.sim.SimulatedFrame;

/** A calibration is checked against the cell the connected device reports, before a run. */
class ScaleChoiceDeviceTest {
  static final Path DIR = Path.of(System.getProperty("loadstone.projectDir", "."), "calibration");

  private static Optional<DeviceMessage.Identity> identity(SimulatedFrame frame) {
    String body = SimTransport.identityBody(new FrameSampleSource(frame));
    return DeviceMessage.parse(body).map(m -> (DeviceMessage.Identity) m);
  }

  @Test
  void theSimulatedFrameReportsItsOneCell() {
    DeviceMessage.Identity id = identity(SimulatedFrame.builder().build()).orElseThrow();
    assertThat(id.cellId()).isEqualTo("shelf-rig-1kN");
    assertThat(id.cellCapacity_N()).isEqualTo(1000);
    // 2 mV/V on an HX711 at gain 128 (data sheet, from memory): 2^23·2·128·0.002 / 1000 N
    assertThat(id.cellCountsPerN()).isEqualTo(4294.967296);
  }

  @Test
  void aCalibrationOfAnotherCellIsWarnedAboutFirstAndKeptWithTheRun() {
    ScaleChoice c = ScaleChoice.fromCalibration(
        DIR.resolve("shelf-rig-500N-2026-12-02.json"), LocalDate.of(2027, 1, 10));
    ScaleChoice checked = c.forDevice(identity(SimulatedFrame.builder().build()));
    assertThat(checked.warnings()).hasSize(c.warnings().size() + 3);
    assertThat(checked.warnings().get(0)).contains("made for load cell shelf-rig-500N");
    assertThat(checked.warnings().get(1)).contains("+100 %");
    assertThat(checked.warnings().get(2)).contains("rated 500 N");
    assertThat(checked.warnings()).containsAll(c.warnings());
    assertThat(checked.scale()).isSameAs(c.scale());
  }

  @Test
  void withoutACalibrationOrWithoutAnIdentityNothingIsAdded() {
    ScaleChoice nominal = ScaleChoice.nominal(4294.97, "data sheet", 1000.0);
    assertThat(nominal.forDevice(identity(SimulatedFrame.builder().build())))
        .isSameAs(nominal);
    ScaleChoice c = ScaleChoice.fromCalibration(
        DIR.resolve("shelf-rig-500N-2026-12-02.json"), LocalDate.of(2027, 1, 10));
    assertThat(c.forDevice(Optional.empty())).isSameAs(c);
  }
}
