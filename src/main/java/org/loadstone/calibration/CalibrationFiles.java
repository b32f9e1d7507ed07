package org.loadstone.calibration;

import com.fasterxml.jackson.core.JsonProcessingException;
import com.fasterxml.jackson.databind.DeserializationFeature;
import com.fasterxml.jackson.databind.JsonMappingException;
import com.fasterxml.jackson.databind.JsonNode;
import com.fasterxml.jackson.databind.ObjectMapper;
import com.fasterxml.jackson.databind.SerializationFeature;
import com.fasterxml.jackson.databind.node.ArrayNode;
import com.fasterxml.jackson.databind.node.ObjectNode;
import java.io.IOException;
import java.nio.charset.StandardCharsets;
import java.nio.file.Files;
import java.nio.file.NoSuchFileException;
import java.nio.file.Path;
import java.security.MessageDigest;
import java.security.NoSuchAlgorithmException;
import java.util.ArrayList;
import java.util.HexFormat;
import java.util.List;
import java.util.regex.Matcher;
import java.util.regex.Pattern;
import org.loadstone.files.FileExistsException;
import org.loadstone.files.FilePublisher;
import org.loadstone.units.LoadstoneException;
import org.loadstone.units.Precondition;

/**
 * Reads and writes load-cell profiles and calibration documents as JSON.
 *
 * <p>A document is saved as {@code <dir>/<id>.json}. Saving goes through {@link
 * FilePublisher}, so a file is complete when it appears and never replaces another. The content hash is SHA-256 over the
 * canonical JSON of the document without its {@code content_sha256} field: object keys sorted,
 * no white space, numbers as Java prints doubles.
 */
public final class CalibrationFiles {
  static final ObjectMapper MAPPER = new ObjectMapper()
      .enable(DeserializationFeature.FAIL_ON_MISSING_CREATOR_PROPERTIES)
      .enable(DeserializationFeature.FAIL_ON_NULL_FOR_PRIMITIVES)
      .enable(DeserializationFeature.FAIL_ON_TRAILING_TOKENS)
      .enable(SerializationFeature.INDENT_OUTPUT);
  private static final ObjectMapper COMPACT = new ObjectMapper();
  static final ObjectMapper COMPACT_LINE = new ObjectMapper();
  private static final String HASH_FIELD = "content_sha256";
  private static final Pattern MISSING =
      Pattern.compile("Missing (?:required )?creator property '([^']+)'");

  private CalibrationFiles() {}

  /**
   * @param file a calibration JSON file
   * @return the document, validated (the hash is not checked here: see {@link CalibrationStatus})
   * @throws LoadstoneException naming the file and the field when missing, unreadable or invalid
   */
  public static CalibrationDocument readCalibration(Path file) {
    return read(file, CalibrationDocument.class, "calibration file");
  }

  /**
   * @param file a load-cell profile JSON file
   * @throws LoadstoneException naming the file and the field when missing, unreadable or invalid
   */
  public static LoadCellProfile readProfile(Path file) {
    return read(file, LoadCellProfile.class, "load-cell profile");
  }

  /**
   * Saves {@code doc} (with its hash recomputed) as {@code <dir>/<id>.json}.
   *
   * @param dir existing folder
   * @return the file written
   * @throws LoadstoneException when the file exists (suggesting a free id) or cannot be written
   */
  public static Path saveCalibration(Path dir, CalibrationDocument doc) {
    Precondition.notNull(doc, "doc");
    return save(dir, doc.id(), doc.withHash());
  }

  /**
   * Saves {@code profile} as {@code <dir>/<id>.json}.
   *
   * @throws LoadstoneException when the file exists (suggesting a free id) or cannot be written
   */
  public static Path saveProfile(Path dir, LoadCellProfile profile) {
    Precondition.notNull(profile, "profile");
    return save(dir, profile.id(), profile);
  }

  /** @return the file name a document with {@code id} is saved under in {@code dir} */
  public static Path fileFor(Path dir, String id) {
    return dir.resolve(id + ".json");
  }

