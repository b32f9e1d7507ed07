package org.loadstone.ui;

import java.util.function.Consumer;
import javafx.geometry.Pos;
import javafx.scene.control.Button;
import javafx.scene.control.Label;
import javafx.scene.layout.HBox;
import javafx.scene.layout.Priority;
import javafx.scene.layout.Region;

/** The safety cautions across the live window until "I understand" is pressed. */
final class SafetyBanner {
  private SafetyBanner() {}

  /**
   * @param notice the cautions and where their acknowledgement is kept
   * @param acknowledged told the banner once acknowledged (to take it away and give the keyboard
   *     back to the window)
   */
  static HBox of(SafetyNotice notice, Consumer<HBox> acknowledged) {
    Label text = LivePane.label("safety-text", "Safety.  " + SafetyNotice.TEXT);
    text.setWrapText(true);
    HBox.setHgrow(text, Priority.ALWAYS);
    Button ok = new Button("I understand");
    ok.setId("safety-ack");
    ok.setMinWidth(Region.USE_PREF_SIZE);
    HBox banner = new HBox(14, text, ok);
    banner.setId("safety-banner");
    banner.getStyleClass().add("safety-banner");
    banner.setAlignment(Pos.CENTER_LEFT);
    ok.setOnAction(e -> {
      notice.acknowledge();
      acknowledged.accept(banner);
    });
    return banner;
  }
}
