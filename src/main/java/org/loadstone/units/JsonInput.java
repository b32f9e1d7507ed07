package org.loadstone.units;

import com.fasterxml.jackson.core.JsonLocation;
import com.fasterxml.jackson.core.JsonProcessingException;
import com.fasterxml.jackson.core.exc.InputCoercionException;
import com.fasterxml.jackson.core.exc.StreamReadException;
import com.fasterxml.jackson.databind.DeserializationFeature;
import com.fasterxml.jackson.databind.JsonMappingException;
import com.fasterxml.jackson.databind.JsonNode;
import com.fasterxml.jackson.databind.ObjectMapper;
import com.fasterxml.jackson.databind.exc.InvalidFormatException;
import com.fasterxml.jackson.databind.exc.MismatchedInputException;
import com.fasterxml.jackson.databind.exc.UnrecognizedPropertyException;
import java.nio.file.Path;
import java.util.Collection;
import java.util.regex.Matcher;
import java.util.regex.Pattern;

/**
 * Reads JSON files the way {@link TextFiles} reads text (UTF-8, byte-order mark skipped) and
 * turns every parser or mapping failure into an {@link InputException} in plain words: the
 * file, line and field, what is wrong and the fix; no parser class or setting names.
 */
public final class JsonInput {
  private static final ObjectMapper TREE = new ObjectMapper()
      .enable(DeserializationFeature.FAIL_ON_TRAILING_TOKENS);
  private static final Pattern MISSING =
      Pattern.compile("Missing (?:required )?creator property '([^']+)'");

  private JsonInput() {}

  /**
   * @param file the file, not null
   * @param what the kind of file for messages, not null
   * @param fix what to do when the content is bad (e.g. "restore it from a backup"), not null
   * @return the file's top-level JSON object
   * @throws InputException when the file cannot be read, is not UTF-8, not JSON or not an object
   */
  public static JsonNode readObject(Path file, String what, String fix) {
    return parseObject(TextFiles.read(file, what), InputException.in(what, file), fix);
  }

  /** As {@link #readObject}, from text already read; {@code where} names it in messages. */
  public static JsonNode parseObject(String text, InputException.Where where, String fix) {
    JsonNode root;
    try {
      root = TREE.readTree(text);
    } catch (JsonProcessingException e) {
      throw translate(e, where, fix);
    }
    if (root == null || root.isMissingNode()) {
      throw where.fault("is empty", fix);
    }
    if (!root.isObject()) {
      throw where.fault("holds " + kindOf(root) + " where one JSON object { … } is expected", fix);
    }
    return root;
  }

  /**
   * Reads {@code file} into {@code type} with {@code mapper} (whose records validate themselves).
   *
   * @throws InputException as {@link #readObject}, and naming the field of a mapping failure
   */
  public static <T> T readValue(ObjectMapper mapper, Path file, Class<T> type, String what,
      String fix) {
    String text = TextFiles.read(file, what);
    InputException.Where where = InputException.in(what, file);
    parseObject(text, where, fix); // refuses null, lists and bare values first
    try {
      T value = mapper.readValue(text, type);
      if (value == null) {
        throw where.fault("holds no JSON object", fix);
      }
      return value;
    } catch (JsonProcessingException e) {
      throw translate(e, where, fix);
    }
  }