  /** @return the SHA-256 (lower-case hex) of the canonical JSON of {@code doc} without its hash */
  public static String contentSha256(CalibrationDocument doc) {
    JsonNode tree = MAPPER.valueToTree(doc);
    ((ObjectNode) tree).remove(HASH_FIELD);
    try {
      byte[] bytes = COMPACT.writeValueAsBytes(canonical(tree));
      return HexFormat.of().formatHex(MessageDigest.getInstance("SHA-256").digest(bytes));
    } catch (JsonProcessingException | NoSuchAlgorithmException e) {
      throw new IllegalStateException("cannot hash calibration " + doc.id(), e);
    }
  }

  private static JsonNode canonical(JsonNode n) {
    if (n.isObject()) {
      ObjectNode out = COMPACT.createObjectNode();
      List<String> names = new ArrayList<>();
      n.fieldNames().forEachRemaining(names::add);
      names.sort(null);
      for (String k : names) {
        out.set(k, canonical(n.get(k)));
      }
      return out;
    }
    if (n.isArray()) {
      ArrayNode out = COMPACT.createArrayNode();
      n.forEach(e -> out.add(canonical(e)));
      return out;
    }
    return n;
  }

  static <T> T read(Path file, Class<T> type, String what) {
    Precondition.notNull(file, "file");
    byte[] bytes;
    try {
      bytes = Files.readAllBytes(file);
    } catch (NoSuchFileException e) {
      throw new LoadstoneException(what + " " + file + " does not exist: check the path or id");
    } catch (IOException e) {
      throw new LoadstoneException(what + " " + file + " cannot be read: " + e.getMessage(), e);
    }
    try {
      return MAPPER.readValue(bytes, type);
    } catch (JsonMappingException e) {
      String f = field(e);
      String r = reason(e);
      String where = f.isEmpty() ? "" : "field '" + f + "': ";
      if (f.isEmpty() && !r.startsWith("field")) {
        where = "field '(top level)': ";
      }
      throw new LoadstoneException(what + " " + file + ": " + where + r
          + "; correct the file or recalibrate", e);
    } catch (IOException e) {
      String loc = e instanceof JsonProcessingException j && j.getLocation() != null
          ? " at line " + j.getLocation().getLineNr() + ", column " + j.getLocation().getColumnNr()
          : "";
      throw new LoadstoneException(what + " " + file + " is not valid JSON" + loc
          + ": correct the file or recalibrate", e);
    }
  }

  private static String field(JsonMappingException e) {
    StringBuilder sb = new StringBuilder();
    for (JsonMappingException.Reference r : e.getPath()) {
      if (r.getFieldName() != null) {
        sb.append(sb.length() == 0 ? "" : ".").append(r.getFieldName());
      } else if (r.getIndex() >= 0) {
        sb.append('[').append(r.getIndex()).append(']');
      }
    }
    Matcher m = MISSING.matcher(String.valueOf(e.getOriginalMessage()));
    if (m.find() && !sb.toString().endsWith(m.group(1))) {
      sb.append(sb.length() == 0 ? "" : ".").append(m.group(1));
    }
    return sb.toString();
  }

  private static String reason(JsonMappingException e) {
    Throwable c = e.getCause();
    if (c instanceof LoadstoneException || c instanceof IllegalArgumentException) {
      return c.getMessage();
    }
    String m = String.valueOf(e.getOriginalMessage());
    if (MISSING.matcher(m).find()) {
      return "missing: add the field";
    }
    int cut = m.indexOf(" (");
    return cut > 0 ? m.substring(0, cut) : m;
  }

  private static Path save(Path dir, String id, Object value) {
    Precondition.notNull(dir, "dir");
    Path target = fileFor(dir, id);
    byte[] bytes;
    try {
      bytes = (MAPPER.writeValueAsString(value) + "\n").getBytes(StandardCharsets.UTF_8);
    } catch (JsonProcessingException e) {
      throw new IllegalStateException("cannot serialise " + target, e);
    }
    try {
      return FilePublisher.publish(target, "calibration file", bytes);
    } catch (FileExistsException e) {
      throw new LoadstoneException("file " + target + " exists and is never overwritten: save"
          + " under a new id, e.g. '" + freeId(dir, id) + "'");
    }
  }

  /** @return {@code id-2}, {@code id-3}, … whichever is free first */
  static String freeId(Path dir, String id) {
    for (int i = 2; ; i++) {
      String c = id + "-" + i;
      if (!Files.exists(fileFor(dir, c))) {
        return c;
      }
    }
  }
}
