package org.loadstone.ui;

import java.util.function.Function;
import javafx.util.StringConverter;

/** How a choice box names its values (a test type, a unit) and reads a name back. */
final class Choices {
  private Choices() {}

  /**
   * @param name the value's name as shown; null shows as empty
   * @param parse a shown name back to its value
   */
  static <T> StringConverter<T> named(Function<T, String> name, Function<String, T> parse) {
    return new StringConverter<>() {
      @Override
      public String toString(T t) {
        return t == null ? "" : name.apply(t);
      }

      @Override
      public T fromString(String s) {
        return parse.apply(s);
      }
    };
  }
}