  /** @return a parser or mapping failure in plain words, at {@code where} with {@code fix} */
  public static InputException translate(JsonProcessingException e, InputException.Where where,
      String fix) {
    JsonLocation loc = e.getLocation();
    InputException.Where w = !where.hasLine() && loc != null && loc.getLineNr() > 0 ? where.line(loc.getLineNr())
        : where;
    if (e instanceof JsonMappingException m && !(e instanceof StreamReadException)) {
      String field = path(m);
      InputException.Where wf = field.isEmpty() ? w : w.field(field);
      Throwable c = ours(e);
      if (c != null) {
        return wf.fault("is invalid: " + c.getMessage(), fix, e);
      }
      Matcher mm = MISSING.matcher(String.valueOf(m.getOriginalMessage()));
      if (mm.find()) {
        return w.field(field.endsWith(mm.group(1)) ? field
            : (field.isEmpty() ? "" : field + ".") + mm.group(1)).fault("is missing",
            "add the field; " + fix, e);
      }
      if (m instanceof UnrecognizedPropertyException u) {
        return w.field(field).fault("is not a known field",
            "remove it or correct its spelling; " + fix, e);
      }
      if (m instanceof InvalidFormatException f) {
        return wf.fault(InputException.shown(String.valueOf(f.getValue())) + " is not "
            + expected(f.getTargetType()), fix, e);
      }
      if (m instanceof MismatchedInputException mi) {
        return wf.fault("must be " + expected(mi.getTargetType()), fix, e);
      }
      return wf.fault("does not fit the expected layout", fix, e);
    }
    return w.fault("is not valid JSON" + column(loc) + ": " + reason(e), fix, e);
  }

  private static String column(JsonLocation loc) {
    return loc != null && loc.getColumnNr() > 0 ? " (column " + loc.getColumnNr() + ")" : "";
  }

  private static Throwable ours(Throwable e) {
    for (Throwable c = e.getCause(); c != null && c != e; c = c.getCause()) {
      if (c instanceof LoadstoneException || c instanceof IllegalArgumentException) {
        return c;
      }
    }
    return null;
  }

  private static String reason(JsonProcessingException e) {
    String m = String.valueOf(e.getOriginalMessage());
    if (e instanceof InputCoercionException || m.contains("out of range")) {
      return "a number is too large";
    }
    if (m.startsWith("Unexpected end-of-input")) {
      return "the text ends before the JSON is complete (cut short?)";
    }
    if (m.contains("Non-standard token") || m.contains("NaN")) {
      return "NaN and Infinity are not numbers in JSON";
    }
    if (m.startsWith("Unrecognized token")) {
      return "a word that is not JSON (text must be in double quotes)";
    }
    if (m.startsWith("Illegal unquoted character") || m.contains("control character")) {
      return "a control character (such as a line break) inside a text value";
    }
    if (m.startsWith("Duplicate field")) {
      return "a field appears twice";
    }
    if (m.startsWith("Trailing token")) {
      return "more text after the end of the JSON object";
    }
    if (m.startsWith("Unexpected character")) {
      return "an unexpected character";
    }
    return "text that JSON does not allow";
  }

  private static String path(JsonMappingException e) {
    StringBuilder sb = new StringBuilder();
    for (JsonMappingException.Reference r : e.getPath()) {
      if (r.getFieldName() != null) {
        sb.append(sb.length() == 0 ? "" : ".").append(r.getFieldName());
      } else if (r.getIndex() >= 0) {
        sb.append('[').append(r.getIndex()).append(']');
      }
    }
    return sb.toString();
  }

  private static String expected(Class<?> t) {
    if (t == null) {
      return "another kind of value";
    }
    if (t == double.class || t == float.class || t == Double.class || t == Float.class) {
      return "a number";
    }
    if (t == int.class || t == long.class || t == Integer.class || t == Long.class
        || t == short.class || t == Short.class) {
      return "a whole number";
    }
    if (t == boolean.class || t == Boolean.class) {
      return "true or false";
    }
    if (CharSequence.class.isAssignableFrom(t) || t.isEnum()
        || t.getName().startsWith("java.time.")) {
      return "text in double quotes";
    }
    if (t.isArray() || Collection.class.isAssignableFrom(t)) {
      return "a list [ … ]";
    }
    return "an object { … }";
  }

  /** @return "a number", "a list", … for a node in a message */
  public static String kindOf(JsonNode n) {
    if (n == null || n.isNull() || n.isMissingNode()) {
      return "null";
    }
    if (n.isNumber()) {
      return "a number";
    }
    if (n.isTextual()) {
      return "text";
    }
    if (n.isBoolean()) {
      return "true or false";
    }
    if (n.isArray()) {
      return "a list";
    }
    return n.isObject() ? "an object" : "a value";
  }
}
